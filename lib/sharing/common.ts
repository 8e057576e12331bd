/// Small helpers shared by the sharing modules: ids, unique-violation detection, the audit
/// entries of sharing events, and the public base URL for links in mails and answers.
import { randomBytes, createHash } from "node:crypto";
import { auditLog } from "@/db/schema";
import type { Executor } from "@/lib/auth/audit";
import { notFound } from "@/lib/http/errors";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(id: string): boolean {
  return UUID.test(id);
}

/// Throws 404 for `what` unless `id` is a UUID (a malformed id names nothing).
export function requireUuid(id: string, what: string): void {
  if (!UUID.test(id)) throw notFound(what);
}

/// True when `error` is PostgreSQL's unique violation (directly or as drizzle's cause).
export function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; cause?: { code?: string } };
  return e?.code === "23505" || e?.cause?.code === "23505";
}

/// 32 random bytes, base64url: the secret part of an invitation or a read-only link.
export function newToken(): string {
  return randomBytes(32).toString("base64url");
}

/// What the database keeps of an invitation token (never the token itself).
export function tokenHash(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/// The origin used in links: NEXTAUTH_URL when set (the public address), else the request's.
export function publicBase(req: Request): string {
  const configured = process.env.NEXTAUTH_URL;
  return (configured ? new URL(configured).origin : new URL(req.url).origin).replace(/\/$/, "");
}

export type SharingEvent =
  | "team_created"
  | "team_role_changed"
  | "team_member_removed"
  | "team_member_left"
  | "invitation_sent"
  | "invitation_revoked"
  | "invitation_accepted"
  | "invitation_refused"
  | "share_created"
  | "share_changed"
  | "share_revoked"
  | "link_published"
  | "link_revoked"
  | "object_imported"
  | "session_imported";

/// One audit entry for a sharing event. `details` holds ids, roles and e-mail addresses;
/// never a token.
export async function auditSharing(
  exec: Executor,
  entry: { event: SharingEvent; userId: string; email?: string | null; address?: string | null; details: Record<string, unknown> },
): Promise<void> {
  await exec.insert(auditLog).values({
    event: entry.event,
    userId: entry.userId,
    email: entry.email ?? null,
    address: entry.address ?? null,
    details: entry.details,
  });
}
