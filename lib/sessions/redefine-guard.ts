/// In a shared session, binding a name that another person defined replaces their object
/// for everyone. The API refuses such a cell (409 `redefines_others`, with the names and
/// who defined them) unless the request says `redefine: true`; the console asks first.
import { and, eq, inArray, ne } from "drizzle-orm";
import { db } from "@/db/client";
import { namedObjects, users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/types";
import { HttpError } from "@/lib/http/errors";

export interface ForeignName {
  name: string;
  definedBy: string;
}

/// Of `names` (those a cell defines: grammar/defined-names.ts), the session's names that
/// someone else defined.
export async function foreignRedefinitions(user: CurrentUser, sessionId: string, names: readonly string[]): Promise<ForeignName[]> {
  if (names.length === 0) return [];
  const rows = await db()
    .select({ name: namedObjects.name, definedBy: users.displayName })
    .from(namedObjects)
    .innerJoin(users, eq(users.id, namedObjects.ownerId))
    .where(and(eq(namedObjects.sessionId, sessionId), inArray(namedObjects.name, [...names]), ne(namedObjects.ownerId, user.id)));
  return rows.sort((a, b) => a.name.localeCompare(b.name));
}

/// Throws 409 when the cell would replace others' objects and the caller did not confirm.
export async function requireRedefinitionConsent(
  user: CurrentUser,
  sessionId: string,
  names: readonly string[],
  confirmed: boolean,
): Promise<void> {
  if (confirmed) return;
  const foreign = await foreignRedefinitions(user, sessionId, names);
  if (foreign.length === 0) return;
  const list = foreign.map((f) => `${f.name} (defined by ${f.definedBy})`).join(", ");
  throw new HttpError(
    409,
    "redefines_others",
    `This cell would replace ${foreign.length === 1 ? "a name" : "names"} someone else defined: ${list}. ` +
      `Choose another name, or confirm to replace ${foreign.length === 1 ? "it" : "them"} for everyone in this session.`,
    { names: foreign },
  );
}
