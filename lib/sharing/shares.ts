/// Sharing a session or a named object with a user (by e-mail) or a team as viewer or
/// editor, and publishing a session as a read-only link. Only the session's owner or a
/// lead of the session's team changes sharing; other readers get 403, non-readers 404.
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, namedObjects, sessions, shares, teams, users, type ShareRole } from "@/db/schema";
import { requireSessionAccess, sessionRole, shareGrants, strongestRole, type SessionRole } from "@/lib/auth/access";
import type { CurrentUser } from "@/lib/auth/types";
import { forbidden, HttpError, notFound } from "@/lib/http/errors";
import { auditSharing, isUniqueViolation, newToken, requireUuid } from "./common";

type SessionRow = typeof sessions.$inferSelect;
type ObjectRow = typeof namedObjects.$inferSelect;
export type Grantee = { email: string } | { teamId: string };

/// Whether the user may change the sharing of `session`: its owner, or a lead of its team.
export async function canManageSharing(user: CurrentUser, session: SessionRow): Promise<boolean> {
  if (session.ownerId === user.id) return true;
  if (!session.teamId) return false;
  const [m] = await db()
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, session.teamId), eq(memberships.userId, user.id)));
  return m?.role === "lead";
}

/// The session, when the user may change its sharing: 404 for those who cannot read it,
/// 403 for readers who are neither its owner nor a lead of its team.
export async function requireSharingManager(user: CurrentUser, sessionId: string, linkToken?: string | null): Promise<SessionRow> {
  const { session } = await requireSessionAccess(user, sessionId, "read", { linkToken });
  if (!(await canManageSharing(user, session))) throw forbidden("Only the session's owner or a lead of its team changes its sharing.");
  return session;
}

async function resolveGrantee(user: CurrentUser, grantee: Grantee, ownerId: string) {
  const database = db();
  if ("email" in grantee) {
    const email = grantee.email.toLowerCase();
    const [target] = await database.select({ id: users.id, name: users.displayName }).from(users).where(eq(users.email, email));
    if (!target) {
      // The console offers to invite the address to one of the caller's teams instead.
      throw new HttpError(404, "no_account", `No Ringside account uses ${email} yet; invite them to one of your teams, then share.`, { email });
    }
    if (target.id === ownerId) throw new HttpError(409, "is_owner", "That is the owner, who has every right already.");
    return { userId: target.id, teamId: null, label: email };
  }
  requireUuid(grantee.teamId, "The team");
  const [team] = await database.select({ id: teams.id, name: teams.name }).from(teams).where(eq(teams.id, grantee.teamId));
  if (!team) throw notFound("The team");
  const [m] = await database
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, team.id), eq(memberships.userId, user.id)));
  if (!m || m.role === "guest") throw forbidden("Share with a team you are a lead or member of.");
  return { userId: null, teamId: team.id, label: team.name };
}

export interface ShareView {
  id: string;
  role: ShareRole;
  grantee: { kind: "user"; userId: string; email: string; name: string } | { kind: "team"; teamId: string; name: string };
  createdAt: string;
}

async function sharesOf(target: { sessionId: string } | { objectId: string }): Promise<ShareView[]> {
  const rows = await db()
    .select({ share: shares, email: users.email, userName: users.displayName, teamName: teams.name })
    .from(shares)
    .leftJoin(users, eq(users.id, shares.userId))
    .leftJoin(teams, eq(teams.id, shares.teamId))
    .where("sessionId" in target ? eq(shares.sessionId, target.sessionId) : eq(shares.objectId, target.objectId))
    .orderBy(shares.createdAt);
  return rows.map(({ share, email, userName, teamName }) => ({
    id: share.id,
    role: share.role,
    grantee: share.userId
      ? { kind: "user" as const, userId: share.userId, email: email ?? "", name: userName ?? "" }
      : { kind: "team" as const, teamId: share.teamId!, name: teamName ?? "" },
    createdAt: share.createdAt.toISOString(),
  }));
}

/// Creates the share, or changes the role of the grantee's existing share. `created` tells which.
async function upsertShare(
  user: CurrentUser,
  target: { sessionId: string } | { objectId: string },
  grantee: Grantee,
  role: ShareRole,
  ownerId: string,
  address: string,
): Promise<{ share: ShareView; created: boolean }> {
  const g = await resolveGrantee(user, grantee, ownerId);
  const targetCol = "sessionId" in target ? shares.sessionId : shares.objectId;
  const targetId = "sessionId" in target ? target.sessionId : target.objectId;
  const granteeCond = g.userId ? eq(shares.userId, g.userId) : eq(shares.teamId, g.teamId!);
  const { id, created } = await db().transaction(async (tx) => {
    const [existing] = await tx.select().from(shares).where(and(eq(targetCol, targetId), granteeCond)).for("update");
    if (existing) {
      if (existing.role !== role) await tx.update(shares).set({ role }).where(eq(shares.id, existing.id));
      await auditSharing(tx, {
        event: "share_changed",
        userId: user.id,
        email: user.email,
        address,
        details: { ...target, shareId: existing.id, grantee: g.label, userId: g.userId, teamId: g.teamId, from: existing.role, to: role },
      });
      return { id: existing.id, created: false };
    }
    try {
      const [row] = await tx
        .insert(shares)
        .values({ ...target, userId: g.userId, teamId: g.teamId, role, createdBy: user.id })
        .returning({ id: shares.id });
      await auditSharing(tx, {
        event: "share_created",
        userId: user.id,
        email: user.email,
        address,
        details: { ...target, shareId: row!.id, grantee: g.label, userId: g.userId, teamId: g.teamId, role },
      });
      return { id: row!.id, created: true };
    } catch (error) {
      if (isUniqueViolation(error)) throw new HttpError(409, "share_conflict", "Someone changed this share at the same moment; try again.");
      throw error;
    }
  });
  const view = (await sharesOf(target)).find((s) => s.id === id)!;
  return { share: view, created };
}

