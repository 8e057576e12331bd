/// E-mailed team invitations. The token is 32 random bytes (base64url) sent only in the
/// mail; the database keeps its SHA-256. A token is single-use, expires, and can be
/// revoked; a newer invitation to the same address replaces the pending one.
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitations, memberships, sessions, teams, users, type TeamRole } from "@/db/schema";
import { requireTeamRole } from "@/lib/auth/access";
import type { CurrentUser } from "@/lib/auth/types";
import { HttpError, notFound } from "@/lib/http/errors";
import { limitValue } from "@/lib/limits";
import { sendMail } from "@/lib/mail/send";
import { PLACEHOLDER_TITLE } from "@/lib/sessions/store";
import { auditSharing, newToken, requireUuid, tokenHash } from "./common";

/// Lifetime of an invitation: the limit `invitationHours` (RINGSIDE_INVITATION_TTL_HOURS).
export function invitationLifetimeMs(): number {
  return limitValue("invitationHours") * 3600_000;
}

export async function createInvitation(
  user: CurrentUser,
  teamId: string,
  input: { email: string; role: Exclude<TeamRole, "lead"> },
  base: string,
  address: string,
) {
  await requireTeamRole(user, teamId, ["lead"]);
  const email = input.email.toLowerCase();
  const database = db();
  const [already] = await database
    .select({ role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, teamId), eq(users.email, email)));
  if (already) throw new HttpError(409, "already_member", `${email} is already in this team (as ${already.role}).`);
  const [team] = await database.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId));
  if (!team) throw notFound("The team");

  const token = newToken();
  const expiresAt = new Date(Date.now() + invitationLifetimeMs());
  const invitation = await database.transaction(async (tx) => {
    const replaced = await tx
      .update(invitations)
      .set({ status: "revoked" })
      .where(and(eq(invitations.teamId, teamId), eq(invitations.email, email), eq(invitations.status, "pending")))
      .returning({ id: invitations.id });
    const [row] = await tx
      .insert(invitations)
      .values({ teamId, email, role: input.role, tokenHash: tokenHash(token), invitedBy: user.id, expiresAt })
      .returning();
    await auditSharing(tx, {
      event: "invitation_sent",
      userId: user.id,
      email: user.email,
      address,
      details: { teamId, invitationId: row!.id, invitee: email, role: input.role, replaced: replaced.map((r) => r.id) },
    });
    return row!;
  });

  const link = `${base}/invitations/${token}`;
  try {
    await sendMail({
      to: email,
      subject: `${user.displayName} invites you to ${team.name} on Ringside`,
      text:
        `Hello,\n\n${user.displayName} invites you to join the team "${team.name}" on Ringside as ${input.role}.\n\n` +
        `Open this link, signed in with this e-mail address (or sign up with it first), to accept:\n\n${link}\n\n` +
        `The link works once and expires on ${expiresAt.toUTCString()}.\n\nRingside\n`,
    });
  } catch (error) {
    // The mail did not go out: the invitation must not stay usable unseen.
    await database.update(invitations).set({ status: "revoked" }).where(eq(invitations.id, invitation.id));
    console.error(`[ringside] invitation mail failed: ${(error as Error).message}`);
    throw new HttpError(502, "mail_failed", "The invitation mail could not be sent; nothing was created. Try again later.");
  }
  return invitationView(invitation);
}

function invitationView(row: typeof invitations.$inferSelect) {
  return {
    id: row.id,
    teamId: row.teamId,
    email: row.email,
    role: row.role,
    status: row.status,
    expiresAt: row.expiresAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
  };
}

export async function listInvitations(user: CurrentUser, teamId: string) {
  await requireTeamRole(user, teamId, ["lead"]);
  const rows = await db()
    .select()
    .from(invitations)
    .where(eq(invitations.teamId, teamId))
    .orderBy(sql`${invitations.createdAt} DESC`);
  return rows.map((r) => invitationView({ ...r, status: r.status === "pending" && r.expiresAt <= new Date() ? "expired" : r.status }));
}

export async function revokeInvitation(user: CurrentUser, teamId: string, invitationId: string, address: string) {
  await requireTeamRole(user, teamId, ["lead"]);
  requireUuid(invitationId, "The invitation");
  return db().transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId)))
      .for("update");
    if (!row) throw notFound("The invitation");
    if (row.status !== "pending") throw new HttpError(409, `invitation_${row.status}`, `The invitation is already ${row.status}.`);
    await tx.update(invitations).set({ status: "revoked" }).where(eq(invitations.id, row.id));
    await auditSharing(tx, {
      event: "invitation_revoked",
      userId: user.id,
      email: user.email,
      address,
      details: { teamId, invitationId, invitee: row.email },
    });
    return invitationView({ ...row, status: "revoked" });
  });
}

