/// The server-side rules of issue 18 over HTTP against the production server and the real
/// test database: session rename/delete (owner only), search by title and content, titles
/// from the first definition, the library across sessions, history without duplicates,
/// each cell's author, redefining another person's name only with consent, an invitee
/// landing in a session of their own, the team page listing team-visible sessions, a
/// share to an address without an account saying so, and exports that choose cells.
import { randomBytes } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { sessions, teams, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { ensureTestGroup, TEST_ACCOUNTS, type TestGroup } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { allEvents } from "./ndjson";

const lead = new TestClient(testAddress(230));
const member = new TestClient(testAddress(231));
const outsider = new TestClient(testAddress(232));
const guest = new TestClient(testAddress(233));
const TAG = `daily-${randomBytes(4).toString("hex")}`;
let group: TestGroup;
const made: string[] = [];
const madeUsers: string[] = [];
const madeTeams: string[] = [];

async function newSession(client: TestClient, title?: string): Promise<string> {
  const r = await client.json("/api/sessions", title === undefined ? {} : { title });
  expect(r.status).toBe(201);
  const id = ((await r.json()) as { id: string }).id;
  made.push(id);
  return id;
}

async function run(client: TestClient, sessionId: string, source: string, extra: Record<string, unknown> = {}) {
  const r = await client.json(`/api/sessions/${sessionId}/cells`, { source, ...extra });
  if (r.status !== 200)
    return { status: r.status, body: (await r.json()) as { error: { code: string; message: string; details?: unknown } } };
  const events = await allEvents(r);
  const done = events.at(-1)!;
  expect(done.event).toBe("done");
  return { status: 200, done, events };
}

beforeAll(async () => {
  group = await ensureTestGroup();
  for (const [c, k] of [
    [lead, "lead"],
    [member, "member"],
    [outsider, "outsider"],
    [guest, "guest"],
  ] as const) {
    expect((await c.signIn(TEST_ACCOUNTS[k].email, TEST_ACCOUNTS[k].password)).status).toBe(200);
  }
}, 60_000);

afterAll(async () => {
  if (made.length) await db().delete(sessions).where(inArray(sessions.id, made));
  if (madeTeams.length) await db().delete(teams).where(inArray(teams.id, madeTeams));
  if (madeUsers.length) await db().delete(users).where(inArray(users.id, madeUsers));
  await closeDb();
});

describe("sessions: rename, delete, search, default titles", () => {
  it("renames and deletes for the owner only; readers hear 403, others 404", async () => {
    const id = await newSession(member, `${TAG} rename me`);
    await db().update(sessions).set({ teamId: group.teamId, visibility: "team" }).where(eq(sessions.id, id));
    expect((await member.json(`/api/sessions/${id}`, { title: `${TAG} renamed` }, "PATCH")).status).toBe(200);
    expect(((await (await member.request(`/api/sessions/${id}`)).json()) as { session: { title: string } }).session.title).toBe(
      `${TAG} renamed`,
    );
    // the lead may edit the team's session but not rename or delete someone else's
    expect((await lead.json(`/api/sessions/${id}`, { title: "taken over" }, "PATCH")).status).toBe(403);
    expect((await lead.request(`/api/sessions/${id}`, { method: "DELETE" })).status).toBe(403);
    expect((await outsider.request(`/api/sessions/${id}`, { method: "DELETE" })).status).toBe(404);
    expect((await member.json(`/api/sessions/${id}`, { title: "  " }, "PATCH")).status).toBe(400);
    expect((await member.request(`/api/sessions/${id}`, { method: "DELETE" })).status).toBe(200);
    expect((await member.request(`/api/sessions/${id}`)).status).toBe(404);
    const [gone] = await db().select().from(sessions).where(eq(sessions.id, id));
    expect(gone).toBeUndefined();
  });

  it("names a session created without a title by its first definition, once", async () => {
    const id = await newSession(member);
    const before = (await (await member.request(`/api/sessions/${id}`)).json()) as { session: { title: string } };
    expect(before.session.title).toBe("New session");
    const first = await run(member, id, `1 + 1\nS := Q[x, y, z]`);
    expect(first.status).toBe(200);
    const after = (await (await member.request(`/api/sessions/${id}`)).json()) as { session: { title: string } };
    expect(after.session.title).toBe("S := Q[x, y, z]");
    await run(member, id, "T := Q[a]");
    const still = (await (await member.request(`/api/sessions/${id}`)).json()) as { session: { title: string } };
    expect(still.session.title).toBe("S := Q[x, y, z]");
  });

  it("searches titles and content (cell sources, object names), only among readable sessions", async () => {
    const id = await newSession(member, `${TAG} search target`);
    await run(member, id, `${TAG.replace("-", "_")}_ideal := 42`);
    const byTitle = (await (await member.request(`/api/sessions?q=${encodeURIComponent(`${TAG} search`)}`)).json()) as {
      sessions: { id: string; match: string | null }[];
    };
    expect(byTitle.sessions.map((s) => s.id)).toEqual([id]);
    expect(byTitle.sessions[0]!.match).toBeNull();
    const byContent = (await (await member.request(`/api/sessions?q=${encodeURIComponent(`${TAG.replace("-", "_")}_ideal`)}`)).json()) as {
      sessions: { id: string; match: string | null }[];
    };
    expect(byContent.sessions.map((s) => s.id)).toEqual([id]);
    expect(byContent.sessions[0]!.match).toContain(":= 42");
    // a private session never shows up in someone else's search
    const other = (await (await outsider.request(`/api/sessions?q=${encodeURIComponent(`${TAG} search`)}`)).json()) as {
      sessions: unknown[];
    };
    expect(other.sessions).toEqual([]);
    // LIKE's wildcards are taken literally
    const wild = (await (await member.request(`/api/sessions?q=${encodeURIComponent("%_%_%_%_zz")}`)).json()) as { sessions: unknown[] };
    expect(wild.sessions).toEqual([]);
  });
});

describe("library and history across sessions", () => {
  it("finds my objects in other sessions by name, type and content, and inserts a copy that records its origin", async () => {
    const a = await newSession(member, `${TAG} library source`);
    const b = await newSession(member, `${TAG} library target`);
    await run(member, a, "S := Q[x, y]\nlibideal := <x^2, x*y>");
    const byName = (await (await member.request("/api/library?q=libideal")).json()) as {
      objects: { id: string; name: string; type: string; sessionId: string; via: string; mine: boolean }[];
    };
    const hit = byName.objects.find((o) => o.sessionId === a && o.name === "libideal");
    expect(hit).toMatchObject({ type: "Ideal", via: "own session", mine: true });
    const byContent = (await (await member.request(`/api/library?q=${encodeURIComponent("x*y")}`)).json()) as { objects: { id: string }[] };
    expect(byContent.objects.map((o) => o.id)).toContain(hit!.id);
    const byType = (await (await member.request("/api/library?type=ideal")).json()) as { objects: { type: string }[] };
    expect(byType.objects.length).toBeGreaterThan(0);
    expect(byType.objects.every((o) => o.type === "Ideal")).toBe(true);
    // the outsider cannot reach it
    const none = (await (await outsider.request("/api/library?q=libideal")).json()) as { objects: { id: string }[] };
    expect(none.objects.map((o) => o.id)).not.toContain(hit!.id);
    const copy = await member.json(`/api/objects/${hit!.id}/import`, { sessionId: b });
    expect(copy.status).toBe(201);
    const body = (await copy.json()) as { object: { name: string; origin: { sessionId: string; sessionTitle: string; name: string } } };
    expect(body.object.name).toBe("libideal");
    expect(body.object.origin).toMatchObject({ sessionId: a, sessionTitle: `${TAG} library source`, name: "libideal" });
  });

  it("history covers all my sessions, each source once, filtered by what I type", async () => {
    const a = await newSession(member, `${TAG} history a`);
    const b = await newSession(member, `${TAG} history b`);
    const mark = `hq${TAG.slice(-8)}`;
    const src = `${mark}_a := 7`;
    await run(member, a, src);
    await run(member, b, src);
    await run(member, b, `${mark}_b := 8`);
    const r = (await (await member.request(`/api/history?q=${encodeURIComponent(`${mark}_a`)}`)).json()) as {
      entries: { source: string; sessionId: string }[];
    };
    expect(r.entries.map((e) => e.source)).toEqual([src]);
    // the latest run wins
    expect(r.entries[0]!.sessionId).toBe(b);
    const all = (await (await member.request(`/api/history?q=${encodeURIComponent(mark)}`)).json()) as { entries: { source: string }[] };
    expect(all.entries.map((e) => e.source)).toEqual([`${mark}_b := 8`, src]);
    const theirs = (await (await outsider.request(`/api/history?q=${encodeURIComponent(mark)}`)).json()) as { entries: unknown[] };
    expect(theirs.entries).toEqual([]);
  });
});

describe("shared sessions are safe", () => {
  let shared = "";
  beforeAll(async () => {
    shared = await newSession(lead, `${TAG} shared`);
    await db().update(sessions).set({ teamId: group.teamId, visibility: "team" }).where(eq(sessions.id, shared));
    expect((await run(lead, shared, "S := Q[x, y]\nJ := <x^2>")).status).toBe(200);
  });

  it("records who ran each cell", async () => {
    expect((await run(member, shared, "K := <y^3>")).status).toBe(200);
    const cells = (
      (await (await guest.request(`/api/sessions/${shared}/cells`)).json()) as {
        cells: { source: string; author: { id: string; name: string } | null }[];
      }
    ).cells;
    expect(cells.map((c) => c.author?.name)).toEqual([TEST_ACCOUNTS.lead.name, TEST_ACCOUNTS.member.name]);
    expect(cells[1]!.author!.id).toBe(group.users.member.id);
  });

  it("refuses to redefine the lead's name without consent, and replaces it with consent", async () => {
    const refused = await run(member, shared, "J := <y>");
    expect(refused.status).toBe(409);
    if (refused.status !== 409 || !refused.body) throw new Error("expected a refusal");
    expect(refused.body.error.code).toBe("redefines_others");
    expect(refused.body.error.message).toContain("J (defined by Lena Lead)");
    expect(refused.body.error.details).toEqual({ names: [{ name: "J", definedBy: TEST_ACCOUNTS.lead.name }] });
    // nothing ran: no cell was stored
    const cells = ((await (await member.request(`/api/sessions/${shared}/cells`)).json()) as { cells: unknown[] }).cells;
    expect(cells).toHaveLength(2);
    // the member's own names and new names need no consent
    expect((await run(member, shared, "K := <y^2>\nL := <x>")).status).toBe(200);
    const ok = await run(member, shared, "J := <y>", { redefine: true });
    expect(ok.status).toBe(200);
    const objects = (
      (await (await member.request(`/api/sessions/${shared}/objects`)).json()) as { objects: { name: string; definedBy: string }[] }
    ).objects;
    expect(objects.find((o) => o.name === "J")!.definedBy).toBe(group.users.member.id);
    // now the lead is the one asked
    expect((await run(lead, shared, "J := <x>")).status).toBe(409);
  });
});

describe("invitations land in the invitee's own session", () => {
  it("accepting returns a session the invitee owns, never the lead's", async () => {
    const teamR = await lead.json("/api/teams", { name: `${TAG} team` });
    expect(teamR.status).toBe(201);
    const teamId = ((await teamR.json()) as { team: { id: string } }).team.id;
    madeTeams.push(teamId);
    await newSession(lead, `${TAG} lead work`);
    const email = `invitee-${TAG}@console.test.example`;
    const [u] = await db()
      .insert(users)
      .values({ email, displayName: "Iris Invitee", passwordHash: await hashPassword("invitee-pass-5531") })
      .returning();
    madeUsers.push(u!.id);
    const invitee = new TestClient(testAddress(234));
    expect((await invitee.signIn(email, "invitee-pass-5531")).status).toBe(200);
    expect((await lead.json(`/api/teams/${teamId}/invitations`, { email, role: "member" })).status).toBe(201);
    const { listMessages } = await import("@/lib/mail/mailbox");
    const { testEnv } = await import("../helpers/env");
    let token = "";
    for (let i = 0; i < 50 && !token; i++) {
      const m = (await listMessages(500, testEnv("RINGSIDE_MAIL_DIR"))).find((x) => x.envelopeTo.includes(email));
      token = m ? (/\/invitations\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1] ?? "") : "";
      if (!token) await new Promise((r) => setTimeout(r, 100));
    }
    expect(token).not.toBe("");
    // the signed-out page names the invitation on sign-in and sign-up
    const anon = new TestClient(testAddress(235));
    for (const page of ["sign-in", "sign-up"]) {
      const html = await (await anon.request(`/${page}?callbackUrl=${encodeURIComponent(`/invitations/${token}`)}`)).text();
      expect(html).toContain(`${TAG} team`);
      expect(html).toContain(email);
    }
    const accepted = await invitee.request(`/api/invitations/${token}/accept`, { method: "POST" });
    expect(accepted.status).toBe(200);
    const { membership } = (await accepted.json()) as { membership: { sessionId: string } };
    made.push(membership.sessionId);
    const s = (await (await invitee.request(`/api/sessions/${membership.sessionId}`)).json()) as { session: { access: string } };
    expect(s.session.access).toBe("owner");
  });
});

