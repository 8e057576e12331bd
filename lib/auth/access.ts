/// Access to Ringside sessions and teams. Every route under /api/sessions/** and /api/teams/**
/// decides through these functions; DEVELOPERS.md documents the rules.
import { timingSafeEqual } from "node:crypto";
import { and, eq, inArray, or } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, sessions, shares, type ShareRole, type TeamRole } from "@/db/schema";
import { forbidden, HttpError, notFound } from "@/lib/http/errors";
import type { CurrentUser } from "./types";

export type SessionRole = "owner" | ShareRole;
export type Need = "read" | "edit";

const RANK: Record<SessionRole, number> = { viewer: 1, editor: 2, owner: 3 };
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type SessionRow = typeof sessions.$inferSelect;

/// The strongest role `user` holds on the session, or null when it may not even read it.
/// `user` is null for a signed-out visitor, who can only hold a link. `linkToken` is the
/// token from a published read-only link, if the request carried one: it grants viewer and
/// nothing else (never the team's access; that is `visibility` alone).
export async function sessionRole(
  user: CurrentUser | null,
  sessionId: string,
  opts: { linkToken?: string | null } = {},
): Promise<{ session: SessionRow; role: SessionRole | null } | null> {
  if (!UUID.test(sessionId)) return null;
  const database = db();
  const [session] = await database.select().from(sessions).where(eq(sessions.id, sessionId));
  if (!session) return null;
  if (user && session.ownerId === user.id) return { session, role: "owner" };

  const grants: SessionRole[] = [];
  if (opts.linkToken && session.shareToken && sameToken(opts.linkToken, session.shareToken)) grants.push("viewer");
  if (user) grants.push(...(await memberGrants(user, session)));
  const role = grants.reduce<SessionRole | null>((best, r) => (best === null || RANK[r] > RANK[best] ? r : best), null);
  return { session, role };
}

/// What a signed-in user holds through the session's team and through shares.
async function memberGrants(user: CurrentUser, session: SessionRow): Promise<SessionRole[]> {
  const database = db();
  const teamRoles = await database
    .select({ teamId: memberships.teamId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, user.id));
  const roleIn = new Map(teamRoles.map((m) => [m.teamId, m.role]));
  const grants: SessionRole[] = [];
  if (session.visibility === "team" && session.teamId && roleIn.has(session.teamId)) {
    grants.push(roleIn.get(session.teamId) === "guest" ? "viewer" : "editor");
  }
  const teamIds = [...roleIn.keys()];
  const shareRows = await database
    .select({ role: shares.role, teamId: shares.teamId })
    .from(shares)
    .where(
      and(
        eq(shares.sessionId, session.id),
        teamIds.length > 0 ? or(eq(shares.userId, user.id), inArray(shares.teamId, teamIds)) : eq(shares.userId, user.id),
      ),
    );
  for (const s of shareRows) {
    // A share to a team never lifts that team's guests above viewer.
    const guest = s.teamId !== null && roleIn.get(s.teamId) === "guest";
    grants.push(guest ? "viewer" : s.role);
  }
  return grants;
}

export async function canRead(user: CurrentUser, sessionId: string, opts: { linkToken?: string | null } = {}): Promise<boolean> {
  return ((await sessionRole(user, sessionId, opts))?.role ?? null) !== null;
}

export async function canEdit(user: CurrentUser, sessionId: string, opts: { linkToken?: string | null } = {}): Promise<boolean> {
  const role = (await sessionRole(user, sessionId, opts))?.role ?? null;
  return role === "owner" || role === "editor";
}

/// Returns the session and the caller's role, or throws: 404 when the session does not
/// exist or the caller may not read it (so private sessions stay invisible), 403 when the
/// caller may read but `need` is "edit".
export async function requireSessionAccess(
  user: CurrentUser | null,
  sessionId: string,
  need: Need,
  opts: { linkToken?: string | null } = {},
): Promise<{ session: SessionRow; role: SessionRole }> {
  const found = await sessionRole(user, sessionId, opts);
  if (!found || found.role === null) throw notFound("The session");
  if (need === "edit" && found.role === "viewer") throw forbidden("You may read this session but not change it.");
  return { session: found.session, role: found.role };
}

/// The caller's role in the team, or throws 403 unless it is one of `allowed`.
export async function requireTeamRole(user: CurrentUser, teamId: string, allowed: readonly TeamRole[]): Promise<TeamRole> {
  if (!UUID.test(teamId)) throw notFound("The team");
  const [m] = await db()
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, user.id)));
  if (!m) throw new HttpError(403, "forbidden", "You are not a member of this team.");
  if (!allowed.includes(m.role)) throw forbidden(`This needs the team role ${allowed.join(" or ")}; you are ${m.role}.`);
  return m.role;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
