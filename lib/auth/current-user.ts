/// Who is calling: `currentUser()` for pages that adapt, `requireUser()` and
/// `requireSiteRole()` for routes that refuse (HttpError 401/403, see lib/http/errors).
import { eq } from "drizzle-orm";
import { getServerSession } from "next-auth";
import { db } from "@/db/client";
import { users, type SiteRole } from "@/db/schema";
import { forbidden, unauthorized } from "@/lib/http/errors";
import { authOptions } from "./options";
import type { CurrentUser } from "./types";

/// The signed-in user, or null. Reads the user row on every call, so a deleted account, a
/// changed site role or a sign-out elsewhere (the token's session version is no longer the
/// user's) takes effect at once rather than when the JWT expires.
export async function currentUser(): Promise<CurrentUser | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const [row] = await db()
    .select({ id: users.id, email: users.email, displayName: users.displayName, siteRole: users.siteRole, sv: users.sessionVersion })
    .from(users)
    .where(eq(users.id, id));
  if (!row || row.sv !== (session.user.sv ?? 0)) return null;
  const { sv: _version, ...user } = row;
  return user;
}

export async function requireUser(): Promise<CurrentUser> {
  const user = await currentUser();
  if (!user) throw unauthorized();
  return user;
}

export async function requireSiteRole(role: SiteRole): Promise<CurrentUser> {
  const user = await requireUser();
  if (role === "admin" && user.siteRole !== "admin") throw forbidden("This needs the site role admin.");
  return user;
}

/// For routes a published read-only link may read: the signed-in user, or null for a
/// signed-out visitor who carries a link token (the access check then decides); 401 when
/// neither.
export async function requireUserOrLink(linkToken: string | null): Promise<CurrentUser | null> {
  const user = await currentUser();
  if (!user && !linkToken) throw unauthorized();
  return user;
}