async function deleteShare(
  user: CurrentUser,
  target: { sessionId: string } | { objectId: string },
  shareId: string,
  address: string,
): Promise<void> {
  requireUuid(shareId, "The share");
  const targetCol = "sessionId" in target ? shares.sessionId : shares.objectId;
  const targetId = "sessionId" in target ? target.sessionId : target.objectId;
  await db().transaction(async (tx) => {
    const [row] = await tx.delete(shares).where(and(eq(shares.id, shareId), eq(targetCol, targetId))).returning();
    if (!row) throw notFound("The share");
    await auditSharing(tx, {
      event: "share_revoked",
      userId: user.id,
      email: user.email,
      address,
      details: { ...target, shareId, userId: row.userId, teamId: row.teamId, role: row.role },
    });
  });
}

// ─── sessions ────────────────────────────────────────────────────────────────

/// The read-only link's address while one is published (the token is the link).
export function linkUrl(base: string, session: SessionRow): string | null {
  return session.shareToken
    ? `${base}/?session=${session.id}&link=${encodeURIComponent(session.shareToken)}`
    : null;
}

export async function listSessionShares(user: CurrentUser, sessionId: string, base: string, linkToken?: string | null) {
  const session = await requireSharingManager(user, sessionId, linkToken);
  return { shares: await sharesOf({ sessionId }), link: { url: linkUrl(base, session) }, teamId: session.teamId, visibility: session.visibility };
}

export async function shareSession(user: CurrentUser, sessionId: string, grantee: Grantee, role: ShareRole, address: string, linkToken?: string | null) {
  const session = await requireSharingManager(user, sessionId, linkToken);
  return upsertShare(user, { sessionId }, grantee, role, session.ownerId, address);
}

export async function unshareSession(user: CurrentUser, sessionId: string, shareId: string, address: string, linkToken?: string | null) {
  await requireSharingManager(user, sessionId, linkToken);
  await deleteShare(user, { sessionId }, shareId, address);
}

/// Publishes the session as a read-only link (idempotent: an existing link is returned).
export async function publishLink(user: CurrentUser, sessionId: string, base: string, address: string, linkToken?: string | null) {
  await requireSharingManager(user, sessionId, linkToken);
  return db().transaction(async (tx) => {
    const [session] = await tx.select().from(sessions).where(eq(sessions.id, sessionId)).for("update");
    if (session!.shareToken) return { url: linkUrl(base, session!)!, created: false };
    // Only the token changes: a link never opens the session to its team (visibility).
    const [row] = await tx
      .update(sessions)
      .set({ shareToken: newToken() })
      .where(eq(sessions.id, sessionId))
      .returning();
    await auditSharing(tx, { event: "link_published", userId: user.id, email: user.email, address, details: { sessionId } });
    return { url: linkUrl(base, row!)!, created: true };
  });
}

/// Revokes the link: its token stops working at once. Who else sees the session (its
/// visibility, its shares) is left as it was.
export async function revokeLink(user: CurrentUser, sessionId: string, address: string, linkToken?: string | null) {
  await requireSharingManager(user, sessionId, linkToken);
  return db().transaction(async (tx) => {
    const [session] = await tx.select().from(sessions).where(eq(sessions.id, sessionId)).for("update");
    if (session!.shareToken === null) throw new HttpError(404, "no_link", "This session has no published link.");
    await tx.update(sessions).set({ shareToken: null }).where(eq(sessions.id, sessionId));
    await auditSharing(tx, { event: "link_revoked", userId: user.id, email: user.email, address, details: { sessionId } });
    return { revoked: true };
  });
}

// ─── named objects ───────────────────────────────────────────────────────────