const TOKEN_SHAPE = /^[A-Za-z0-9_-]{20,100}$/;

function refusal(status: string): HttpError {
  switch (status) {
    case "accepted":
      return new HttpError(410, "invitation_used", "This invitation has already been used.");
    case "revoked":
      return new HttpError(410, "invitation_revoked", "This invitation was withdrawn by the team's lead.");
    default:
      return new HttpError(410, "invitation_expired", "This invitation has expired; ask the team's lead for a new one.");
  }
}

/// What the accept page shows before the invitee accepts: the team, the role, the address.
export async function inspectInvitation(token: string) {
  if (!TOKEN_SHAPE.test(token)) throw notFound("The invitation");
  const [row] = await db()
    .select({ inv: invitations, teamName: teams.name, inviter: users.displayName })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash(token)));
  if (!row) throw notFound("The invitation");
  const expired = row.inv.status === "pending" && row.inv.expiresAt <= new Date();
  return {
    invitation: {
      teamId: row.inv.teamId,
      teamName: row.teamName,
      invitedBy: row.inviter,
      email: row.inv.email,
      role: row.inv.role,
      status: expired ? "expired" : row.inv.status,
      expiresAt: row.inv.expiresAt.toISOString(),
    },
  };
}

/// Makes the signed-in invitee a member (or guest) of the team and gives the session they
/// land in: always one of their own (their latest, or a new one named by its first
/// definition), never the lead's, so their first cells cannot change the team's work.
/// Refuses with 404 (unknown token), 410 (used, revoked, expired) or 403 (signed in with
/// another address, or an address not yet confirmed through the mailed link).
export async function acceptInvitation(user: CurrentUser, token: string, address: string) {
  if (!TOKEN_SHAPE.test(token)) throw notFound("The invitation");
  const [me] = await db().select({ verified: users.emailVerifiedAt }).from(users).where(eq(users.id, user.id));
  if (!me?.verified) {
    throw new HttpError(
      403,
      "email_unverified",
      `Confirm that ${user.email} is yours first: open the link in the welcome mail, then accept the invitation again.`,
    );
  }
  const hash = tokenHash(token);
  const outcome = await db().transaction(async (tx) => {
    const [row] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hash)).for("update");
    if (!row) return { error: notFound("The invitation") };
    const base = { teamId: row.teamId, invitationId: row.id, invitee: row.email };
    if (row.status !== "pending") return { error: refusal(row.status), audit: { ...base, reason: row.status } };
    if (row.expiresAt <= new Date()) {
      await tx.update(invitations).set({ status: "expired" }).where(eq(invitations.id, row.id));
      return { error: refusal("expired"), audit: { ...base, reason: "expired" } };
    }
    if (row.email !== user.email) {
      return {
        error: new HttpError(
          403,
          "invitation_wrong_account",
          `This invitation is for ${row.email}; sign in with that address to accept it.`,
        ),
        audit: { ...base, reason: "wrong_account" },
      };
    }
    const [existing] = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.teamId, row.teamId), eq(memberships.userId, user.id)));
    // Someone already in the team keeps their role (an invitation never demotes a lead).
    if (!existing) await tx.insert(memberships).values({ teamId: row.teamId, userId: user.id, role: row.role });
    await tx.update(invitations).set({ status: "accepted", acceptedAt: new Date() }).where(eq(invitations.id, row.id));
    await auditSharing(tx, {
      event: "invitation_accepted",
      userId: user.id,
      email: user.email,
      address,
      details: { ...base, role: row.role },
    });
    const [own] = await tx
      .select({ id: sessions.id })
      .from(sessions)
      .where(eq(sessions.ownerId, user.id))
      .orderBy(sql`${sessions.updatedAt} DESC`)
      .limit(1);
    const sessionId =
      own?.id ?? (await tx.insert(sessions).values({ title: PLACEHOLDER_TITLE, autoTitle: true, ownerId: user.id }).returning())[0]!.id;
    return { result: { teamId: row.teamId, role: existing?.role ?? row.role, sessionId } };
  });
  if ("error" in outcome && outcome.error) {
    if (outcome.audit) {
      await auditSharing(db(), { event: "invitation_refused", userId: user.id, email: user.email, address, details: outcome.audit });
    }
    throw outcome.error;
  }
  return outcome.result!;
}

const INVITATION_PATH = /^\/invitations\/([A-Za-z0-9_-]{20,100})$/;

/// The invitation a sign-in or sign-up page's callback address points at (a signed-out
/// invitee who followed the mail's link), or null: not an invitation's address, or unknown.
export async function invitationBehind(callbackUrl: string) {
  const m = INVITATION_PATH.exec(callbackUrl);
  if (!m) return null;
  try {
    return (await inspectInvitation(m[1]!)).invitation;
  } catch {
    return null;
  }
}
