/// Renaming and deleting a session: its owner's decisions alone. Readers who are not the
/// owner hear 403, everyone else 404 (a private session stays invisible).
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { sessions } from "@/db/schema";
import { requireSessionAccess } from "@/lib/auth/access";
import type { CurrentUser } from "@/lib/auth/types";
import { forbidden } from "@/lib/http/errors";
import { detailIdsOfSession, pruneDetails } from "./details";

/// With the session's link token a link holder is known to read it: 403, not 404.
async function requireOwner(user: CurrentUser, sessionId: string, what: string, linkToken?: string | null) {
  const { session, role } = await requireSessionAccess(user, sessionId, "read", { linkToken });
  if (role !== "owner") throw forbidden(`Only the session's owner may ${what} it.`);
  return session;
}

export async function renameSession(user: CurrentUser, sessionId: string, title: string, linkToken?: string | null) {
  await requireOwner(user, sessionId, "rename", linkToken);
  // A title the owner chose is never replaced by the first definition.
  const [row] = await db()
    .update(sessions)
    .set({ title, autoTitle: false, updatedAt: new Date() })
    .where(eq(sessions.id, sessionId))
    .returning();
  return row!;
}

/// Deletes the session with its cells, named objects and shares (foreign keys cascade), then
/// the detail files of its large values that nothing else holds (details.ts).
export async function deleteSession(user: CurrentUser, sessionId: string, linkToken?: string | null): Promise<void> {
  await requireOwner(user, sessionId, "delete", linkToken);
  const details = await db().transaction(async (tx) => {
    const ids = await detailIdsOfSession(sessionId, tx);
    await tx.delete(sessions).where(eq(sessions.id, sessionId));
    return ids;
  });
  await pruneDetails(details);
}
