/// Teams and their memberships: creation (the creator becomes its lead), the member list,
/// role changes and removals. A team always keeps at least one lead: the last lead can
/// neither be demoted nor removed nor leave.
import { randomBytes } from "node:crypto";
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitations, memberships, sessions, shares, teams, users, type TeamRole } from "@/db/schema";
import { requireTeamRole } from "@/lib/auth/access";
import type { CurrentUser } from "@/lib/auth/types";
import { HttpError, notFound } from "@/lib/http/errors";
import { auditSharing, isUniqueViolation, requireUuid } from "./common";

export function slugify(name: string): string {
  const s = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48);
  return s || "team";
}

export async function createTeam(user: CurrentUser, input: { name: string; slug?: string; description?: string }, address: string) {
  const wanted = input.slug ?? slugify(input.name);
  for (let attempt = 0; attempt < 4; attempt++) {
    // An explicit slug must be free; a derived one gets a short suffix when taken.
    const slug = attempt === 0 ? wanted : `${wanted}-${randomBytes(3).toString("hex")}`;
    try {
      return await db().transaction(async (tx) => {
        const [team] = await tx
          .insert(teams)
          .values({ slug, name: input.name, description: input.description ?? "", createdBy: user.id })
          .returning();
        await tx.insert(memberships).values({ teamId: team!.id, userId: user.id, role: "lead" });
        await auditSharing(tx, { event: "team_created", userId: user.id, email: user.email, address, details: { teamId: team!.id, slug } });
        return team!;
      });
    } catch (error) {
      if (!isUniqueViolation(error)) throw error;
      if (input.slug) throw new HttpError(409, "slug_taken", `The team address ${input.slug} is taken; choose another.`);
    }
  }
  throw new HttpError(409, "slug_taken", "Could not find a free team address; give one as slug.");
}

/// The teams the user belongs to, with their role.
export async function listTeams(user: CurrentUser) {
  return db()
    .select({ id: teams.id, slug: teams.slug, name: teams.name, description: teams.description, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, user.id))
    .orderBy(asc(teams.name));
}

/// The team with its members, for any member; leads also see pending invitations.
export async function teamDetail(user: CurrentUser, teamId: string) {
  const role = await requireTeamRole(user, teamId, ["lead", "member", "guest"]);
  const database = db();
  const [team] = await database.select().from(teams).where(eq(teams.id, teamId));
  if (!team) throw notFound("The team");
  const members = await database
    .select({ userId: users.id, name: users.displayName, email: users.email, role: memberships.role, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(asc(users.displayName));
  const pending =
    role === "lead"
      ? await database
          .select({
            id: invitations.id,
            email: invitations.email,
            role: invitations.role,
            expiresAt: invitations.expiresAt,
            createdAt: invitations.createdAt,
          })
          .from(invitations)
          .where(and(eq(invitations.teamId, teamId), eq(invitations.status, "pending"), sql`${invitations.expiresAt} > now()`))
          .orderBy(asc(invitations.createdAt))
      : [];
  // Sessions shared with the team (every member reads them, so every member sees the
  // list): those shared with it explicitly, and those made visible to it (visibility
  // "team", which gives members and leads editor and guests viewer; access.ts).
  const explicit = await database
    .select({ id: sessions.id, title: sessions.title, ownerName: users.displayName, role: shares.role, shareId: shares.id })
    .from(shares)
    .innerJoin(sessions, eq(sessions.id, shares.sessionId))
    .innerJoin(users, eq(users.id, sessions.ownerId))
    .where(eq(shares.teamId, teamId));
  const visible = await database
    .select({ id: sessions.id, title: sessions.title, ownerName: users.displayName })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.ownerId))
    .where(and(eq(sessions.teamId, teamId), eq(sessions.visibility, "team")));
  const byId = new Map<
    string,
    { id: string; title: string; ownerName: string; role: "viewer" | "editor"; shareId: string | null; via: "share" | "team visibility" }
  >();
  for (const v of visible) byId.set(v.id, { ...v, role: "editor", shareId: null, via: "team visibility" });
  // An explicit share is listed as such (its id lets a lead revoke it); the stronger role wins.
  for (const e of explicit) {
    const before = byId.get(e.id);
    byId.set(e.id, { ...e, role: before?.role === "editor" ? "editor" : e.role, via: "share" });
  }
  const shared = [...byId.values()]
    // Guests of the team read only, whatever the grant says.
    .map((x) => (role === "guest" ? { ...x, role: "viewer" as const } : x))
    .sort((a, b) => a.title.localeCompare(b.title));
  return {
    sharedSessions: shared,
    team: { id: team.id, slug: team.slug, name: team.name, description: team.description, createdAt: team.createdAt.toISOString() },
    role,
    members: members.map((m) => ({ ...m, since: m.since.toISOString() })),
    invitations: pending.map((i) => ({ ...i, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() })),
  };
}

type Tx = Parameters<Parameters<ReturnType<typeof db>["transaction"]>[0]>[0];

/// Locks the team's memberships and returns them (so two concurrent demotions cannot both
/// pass the last-lead check).
async function lockMembers(tx: Tx, teamId: string): Promise<Map<string, TeamRole>> {
  const rows = await tx.execute<{ user_id: string; role: TeamRole }>(
    sql`SELECT user_id, role FROM memberships WHERE team_id = ${teamId} FOR UPDATE`,
  );
  return new Map(rows.map((r) => [r.user_id, r.role]));
}

function leadCount(members: Map<string, TeamRole>): number {
  return [...members.values()].filter((r) => r === "lead").length;
}

export async function changeRole(user: CurrentUser, teamId: string, memberId: string, role: TeamRole, address: string) {
  await requireTeamRole(user, teamId, ["lead"]);
  requireUuid(memberId, "The member");
  return db().transaction(async (tx) => {
    const members = await lockMembers(tx, teamId);
    const current = members.get(memberId);
    if (!current) throw notFound("The member");
    if (current === role) return { userId: memberId, role };
    if (current === "lead" && leadCount(members) === 1) {
      throw new HttpError(409, "last_lead", "This is the team's only lead; make another member lead first.");
    }
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, memberId)));
    await auditSharing(tx, {
      event: "team_role_changed",
      userId: user.id,
      email: user.email,
      address,
      details: { teamId, memberId, from: current, to: role },
    });
    return { userId: memberId, role };
  });
}

/// A lead removes a member, or any member removes themselves (leaves).
export async function removeMember(user: CurrentUser, teamId: string, memberId: string, address: string) {
  const self = memberId === user.id;
  await requireTeamRole(user, teamId, self ? ["lead", "member", "guest"] : ["lead"]);
  requireUuid(memberId, "The member");
  return db().transaction(async (tx) => {
    const members = await lockMembers(tx, teamId);
    const current = members.get(memberId);
    if (!current) throw notFound("The member");
    if (current === "lead" && leadCount(members) === 1) {
      throw new HttpError(
        409,
        "last_lead",
        self ? "You are the team's only lead; make another member lead before you leave." : "This is the team's only lead.",
      );
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, memberId)));
    await auditSharing(tx, {
      event: self ? "team_member_left" : "team_member_removed",
      userId: user.id,
      email: user.email,
      address,
      details: { teamId, memberId, role: current },
    });
    return { removed: true };
  });
}
