/// Invitations end to end: the lead invites by e-mail, the message reaches the SMTP sink,
/// its link is accepted once by the matching account and cannot be replayed; an expired
/// or revoked invitation is refused; a second account cannot use someone else's token;
/// the last lead can neither be demoted nor leave. Each step is checked in the audit log.
import { and, desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditLog, invitations, memberships, teams } from "@/db/schema";
import { listMessages } from "@/lib/mail/mailbox";
import { tokenHash } from "@/lib/sharing/common";
import { TEST_ACCOUNTS, ensureTestGroup, uniqueEmail } from "../helpers/fixtures";
import { testEnv } from "../helpers/env";
import { TestClient, testAddress } from "../helpers/http";
import { confirmAddress } from "../helpers/mail";

const lead = new TestClient(testAddress(180));
const wrong = new TestClient(testAddress(181));
let teamId = "";

/// A new account whose address is confirmed through the mailed link (only confirmed
/// accounts may accept invitations; "waits for its confirmation" below checks that).
async function signUp(client: TestClient, email: string, password = "invitee-pass-4412", confirm = true) {
  const r = await client.json("/api/auth/signup", { email, password, name: "Ines Invitee" });
  expect(r.status).toBe(201);
  expect((await client.signIn(email, password)).status).toBe(200);
  if (confirm) await confirmAddress(client, email);
}

