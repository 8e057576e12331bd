/// Sharing flows over the API: a share by e-mail grants its role and can be changed and
/// revoked; a team share leaves the team's guests read-only; a published link lets a
/// holder read, signed in or not (never run), until it is revoked, and never opens the session to its team; a shared object is imported as a
/// copy recording its origin. Each change is checked in the audit log.
import { desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditLog, namedObjects, sessions } from "@/db/schema";
import { TEST_ACCOUNTS } from "../helpers/fixtures";
import { cleanUp, EXTRA_ACCOUNTS, makeWorld, ownSession, type World } from "./setup";

const EXTRA_OWNER = EXTRA_ACCOUNTS.owner.email;
const EXTRA_VIEWER = EXTRA_ACCOUNTS.viewer.email;

let w: World;
let sessionId = "";
let objectId = "";

beforeAll(async () => {
  w = await makeWorld(200);
  const created = await w.clients.owner.json("/api/sessions", { title: "sharing flows" });
  sessionId = ((await created.json()) as { id: string }).id;
  const [o] = await db()
    .insert(namedObjects)
    .values({ sessionId, ownerId: w.ids.owner, name: "J", type: "Int", value: { type: "Int", text: "7", value: "7" }, source: "J := 7" })
    .returning();
  objectId = o!.id;
}, 60_000);
afterAll(async () => {
  await cleanUp(["sharing flows", "lead's notes", "flows import target"], ["Flows team"]);
  await closeDb();
});

async function lastAudit(event: string) {
  const [row] = await db().select().from(auditLog).where(eq(auditLog.event, event)).orderBy(desc(auditLog.id)).limit(1);
  return row!;
}

const canEdit = async (who: keyof World["clients"] | "anonymous", query = "") => {
  const r = await (who === "anonymous" ? w.anonymous : w.clients[who]).request(`/api/sessions/${sessionId}${query}`);
  if (r.status !== 200) return r.status;
  return ((await r.json()) as { session: { canEdit: boolean } }).session.canEdit ? "edit" : "read";
};

