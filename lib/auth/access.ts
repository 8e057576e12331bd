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
  return { session, role: strongestRole(grants) };
}

/// The strongest of some roles (owner > editor > viewer), null when there is none.
export function strongestRole(roles: readonly (SessionRole | null)[]): SessionRole | null {
  return roles.reduce<SessionRole | null>((best, r) => (r !== null && (best === null || RANK[r] > RANK[best]) ? r : best), null);
}

/// What a signed-in user holds through the session's team and through shares.
async function memberGrants(user: CurrentUser, session: SessionRow): Promise<SessionRole[]> {
  const roleIn = await teamRolesOf(user);
  const grants: SessionRole[] = [];
  if (session.visibility === "team" && session.teamId && roleIn.has(session.teamId)) {
    grants.push(roleIn.get(session.teamId) === "guest" ? "viewer" : "editor");
  }
  grants.push(...(await shareGrants(user, { sessionId: session.id }, roleIn)));
  return grants;
}

/// The user's role in each of their teams, by team id.
async function teamRolesOf(user: CurrentUser): Promise<Map<string, TeamRole>> {
  const rows = await db()
    .select({ teamId: memberships.teamId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, user.id));
  return new Map(rows.map((m) => [m.teamId, m.role]));
}

/// The roles that shares of one session or one named object grant the user, directly or
/// through a team; a share to a team never lifts that team's guests above viewer.
export async function shareGrants(
  user: CurrentUser,
  target: { sessionId: string } | { objectId: string },
  roleIn?: Map<string, TeamRole>,
): Promise<SessionRole[]> {
  const teams = roleIn ?? (await teamRolesOf(user));
  const teamIds = [...teams.keys()];
  const rows = await db()
    .select({ role: shares.role, teamId: shares.teamId })
    .from(shares)
    .where(
      and(
        "sessionId" in target ? eq(shares.sessionId, target.sessionId) : eq(shares.objectId, target.objectId),
        teamIds.length > 0 ? or(eq(shares.userId, user.id), inArray(shares.teamId, teamIds)) : eq(shares.userId, user.id),
      ),
    );
  return rows.map((s) => (s.teamId !== null && teams.get(s.teamId) === "guest" ? "viewer" : s.role));
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
