/// The audit log as route handlers use it: write one event with the app's own connection,
/// read the latest entries. Route handlers reach the database only through lib/
/// (DEVELOPERS.md, "Layers"), so these wrap db/ for them.
import { desc } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { recordAudit } from "./audit";

/// Writes one audit event outside any transaction.
export function recordAuditEvent(entry: Parameters<typeof recordAudit>[1]): Promise<void> {
  return recordAudit(db(), entry);
}

/// The newest `limit` audit entries, newest first.
export function latestAuditEntries(limit: number) {
  return db().select().from(auditLog).orderBy(desc(auditLog.id)).limit(limit);
}