describe("session shares", () => {
  it("grant, change and revoke a role by e-mail", async () => {
    expect(await canEdit("outsider")).toBe(404);
    const r = await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, {
      email: TEST_ACCOUNTS.outsider.email.toUpperCase(),
      role: "viewer",
    });
    expect(r.status).toBe(201);
    const { share } = (await r.json()) as { share: { id: string; role: string; grantee: { kind: string; email: string } } };
    expect(share).toMatchObject({ role: "viewer", grantee: { kind: "user", email: TEST_ACCOUNTS.outsider.email } });
    expect((await lastAudit("share_created")).details).toMatchObject({ sessionId, shareId: share.id, role: "viewer" });
    expect(await canEdit("outsider")).toBe("read");

    const again = await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, { email: TEST_ACCOUNTS.outsider.email, role: "editor" });
    expect(again.status).toBe(200);
    expect(((await again.json()) as { share: { id: string } }).share.id).toBe(share.id);
    expect((await lastAudit("share_changed")).details).toMatchObject({ shareId: share.id, from: "viewer", to: "editor" });
    expect(await canEdit("outsider")).toBe("edit");

    expect((await w.clients.owner.request(`/api/sessions/${sessionId}/shares/${share.id}`, { method: "DELETE" })).status).toBe(200);
    expect((await lastAudit("share_revoked")).details).toMatchObject({ shareId: share.id });
    expect(await canEdit("outsider")).toBe(404);
    expect((await w.clients.owner.request(`/api/sessions/${sessionId}/shares/${share.id}`, { method: "DELETE" })).status).toBe(404);
  });

  it("a team share: leads and members edit, guests only read", async () => {
    const r = await w.clients.lead.json("/api/teams", { name: "Flows team" });
    const teamId = ((await r.json()) as { team: { id: string } }).team.id;
    // the owner is not in that team: sharing with it is refused
    const refused = await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, { teamId, role: "editor" });
    expect(refused.status).toBe(403);
    // the group's lead shares a session of theirs with the group
    const own = await w.clients.lead.json("/api/sessions", { title: "lead's notes" });
    const leadSession = ((await own.json()) as { id: string }).id;
    const shared = await w.clients.lead.json(`/api/sessions/${leadSession}/shares`, { teamId: w.group.teamId, role: "editor" });
    expect(shared.status).toBe(201);
    const access = async (who: "member" | "guest" | "outsider") => {
      const r = await w.clients[who].request(`/api/sessions/${leadSession}`);
      return r.status === 200 ? ((await r.json()) as { session: { access: string } }).session.access : r.status;
    };
    expect(await access("member")).toBe("editor");
    expect(await access("guest")).toBe("viewer");
    expect(await access("outsider")).toBe(404);
    const detail = (await (await w.clients.guest.request(`/api/teams/${w.group.teamId}`)).json()) as { sharedSessions: { id: string }[] };
    expect(detail.sharedSessions.map((s) => s.id)).toContain(leadSession);
    const run = await w.clients.guest.json(`/api/sessions/${leadSession}/cells`, { source: "1 + 1" });
    expect(run.status).toBe(403);
  });

  it("bad bodies are refused", async () => {
    const cases: unknown[] = [
      { role: "viewer" },
      { email: TEST_ACCOUNTS.guest.email, teamId: w.group.teamId, role: "viewer" },
      { email: TEST_ACCOUNTS.guest.email, role: "owner" },
      { email: EXTRA_OWNER, role: "viewer" },
    ];
    const statuses = [];
    for (const body of cases) statuses.push((await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, body)).status);
    expect(statuses).toEqual([400, 400, 400, 409]);
  });

  // Issue 13 replaced the old 404 "no_account": a share to an address without an account
  // answers exactly like a share to an account (201 and the same shape), and grants
  // nothing until an account confirms that address (tests/integration/web-hardening.test.ts).
  it("answers a share to an unknown address like any other, revealing no accounts", async () => {
    const unknown = await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, {
      email: "Nobody-At-All@harbor.test.example",
      role: "viewer",
    });
    const known = await w.clients.owner.json(`/api/sessions/${sessionId}/shares`, { email: TEST_ACCOUNTS.guest.email, role: "viewer" });
    expect(unknown.status).toBe(201);
    expect(known.status).toBe(201);
    type Answer = { share: { id: string; role: string; grantee: Record<string, unknown>; createdAt: string } };
    const a = ((await unknown.json()) as Answer).share;
    const b = ((await known.json()) as Answer).share;
    expect(Object.keys(a).sort()).toEqual(Object.keys(b).sort());
    expect(Object.keys(a.grantee).sort()).toEqual(Object.keys(b.grantee).sort());
    expect(a.grantee).toEqual({ kind: "user", email: "nobody-at-all@harbor.test.example" });
    const list = (await (await w.clients.owner.request(`/api/sessions/${sessionId}/shares`)).json()) as { shares: Answer["share"][] };
    const rows = list.shares.filter((x) => x.id === a.id || x.id === b.id);
    expect(rows.map((x) => Object.keys(x.grantee).sort())).toEqual([Object.keys(b.grantee).sort(), Object.keys(b.grantee).sort()]);
    for (const id of [a.id, b.id])
      expect((await w.clients.owner.request(`/api/sessions/${sessionId}/shares/${id}`, { method: "DELETE" })).status).toBe(200);
  });
});