/// Waits (bounded) for the sink to have stored a message to `to`, newest first.
async function mailTo(to: string) {
  for (let i = 0; i < 50; i++) {
    const found = (await listMessages(500, testEnv("RINGSIDE_MAIL_DIR"))).find((m) => m.envelopeTo.includes(to) || m.to.includes(to));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} reached the sink`);
}

function tokenFrom(text: string): string {
  const m = /\/invitations\/([A-Za-z0-9_-]+)/.exec(text);
  if (!m) throw new Error("the mail has no invitation link");
  return m[1]!;
}

async function invite(email: string, role: "member" | "guest" = "member") {
  const r = await lead.json(`/api/teams/${teamId}/invitations`, { email, role });
  expect(r.status).toBe(201);
  return ((await r.json()) as { invitation: { id: string } }).invitation;
}

beforeAll(async () => {
  await ensureTestGroup();
  expect((await lead.signIn(TEST_ACCOUNTS.lead.email, TEST_ACCOUNTS.lead.password)).status).toBe(200);
  const created = await lead.json("/api/teams", { name: "Invitation test team" });
  expect(created.status).toBe(201);
  teamId = ((await created.json()) as { team: { id: string } }).team.id;
  await signUp(wrong, uniqueEmail("wrong"));
}, 60_000);
afterAll(async () => {
  await db().delete(teams).where(eq(teams.id, teamId));
  await closeDb();
});

describe("invitations", () => {
  it("reach the sink, work once with the matching account, and cannot be replayed", async () => {
    const email = uniqueEmail("invitee");
    const invitation = await invite(email, "guest");
    const mail = await mailTo(email);
    expect(mail.subject).toMatch(/Invitation test team/);
    const token = tokenFrom(mail.text);
    // only the hash is stored
    const [row] = await db().select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.tokenHash).toBe(tokenHash(token));
    expect(JSON.stringify(row)).not.toContain(token);

    // the link in the mail opens the accept page for a signed-in invitee
    const invitee = new TestClient(testAddress(182));
    await signUp(invitee, email);
    const link = new URL(/https?:\/\/\S+\/invitations\/\S+/.exec(mail.text)![0]);
    const page = await invitee.request(link.pathname);
    expect(page.status).toBe(200);

    // another account may not use it
    const stolen = await wrong.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(stolen.status).toBe(403);
    expect(((await stolen.json()) as { error: { code: string } }).error.code).toBe("invitation_wrong_account");

    const peek = await invitee.request(`/api/invitations/${token}`);
    expect(((await peek.json()) as { invitation: { status: string; role: string } }).invitation).toMatchObject({
      status: "pending",
      role: "guest",
    });

    const accepted = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(accepted.status).toBe(200);
    // the invitee also gets a session of their own to land in (issue 18)
    expect(await accepted.json()).toEqual({ membership: { teamId, role: "guest", sessionId: expect.any(String) } });
    const team = (await (await invitee.request(`/api/teams/${teamId}`)).json()) as { role: string; members: { email: string }[] };
    expect(team.role).toBe("guest");
    expect(team.members.map((m) => m.email)).toContain(email);

    const replay = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(replay.status).toBe(410);
    expect(((await replay.json()) as { error: { code: string } }).error.code).toBe("invitation_used");

    const events = await db().select().from(auditLog).where(eq(auditLog.event, "invitation_accepted")).orderBy(desc(auditLog.id)).limit(5);
    expect(events.some((e) => (e.details as { invitationId?: string }).invitationId === invitation.id)).toBe(true);
    // no audit entry holds the token
    const all = await db().select({ details: auditLog.details }).from(auditLog);
    expect(JSON.stringify(all)).not.toContain(token);
  });

  it("waits for its confirmation: an account whose address is unconfirmed cannot accept", async () => {
    const email = uniqueEmail("unconfirmed");
    await invite(email);
    const token = tokenFrom((await mailTo(email)).text);
    const invitee = new TestClient(testAddress(186));
    await signUp(invitee, email, "invitee-pass-4412", false);
    const early = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(early.status).toBe(403);
    expect(((await early.json()) as { error: { code: string; message: string } }).error).toMatchObject({ code: "email_unverified" });
    await confirmAddress(invitee, email);
    const accepted = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(accepted.status).toBe(200);
  });

  it("refuses an expired invitation", async () => {
    const email = uniqueEmail("late");
    const invitation = await invite(email);
    const token = tokenFrom((await mailTo(email)).text);
    await db()
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, invitation.id));
    const invitee = new TestClient(testAddress(183));
    await signUp(invitee, email);
    const r = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(r.status).toBe(410);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe("invitation_expired");
    const [m] = await db()
      .select()
      .from(memberships)
      .where(and(eq(memberships.teamId, teamId)));
    expect(m).toBeDefined(); // the lead
    const detail = (await (await lead.request(`/api/teams/${teamId}`)).json()) as { members: { email: string }[] };
    expect(detail.members.map((x) => x.email)).not.toContain(email);
  });

  it("refuses a revoked invitation, and a newer invitation replaces the older one", async () => {
    const email = uniqueEmail("revoked");
    const first = await invite(email);
    const firstToken = tokenFrom((await mailTo(email)).text);
    const revoke = await lead.request(`/api/teams/${teamId}/invitations/${first.id}`, { method: "DELETE" });
    expect(revoke.status).toBe(200);
    const again = await lead.request(`/api/teams/${teamId}/invitations/${first.id}`, { method: "DELETE" });
    expect(again.status).toBe(409);
    const invitee = new TestClient(testAddress(184));
    await signUp(invitee, email);
    const r = await invitee.request(`/api/invitations/${firstToken}/accept`, { method: "POST" });
    expect(r.status).toBe(410);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe("invitation_revoked");
    const [audit] = await db().select().from(auditLog).where(eq(auditLog.event, "invitation_revoked")).orderBy(desc(auditLog.id)).limit(1);
    expect((audit!.details as { invitationId: string }).invitationId).toBe(first.id);
  });

  it("refuses unknown tokens and bad bodies with JSON errors", async () => {
    const r = await wrong.request(`/api/invitations/${"A".repeat(43)}/accept`, { method: "POST" });
    expect(r.status).toBe(404);
    const bad = await lead.json(`/api/teams/${teamId}/invitations`, { email: "not an address", role: "member" });
    expect(bad.status).toBe(400);
    const lead2 = await lead.json(`/api/teams/${teamId}/invitations`, { email: uniqueEmail("x"), role: "lead" });
    expect(lead2.status).toBe(400);
    const member = await lead.json(`/api/teams/${teamId}/invitations`, { email: TEST_ACCOUNTS.lead.email, role: "member" });
    expect(member.status).toBe(409);
  });

  it("keeps the last lead: no demotion, no leaving; role changes are audited", async () => {
    const me = (await (await lead.request("/api/me")).json()) as { user: { id: string } };
    const demote = await lead.json(`/api/teams/${teamId}/members/${me.user.id}`, { role: "member" }, "PATCH");
    expect(demote.status).toBe(409);
    expect(((await demote.json()) as { error: { code: string } }).error.code).toBe("last_lead");
    const leave = await lead.request(`/api/teams/${teamId}/members/${me.user.id}`, { method: "DELETE" });
    expect(leave.status).toBe(409);

    // with a second lead, the first may step down
    const email = uniqueEmail("second");
    await invite(email);
    const token = tokenFrom((await mailTo(email)).text);
    const second = new TestClient(testAddress(185));
    await signUp(second, email);
    expect((await second.request(`/api/invitations/${token}/accept`, { method: "POST" })).status).toBe(200);
    const secondId = ((await (await second.request("/api/me")).json()) as { user: { id: string } }).user.id;
    expect((await lead.json(`/api/teams/${teamId}/members/${secondId}`, { role: "lead" }, "PATCH")).status).toBe(200);
    const [audit] = await db().select().from(auditLog).where(eq(auditLog.event, "team_role_changed")).orderBy(desc(auditLog.id)).limit(1);
    expect(audit!.details).toMatchObject({ teamId, memberId: secondId, from: "member", to: "lead" });
    expect((await lead.json(`/api/teams/${teamId}/members/${me.user.id}`, { role: "member" }, "PATCH")).status).toBe(200);
    // now the second is the only lead
    expect((await second.request(`/api/teams/${teamId}/members/${secondId}`, { method: "DELETE" })).status).toBe(409);
  });
});
