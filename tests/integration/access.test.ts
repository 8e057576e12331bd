/// The role helper's decisions for every kind of caller, on the real test database.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { sessions, shares } from "@/db/schema";
import { canEdit, canRead, requireSessionAccess, requireTeamRole, sessionRole } from "@/lib/auth/access";
import { HttpError } from "@/lib/http/errors";
import { ensureTestGroup, type TestGroup } from "../helpers/fixtures";

let group: TestGroup;
const ids: Record<"priv" | "team" | "link", string> = { priv: "", team: "", link: "" };
const TOKEN = `link-${Math.random().toString(36).slice(2)}`;

beforeAll(async () => {
  group = await ensureTestGroup();
  const owner = group.users.lead.id;
  const rows = await db()
    .insert(sessions)
    .values([
      { title: "private", ownerId: owner, teamId: group.teamId, visibility: "private" },
      { title: "team", ownerId: owner, teamId: group.teamId, visibility: "team" },
      // a private session of the team with a published link
      { title: "link", ownerId: owner, teamId: group.teamId, visibility: "private", shareToken: TOKEN },
    ])
    .returning({ id: sessions.id, title: sessions.title });
  for (const r of rows) ids[r.title === "private" ? "priv" : (r.title as "team" | "link")] = r.id;
});
afterAll(() => closeDb());

async function status(p: Promise<unknown>): Promise<number | "ok"> {
  try {
    await p;
    return "ok";
  } catch (error) {
    if (error instanceof HttpError) return error.status;
    throw error;
  }
}

describe("session access", () => {
  it("gives the owner everything and hides a private session from the team", async () => {
    const { lead, member, guest, admin, outsider } = group.users;
    expect((await sessionRole(lead, ids.priv))?.role).toBe("owner");
    for (const u of [member, guest, admin, outsider]) expect(await canRead(u, ids.priv)).toBe(false);
    expect(await status(requireSessionAccess(member, ids.priv, "read"))).toBe(404);
  });

  it("lets team members edit a team session, team guests only read it, outsiders nothing", async () => {
    const { member, guest, outsider, admin } = group.users;
    expect(await canEdit(member, ids.team)).toBe(true);
    expect(await canRead(guest, ids.team)).toBe(true);
    expect(await canEdit(guest, ids.team)).toBe(false);
    expect(await status(requireSessionAccess(guest, ids.team, "edit"))).toBe(403);
    expect(await status(requireSessionAccess(guest, ids.team, "read"))).toBe("ok");
    expect(await status(requireSessionAccess(outsider, ids.team, "read"))).toBe(404);
    expect(await canRead(admin, ids.team)).toBe(false);
  });

  it("lets anyone with the link token read a link session, and nobody with a wrong token", async () => {
    const { outsider } = group.users;
    expect(await canRead(outsider, ids.link)).toBe(false);
    expect(await canRead(outsider, ids.link, { linkToken: TOKEN })).toBe(true);
    expect(await canEdit(outsider, ids.link, { linkToken: TOKEN })).toBe(false);
    expect(await canRead(outsider, ids.link, { linkToken: `${TOKEN}x` })).toBe(false);
  });

  it("lets a signed-out visitor read with the link token and nothing else", async () => {
    expect((await sessionRole(null, ids.link, { linkToken: TOKEN }))?.role).toBe("viewer");
    expect((await sessionRole(null, ids.link))?.role).toBeNull();
    expect((await sessionRole(null, ids.team))?.role).toBeNull();
    expect(await status(requireSessionAccess(null, ids.link, "edit", { linkToken: TOKEN }))).toBe(403);
    expect(await status(requireSessionAccess(null, ids.link, "read", { linkToken: `${TOKEN}x` }))).toBe(404);
  });

  it("does not open a private team session to the team when a link is published", async () => {
    const { member, guest } = group.users;
    // issue 8: a link grants read to link holders only, never to the session's team
    expect(await canRead(member, ids.link)).toBe(false);
    expect(await canRead(guest, ids.link)).toBe(false);
    expect(await status(requireSessionAccess(member, ids.link, "read"))).toBe(404);
    // a team member who holds the link reads it as a viewer, not as an editor
    expect((await sessionRole(member, ids.link, { linkToken: TOKEN }))?.role).toBe("viewer");
    // and a team-visible session that also has a link keeps the team's own roles
    await db()
      .update(sessions)
      .set({ shareToken: `${TOKEN}-team` })
      .where(eq(sessions.id, ids.team));
    expect(await canEdit(member, ids.team)).toBe(true);
    expect((await sessionRole(guest, ids.team, { linkToken: `${TOKEN}-team` }))?.role).toBe("viewer");
  });

  it("applies explicit shares, capping team guests at viewer", async () => {
    const { outsider, guest, lead } = group.users;
    const [s] = await db().insert(sessions).values({ title: "shared", ownerId: lead.id }).returning();
    await db()
      .insert(shares)
      .values([
        { sessionId: s!.id, userId: outsider.id, role: "editor" },
        { sessionId: s!.id, teamId: group.teamId, role: "editor" },
      ]);
    expect(await canEdit(outsider, s!.id)).toBe(true);
    expect(await canEdit(group.users.member, s!.id)).toBe(true);
    expect(await canRead(guest, s!.id)).toBe(true);
    expect(await canEdit(guest, s!.id)).toBe(false);
  });

  it("answers 404 for a session id that is not a UUID or does not exist", async () => {
    expect(await status(requireSessionAccess(group.users.lead, "not-a-uuid", "read"))).toBe(404);
    expect(await status(requireSessionAccess(group.users.lead, "00000000-0000-4000-8000-000000000000", "read"))).toBe(404);
  });
});

describe("team roles", () => {
  it("admits the roles asked for and refuses the others with 403", async () => {
    const { lead, member, guest, outsider, admin } = group.users;
    expect(await requireTeamRole(lead, group.teamId, ["lead"])).toBe("lead");
    expect(await status(requireTeamRole(member, group.teamId, ["lead"]))).toBe(403);
    expect(await requireTeamRole(member, group.teamId, ["lead", "member"])).toBe("member");
    expect(await status(requireTeamRole(guest, group.teamId, ["lead", "member"]))).toBe(403);
    expect(await status(requireTeamRole(outsider, group.teamId, ["guest", "member", "lead"]))).toBe(403);
    expect(await status(requireTeamRole(admin, group.teamId, ["lead"]))).toBe(403);
  });
});