describe("read-only link", () => {
  it("lets a holder, signed in or not, read until revoked, never run", async () => {
    const r = await w.clients.owner.request(`/api/sessions/${sessionId}/link`, { method: "POST" });
    expect(r.status).toBe(201);
    const { url } = (await r.json()) as { url: string };
    const token = new URL(url).searchParams.get("link")!;
    expect(token.length).toBeGreaterThanOrEqual(43);
    expect(new URL(url).searchParams.get("session")).toBe(sessionId);
    // idempotent
    const same = await w.clients.owner.request(`/api/sessions/${sessionId}/link`, { method: "POST" });
    expect(((await same.json()) as { url: string }).url).toBe(url);

    const q = `?link=${encodeURIComponent(token)}`;
    expect(await canEdit("linkHolder", q)).toBe("read");
    expect(await canEdit("linkHolder", "?link=wrong-token")).toBe(404);
    expect(
      (await w.clients.linkHolder.request(`/api/sessions/${sessionId}/export?format=markdown&link=${encodeURIComponent(token)}`)).status,
    ).toBe(200);
    // a holder is known to read the session, so running a cell is refused as read-only
    const run = await w.clients.linkHolder.json(`/api/sessions/${sessionId}/cells${q}`, { source: "1 + 1" });
    expect(run.status).toBe(403);

    // signed out: the link reads the session, its cells, objects and export; nothing else
    expect(await canEdit("anonymous", q)).toBe("read");
    for (const sub of ["/cells", "/objects"]) expect((await w.anonymous.request(`/api/sessions/${sessionId}${sub}${q}`)).status).toBe(200);
    expect((await w.anonymous.request(`/api/sessions/${sessionId}/export${q}&format=json`)).status).toBe(200);
    expect((await w.anonymous.request(`/api/sessions/${sessionId}`)).status).toBe(401);
    expect((await w.anonymous.request(`/api/sessions/${sessionId}?link=wrong-token`)).status).toBe(404);
    expect((await w.anonymous.json(`/api/sessions/${sessionId}/cells${q}`, { source: "1 + 1" })).status).toBe(401);
    expect((await w.anonymous.request(`/api/sessions/${sessionId}/shares${q}`)).status).toBe(401);

    expect((await w.clients.owner.request(`/api/sessions/${sessionId}/link`, { method: "DELETE" })).status).toBe(200);
    expect(await canEdit("linkHolder", q)).toBe(404);
    expect(await canEdit("anonymous", q)).toBe(404);
    expect((await w.clients.owner.request(`/api/sessions/${sessionId}/link`, { method: "DELETE" })).status).toBe(404);
    const published = await lastAudit("link_published");
    expect(published.details).toEqual({ sessionId });
    expect(JSON.stringify((await lastAudit("link_revoked")).details)).not.toContain(token);
  });

  it("opens a private session of a team to link holders only, not to the team", async () => {
    const [s] = await db().insert(sessions).values({ title: "sharing flows", ownerId: w.ids.lead, teamId: w.group.teamId }).returning();
    const teamRead = async () =>
      Promise.all((["member", "guest"] as const).map(async (who) => (await w.clients[who].request(`/api/sessions/${s!.id}`)).status));
    expect(await teamRead()).toEqual([404, 404]);
    const r = await w.clients.lead.request(`/api/sessions/${s!.id}/link`, { method: "POST" });
    expect(r.status).toBe(201);
    const token = new URL(((await r.json()) as { url: string }).url).searchParams.get("link")!;
    expect(await teamRead()).toEqual([404, 404]);
    const [row] = await db().select().from(sessions).where(eq(sessions.id, s!.id));
    expect(row!.visibility).toBe("private");
    // the member with the link reads it as a viewer only
    const withLink = await w.clients.member.request(`/api/sessions/${s!.id}?link=${encodeURIComponent(token)}`);
    expect(((await withLink.json()) as { session: { access: string } }).session.access).toBe("viewer");
    expect((await w.clients.lead.request(`/api/sessions/${s!.id}/link`, { method: "DELETE" })).status).toBe(200);
    // revoking leaves it private (it does not fall back to the team)
    expect(await teamRead()).toEqual([404, 404]);
  });
});

describe("shared objects", () => {
  it("are imported as a copy that records its origin", async () => {
    const target = await ownSession(w, "viewer", "flows import target");
    // not shared yet: the object is invisible
    expect((await w.clients.viewer.json(`/api/objects/${objectId}/import`, { sessionId: target })).status).toBe(404);
    const s = await w.clients.owner.json(`/api/objects/${objectId}/shares`, { email: EXTRA_VIEWER, role: "viewer" });
    expect(s.status).toBe(201);
    const listed = (await (await w.clients.viewer.request("/api/objects")).json()) as { objects: { id: string; sessionTitle: string }[] };
    expect(listed.objects.find((o) => o.id === objectId)?.sessionTitle).toBe("sharing flows");
    // the viewer of one object still cannot read the session
    expect((await w.clients.viewer.request(`/api/sessions/${sessionId}`)).status).toBe(404);

    const imported = await w.clients.viewer.json(`/api/objects/${objectId}/import`, { sessionId: target, name: "J_copy" });
    expect(imported.status).toBe(201);
    const { object } = (await imported.json()) as { object: { id: string; name: string; value: unknown; origin: Record<string, unknown> } };
    expect(object.name).toBe("J_copy");
    expect(object.value).toEqual({ type: "Int", text: "7", value: "7" });
    expect(object.origin).toMatchObject({
      kind: "object",
      objectId,
      sessionId,
      sessionTitle: "sharing flows",
      name: "J",
      ownerName: "Olga Owner",
    });
    const [row] = await db().select().from(namedObjects).where(eq(namedObjects.id, object.id));
    expect(row!.sessionId).toBe(target);
    expect(row!.ownerId).toBe(w.ids.viewer);
    // the same name again collides
    expect((await w.clients.viewer.json(`/api/objects/${objectId}/import`, { sessionId: target, name: "J_copy" })).status).toBe(409);
    // into a session one may only read: refused
    expect((await w.clients.viewer.json(`/api/objects/${objectId}/import`, { sessionId })).status).toBe(404);
    expect((await lastAudit("object_imported")).details).toMatchObject({ from: objectId, to: object.id });
  });
});