/// The strongest role the user holds on a named object: its session's role (including a
/// link token for that session), or an explicit object share (team guests stay viewers).
export async function objectRole(
  user: CurrentUser | null,
  objectId: string,
  opts: { linkToken?: string | null } = {},
): Promise<{ object: ObjectRow; session: SessionRow; role: SessionRole | null } | null> {
  requireUuid(objectId, "The object");
  const database = db();
  const [object] = await database.select().from(namedObjects).where(eq(namedObjects.id, objectId));
  if (!object) return null;
  const viaSession = await sessionRole(user, object.sessionId, opts);
  if (!viaSession) return null;
  const direct = user ? await shareGrants(user, { objectId }) : [];
  const best = strongestRole([viaSession.role, ...direct]);
  return { object, session: viaSession.session, role: best };
}

export async function requireObjectAccess(user: CurrentUser | null, objectId: string, opts: { linkToken?: string | null } = {}) {
  const found = await objectRole(user, objectId, opts);
  if (!found || found.role === null) throw notFound("The object");
  return { object: found.object, session: found.session, role: found.role };
}

async function requireObjectManager(user: CurrentUser, objectId: string, linkToken?: string | null) {
  const { object, session } = await requireObjectAccess(user, objectId, { linkToken });
  if (!(await canManageSharing(user, session))) throw forbidden("Only the session's owner or a lead of its team shares its objects.");
  return { object, session };
}

export async function listObjectShares(user: CurrentUser, objectId: string, linkToken?: string | null) {
  await requireObjectManager(user, objectId, linkToken);
  return sharesOf({ objectId });
}

export async function shareObject(user: CurrentUser, objectId: string, grantee: Grantee, role: ShareRole, address: string, linkToken?: string | null) {
  const { session } = await requireObjectManager(user, objectId, linkToken);
  return upsertShare(user, { objectId }, grantee, role, session.ownerId, address);
}

export async function unshareObject(user: CurrentUser, objectId: string, shareId: string, address: string, linkToken?: string | null) {
  await requireObjectManager(user, objectId, linkToken);
  await deleteShare(user, { objectId }, shareId, address);
}

/// Objects shared with the user explicitly (to them or one of their teams), for the
/// "import a shared object" list.
export async function listSharedObjects(user: CurrentUser) {
  const rows = await db().execute<{
    id: string;
    name: string;
    type: string;
    value: { text?: string };
    session_id: string;
    session_title: string;
    owner_name: string;
    role: ShareRole;
    updated_at: string;
  }>(sql`
    SELECT o.id, o.name, o.type, o.value, o.session_id, s.title AS session_title, u.display_name AS owner_name, o.updated_at,
      CASE WHEN bool_or(sh.role = 'editor' AND COALESCE(m.role, 'member') <> 'guest') THEN 'editor' ELSE 'viewer' END AS role
    FROM shares sh
    JOIN named_objects o ON o.id = sh.object_id
    JOIN sessions s ON s.id = o.session_id
    JOIN users u ON u.id = s.owner_id
    LEFT JOIN memberships m ON m.team_id = sh.team_id AND m.user_id = ${user.id}
    WHERE sh.object_id IS NOT NULL AND (sh.user_id = ${user.id} OR m.user_id IS NOT NULL) AND s.owner_id <> ${user.id}
    GROUP BY o.id, s.title, u.display_name
    ORDER BY o.updated_at DESC`);
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    type: r.type,
    summary: typeof r.value?.text === "string" ? r.value.text.replace(/\s+/g, " ").slice(0, 80) : "",
    sessionId: r.session_id,
    sessionTitle: r.session_title,
    ownerName: r.owner_name,
    role: r.role,
    updatedAt: new Date(r.updated_at).toISOString(),
  }));
}

/// Copies a readable object into a session the user may edit, recording where it came from.
export async function importObject(
  user: CurrentUser,
  objectId: string,
  input: { sessionId: string; name?: string },
  opts: { linkToken?: string | null; address: string },
) {
  const { object, session } = await requireObjectAccess(user, objectId, { linkToken: opts.linkToken });
  await requireSessionAccess(user, input.sessionId, "edit");
  const name = input.name ?? object.name;
  const [owner] = await db().select({ name: users.displayName }).from(users).where(eq(users.id, session.ownerId));
  const origin = {
    kind: "object",
    objectId: object.id,
    sessionId: session.id,
    sessionTitle: session.title,
    name: object.name,
    ownerName: owner?.name ?? "",
    importedAt: new Date().toISOString(),
  };
  try {
    return await db().transaction(async (tx) => {
      const [row] = await tx
        .insert(namedObjects)
        .values({ sessionId: input.sessionId, ownerId: user.id, name, type: object.type, value: object.value, source: object.source, origin })
        .returning();
      await tx.update(sessions).set({ updatedAt: new Date() }).where(eq(sessions.id, input.sessionId));
      await auditSharing(tx, {
        event: "object_imported",
        userId: user.id,
        email: user.email,
        address: opts.address,
        details: { from: object.id, fromSession: session.id, to: row!.id, toSession: input.sessionId, name },
      });
      return row!;
    });
  } catch (error) {
    if (isUniqueViolation(error)) {
      throw new HttpError(409, "name_taken", `That session already has an object named ${name}; give the copy another name.`);
    }
    throw error;
  }
}

