/// Writes security-relevant events to the audit log. Callers pass facts only; a password
/// or token must never be part of `details`.
import type { Database } from "@/db/client";
import { auditLog } from "@/db/schema";

export type Executor = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

export type AuditEvent = "signup" | "signup_address_taken" | "signin_success" | "signin_failure" | "signin_rate_limited" | "signout";

export async function recordAudit(
  exec: Executor,
  entry: { event: AuditEvent; userId?: string | null; email?: string | null; address?: string | null; details?: Record<string, unknown> },
): Promise<void> {
  await exec.insert(auditLog).values({
    event: entry.event,
    userId: entry.userId ?? null,
    email: entry.email ?? null,
    address: entry.address ?? null,
    details: entry.details ?? {},
  });
}