describe("the team page and sharing with an unknown address", () => {
  it("lists team-visible sessions besides explicit shares", async () => {
    const id = await newSession(member, `${TAG} visible to team`);
    await db().update(sessions).set({ teamId: group.teamId, visibility: "team" }).where(eq(sessions.id, id));
    const detail = (await (await guest.request(`/api/teams/${group.teamId}`)).json()) as {
      sharedSessions: { id: string; role: string; via: string }[];
    };
    expect(detail.sharedSessions.find((s) => s.id === id)).toMatchObject({ role: "viewer", via: "team visibility" });
    const asMember = (await (await lead.request(`/api/teams/${group.teamId}`)).json()) as {
      sharedSessions: { id: string; role: string }[];
    };
    expect(asMember.sharedSessions.find((s) => s.id === id)).toMatchObject({ role: "editor" });
  });

  it("answers a share to an address without an account as it answers any share (issue 13: sharing reveals no accounts); the share waits for the address", async () => {
    const id = await newSession(member, `${TAG} share unknown`);
    const unknown = await member.json(`/api/sessions/${id}/shares`, { email: `nobody-${TAG}@console.test.example`, role: "viewer" });
    const known = await member.json(`/api/sessions/${id}/shares`, { email: group.users.guest.email, role: "viewer" });
    expect(unknown.status).toBe(201);
    expect(known.status).toBe(201);
    const a = (await unknown.json()) as Record<string, unknown>;
    const b = (await known.json()) as Record<string, unknown>;
    expect(Object.keys(a).sort()).toEqual(Object.keys(b).sort());
  });

  it("a revoked read-only link shows one clear message", async () => {
    const id = await newSession(member, `${TAG} dead link`);
    const anon = new TestClient(testAddress(236));
    const html = await (await anon.request(`/?session=${id}&link=${"x".repeat(43)}`)).text();
    expect(html).toContain("This read-only link does not open a session");
    expect(html).not.toContain("Visiting through a read-only link");
  });
});

describe("exports choose cells", () => {
  it("keeps the chosen cells and skips error cells", async () => {
    const id = await newSession(member, `${TAG} export`);
    await run(member, id, "a := 1");
    await run(member, id, "1 / 0");
    await run(member, id, "c := 3");
    const all = await (await member.request(`/api/sessions/${id}/export?format=markdown`)).text();
    expect(all).toContain("division by zero");
    const skipped = await (await member.request(`/api/sessions/${id}/export?format=markdown&skipErrors=1`)).text();
    expect(skipped).not.toContain("division by zero");
    expect(skipped).toContain("c := 3");
    const chosen = (await (await member.request(`/api/sessions/${id}/export?format=json&cells=2`)).json()) as {
      cells: { source: string }[];
      objects: { name: string }[];
    };
    expect(chosen.cells.map((c) => c.source)).toEqual(["c := 3"]);
    expect(chosen.objects.map((o) => o.name)).toEqual(["c"]);
    expect((await member.request(`/api/sessions/${id}/export?format=json&cells=a`)).status).toBe(400);
  });
});
