/// Shared set-up of the sharing suites: besides the test group (lead, member, guest,
/// admin, outsider) four more accounts (a session owner, an editor, a viewer and a link
/// holder), signed-in clients for each, and fresh sessions and teams built in the database.
import { randomBytes } from "node:crypto";
import { eq, inArray, like, or } from "drizzle-orm";
import { db } from "@/db/client";
import { cells, experiments, memberships, namedObjects, sessions, shares, teams, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { ensureTestGroup, TEST_ACCOUNTS, type TestGroup } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

export const EXTRA_ACCOUNTS = {
  owner: { email: "owner@harbor-share.test.example", name: "Olga Owner", password: "owner-pass-3391" },
  editor: { email: "editor@harbor-share.test.example", name: "Edda Editor", password: "editor-pass-2210" },
  viewer: { email: "viewer@harbor-share.test.example", name: "Vera Viewer", password: "viewer-pass-8834" },
  linkHolder: { email: "linkholder@harbor-share.test.example", name: "Lars Link", password: "link-pass-5521" },
} as const;
export type ExtraKey = keyof typeof EXTRA_ACCOUNTS;

export async function ensureExtraAccounts(): Promise<Record<ExtraKey, string>> {
  const database = db();
  const keys = Object.keys(EXTRA_ACCOUNTS) as ExtraKey[];
  for (const k of keys) {
    const a = EXTRA_ACCOUNTS[k];
    await database
      .insert(users)
      .values({ email: a.email, displayName: a.name, passwordHash: await hashPassword(a.password) })
      .onConflictDoNothing({ target: users.email });
  }
  const rows = await database
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(
      inArray(
        users.email,
        keys.map((k) => EXTRA_ACCOUNTS[k].email),
      ),
    );
  const byEmail = new Map(rows.map((r) => [r.email, r.id]));
  return Object.fromEntries(keys.map((k) => [k, byEmail.get(EXTRA_ACCOUNTS[k].email)!])) as Record<ExtraKey, string>;
}

export type Actor = ExtraKey | "lead" | "member" | "guest" | "admin" | "outsider";

export interface World {
  group: TestGroup;
  ids: Record<Actor, string>;
  clients: Record<Actor, TestClient>;
  anonymous: TestClient;
}

/// Signs every actor in from its own address block (`base` … `base + 10`).
export async function makeWorld(base: number): Promise<World> {
  const group = await ensureTestGroup();
  const extra = await ensureExtraAccounts();
  const creds: Record<Actor, { email: string; password: string }> = {
    ...EXTRA_ACCOUNTS,
    lead: TEST_ACCOUNTS.lead,
    member: TEST_ACCOUNTS.member,
    guest: TEST_ACCOUNTS.guest,
    admin: TEST_ACCOUNTS.admin,
    outsider: TEST_ACCOUNTS.outsider,
  };
  const actors = Object.keys(creds) as Actor[];
  const clients = {} as Record<Actor, TestClient>;
  await Promise.all(
    actors.map(async (a, i) => {
      const c = new TestClient(testAddress(base + i));
      const r = await c.signIn(creds[a].email, creds[a].password);
      if (r.status !== 200) throw new Error(`sign-in of ${a} answered ${r.status}`);
      clients[a] = c;
    }),
  );
  const ids = { ...extra, ...Object.fromEntries(Object.entries(group.users).map(([k, u]) => [k, u.id])) } as Record<Actor, string>;
  return { group, ids, clients, anonymous: new TestClient(testAddress(base + actors.length)) };
}

/// A team-visible session owned by `owner` in the test group's team, published as a link, shared with
/// `editor` (editor) and `viewer` (viewer), with one finished cell and one named object
/// (itself shared with the site admin as viewer).
export async function freshSession(w: World, title = "matrix session") {
  const database = db();
  const token = randomBytes(32).toString("base64url");
  const [s] = await database
    .insert(sessions)
    .values({ title, ownerId: w.ids.owner, teamId: w.group.teamId, visibility: "team", shareToken: token })
    .returning();
  const [cell] = await database
    .insert(cells)
    .values({
      sessionId: s!.id,
      position: 0,
      source: "n := 6 * 7",
      status: "done",
      result: { statements: [{ statement: 0, span: null, value: { type: "Int", text: "42", value: "42" } }], currentRing: null },
      finishedAt: new Date(),
      durationMs: 1,
      createdBy: w.ids.owner,
    })
    .returning();
  const [object] = await database
    .insert(namedObjects)
    .values({
      sessionId: s!.id,
      ownerId: w.ids.owner,
      name: "n",
      type: "Int",
      value: { type: "Int", text: "42", value: "42" },
      source: "n := 6 * 7",
      sourceCellId: cell!.id,
    })
    .returning();
  const [editorShare] = await database.insert(shares).values({ sessionId: s!.id, userId: w.ids.editor, role: "editor" }).returning();
  await database.insert(shares).values({ sessionId: s!.id, userId: w.ids.viewer, role: "viewer" });
  const [objectShare] = await database.insert(shares).values({ objectId: object!.id, userId: w.ids.admin, role: "viewer" }).returning();
  return { id: s!.id, token, cellId: cell!.id, objectId: object!.id, editorShareId: editorShare!.id, objectShareId: objectShare!.id };
}

/// An experiment of a fresh session (freshSession: owner, editor and viewer shares, a link,
/// team visibility) inserted straight into the database with the given status and no queued
/// jobs, so nothing runs and its status — hence what pause, resume and cancel answer — stays
/// as chosen. `members` (0 or 1) is its size: one member (the Int 1) to read, none for a
/// "run again" that queues no work.
export async function freshExperiment(w: World, status: "queued" | "paused" | "done", members: 0 | 1 = 1) {
  const s = await freshSession(w);
  const member = { type: "Int", text: "1", value: "1" };
  const [e] = await db()
    .insert(experiments)
    .values({
      sessionId: s.id,
      createdBy: w.ids.owner,
      title: "matrix experiment",
      status,
      program: "sweep([1], n -> {n: n})",
      familyDefinition: "[1]",
      family: { type: "Family", text: "[1]", definition: "[1]", members: members === 1 ? [member] : [] },
      labels: members === 1 ? ["1"] : [],
      probeText: "n -> {n: n}",
      probe: { type: "Function", text: "n -> {n: n}" },
      engineVersion: "matrix",
      limits: { timeLimitMs: 1000, heapLimitMb: 64 },
      total: members,
      finishedAt: status === "done" ? new Date() : null,
    })
    .returning();
  return { id: e!.id, session: s };
}

/// A session of `actor`'s own with no sharing (a target for imports).
export async function ownSession(w: World, actor: Actor, title: string): Promise<string> {
  const [s] = await db().insert(sessions).values({ title, ownerId: w.ids[actor] }).returning();
  return s!.id;
}

/// A team with the group's lead as lead, its member as member and its guest as guest.
export async function freshTeam(w: World): Promise<string> {
  const database = db();
  const [t] = await database
    .insert(teams)
    .values({ slug: `t-${randomBytes(6).toString("hex")}`, name: "Matrix team", createdBy: w.ids.lead })
    .returning();
  await database.insert(memberships).values([
    { teamId: t!.id, userId: w.ids.lead, role: "lead" },
    { teamId: t!.id, userId: w.ids.member, role: "member" },
    { teamId: t!.id, userId: w.ids.guest, role: "guest" },
  ]);
  return t!.id;
}

export async function removeSession(id: string): Promise<void> {
  await db().delete(sessions).where(eq(sessions.id, id));
}

/// Removes the sessions and teams a suite made (by their titles and names), so the test
/// group's users do not carry them into later suites (the console lists every team).
export async function cleanUp(sessionTitles: string[], teamNames: string[]): Promise<void> {
  const database = db();
  if (sessionTitles.length > 0) {
    await database
      .delete(sessions)
      .where(or(...sessionTitles.map((t) => (t.includes("%") ? like(sessions.title, t) : eq(sessions.title, t)))));
  }
  if (teamNames.length > 0) await database.delete(teams).where(inArray(teams.name, teamNames));
}
