/// Large values' details over HTTP (issue 13, item 1): GET /api/sessions/:id/details/:detailId
/// serves the stored whole value to the session's owner and to a viewer it is shared with,
/// and refuses everyone else; and the detail folder is pruned (lib/sessions/details.ts) when
/// the last stored value holding a detail goes — a named object deleted or bound again, a
/// session deleted — but not while another session still holds it, nor when it was written
/// moments ago (a running cell may be about to store it); the sweep at a server's start takes
/// the files no stored value holds.
///
/// The summaries are planted in the test database with their files in the run's detail folder
/// (RINGSIDE_DETAIL_DIR, set by test.sh), exactly as the cell job writes them
/// (lib/compute/large-values.ts `bounded`); making one by computing needs a value above the
/// shared server's 1 MiB limit, which tests/integration/robust-compute.test.ts does on a
/// server of its own with a small limit.
import { randomUUID } from "node:crypto";
import { existsSync, mkdirSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import path from "node:path";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { cells, namedObjects } from "@/db/schema";
import { sweepDetails } from "@/lib/sessions/details";
import { ensureTestGroup, TEST_ACCOUNTS, type TestGroup } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { testEnv } from "../helpers/env";
import { allEvents } from "./ndjson";

const owner = new TestClient(testAddress(240));
const viewer = new TestClient(testAddress(241));
const outsider = new TestClient(testAddress(242));
const anonymous = new TestClient(testAddress(243));
let group: TestGroup;

/// A detail as the cell job writes it: `<id>.json` holding the whole value, mode 600. Written
/// now, so a server starting meanwhile (its sweep keeps files younger than 10 s) cannot take
/// it before the rows holding it are stored; `age` then dates it two hours back, so that only
/// the database decides whether pruning may delete it.
function plantDetail(whole: unknown): { id: string; file: string; json: string; marker: { id: string; bytes: number; type: string } } {
  const dir = testEnv("RINGSIDE_DETAIL_DIR");
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const id = randomUUID();
  const json = JSON.stringify(whole);
  const file = path.join(dir, `${id}.json`);
  writeFileSync(file, json, { mode: 0o600 });
  return { id, file, json, marker: { id, bytes: json.length, type: (whole as { type: string }).type } };
}

/// Two hours back: past the sweep's hour for half-written files too.
function age(file: string) {
  const then = new Date(Date.now() - 2 * 3600_000);
  utimesSync(file, then, then);
}

/// A Koszul-like complex's whole JSON (its content does not matter to the route).
function wholeComplex(tag: string) {
  const ring = {
    type: "Ring",
    text: "GF(32003)[a, b]",
    field: "GF(32003)",
    vars: ["a", "b"],
    degrees: [1, 1],
    order: "grevlex",
    ideal: [],
  };
  const maps = [
    { type: "Matrix", text: `[a, b] ${tag}`, rows: [["a", "b"]], cols: 2, ring },
    { type: "Matrix", text: "[-b; a]", rows: [["-b"], ["a"]], cols: 1, ring },
  ];
  return {
    type: "Complex",
    text: `complex of ranks 1, 2, 1 (${tag})`,
    ranks: [1, 2, 1],
    betti: [
      [0, 0, 1],
      [1, 1, 2],
      [2, 2, 1],
    ],
    complete: true,
    maps,
    ring,
  };
}

/// The summary the cell job stores in place of `whole` (large-values.ts, for a Complex).
function summaryOf(whole: ReturnType<typeof wholeComplex>, marker: { id: string; bytes: number; type: string }) {
  const why = "kept as a summary, its detail on request";
  return {
    type: "Complex",
    text: `${whole.text} (${why})`,
    ranks: whole.ranks,
    betti: whole.betti,
    complete: true,
    maps: null,
    note: why,
    ring: whole.ring,
    detail: marker,
  };
}

async function newSession(client: TestClient, title: string): Promise<string> {
  const r = await client.json("/api/sessions", { title });
  expect(r.status).toBe(201);
  return ((await r.json()) as { id: string }).id;
}

/// A finished cell whose result is `value` and, when `name` is given, the named object it bound.
async function plantCell(sessionId: string, value: unknown, name?: string): Promise<{ cellId: string; objectId: string | null }> {
  const [cell] = await db()
    .insert(cells)
    .values({
      sessionId,
      position: await nextPosition(sessionId),
      source: name ? `${name} := resolve(…)` : "resolve(…)",
      status: "done",
      result: { statements: [{ index: 0, span: null, value }], currentRing: null },
      createdBy: group.users.member.id,
      durationMs: 5,
      finishedAt: new Date(),
    })
    .returning();
  if (!name) return { cellId: cell!.id, objectId: null };
  const objectId = await plantObject(sessionId, name, value, cell!.id);
  return { cellId: cell!.id, objectId };
}

/// A named object holding `value` (an imported copy when no cell made it).
async function plantObject(sessionId: string, name: string, value: unknown, sourceCellId: string | null = null): Promise<string> {
  const [row] = await db()
    .insert(namedObjects)
    .values({ sessionId, ownerId: group.users.member.id, name, type: "Complex", value, source: `${name} := resolve(…)`, sourceCellId })
    .returning();
  return row!.id;
}

async function nextPosition(sessionId: string): Promise<number> {
  const [row] = await db().execute<{ next: number }>(
    sql`SELECT coalesce(max(position) + 1, 0)::int AS next FROM cells WHERE session_id = ${sessionId}`,
  );
  return row!.next;
}

const detailAddress = (sessionId: string, id: string) => `/api/sessions/${sessionId}/details/${id}`;

beforeAll(async () => {
  group = await ensureTestGroup();
  expect((await owner.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
  expect((await viewer.signIn(TEST_ACCOUNTS.guest.email, TEST_ACCOUNTS.guest.password)).status).toBe(200);
  expect((await outsider.signIn(TEST_ACCOUNTS.outsider.email, TEST_ACCOUNTS.outsider.password)).status).toBe(200);
});
afterAll(() => closeDb());

describe("GET /api/sessions/:id/details/:detailId", () => {
  it("serves the whole stored value to the owner and to a viewer, and refuses everyone else", async () => {
    const session = await newSession(owner, "large values, served");
    const whole = wholeComplex("served");
    const planted = plantDetail(whole);
    await plantCell(session, summaryOf(whole, planted.marker), "C");
    const share = await owner.json(`/api/sessions/${session}/shares`, { email: TEST_ACCOUNTS.guest.email, role: "viewer" });
    expect(share.status).toBe(201);

    // The owner: the file as stored, byte for byte, as JSON.
    const mine = await owner.request(detailAddress(session, planted.id));
    expect(mine.status).toBe(200);
    expect(mine.headers.get("content-type")).toMatch(/^application\/json/);
    expect(await mine.text()).toBe(planted.json);
    // A viewer it is shared with: the same whole value.
    const shared = await viewer.request(detailAddress(session, planted.id));
    expect(shared.status).toBe(200);
    expect(await shared.json()).toEqual(whole);

    // Anyone else: the session is invisible to them (404, as for every private session).
    const stranger = await outsider.request(detailAddress(session, planted.id));
    expect(stranger.status).toBe(404);
    expect(((await stranger.json()) as { error: { code: string } }).error.code).toBe("not_found");
    expect((await anonymous.request(detailAddress(session, planted.id))).status).toBe(401);
    // A session that does not hold the detail does not serve it, even to its owner.
    const other = await newSession(owner, "large values, holds nothing");
    expect((await owner.request(detailAddress(other, planted.id))).status).toBe(404);
    // Malformed ids never reach the file system.
    expect((await owner.request(detailAddress(session, "..%2F..%2Fpg-password"))).status).toBe(404);
    // Revoking the share refuses the former viewer.
    const shares = (await (await owner.request(`/api/sessions/${session}/shares`)).json()) as { shares: { id: string }[] };
    for (const s of shares.shares)
      expect((await owner.request(`/api/sessions/${session}/shares/${s.id}`, { method: "DELETE" })).status).toBeLessThan(300);
    expect((await viewer.request(detailAddress(session, planted.id))).status).toBe(404);
  });

  it("answers 404 with a message when the file is gone", async () => {
    const session = await newSession(owner, "large values, file lost");
    const whole = wholeComplex("lost");
    const planted = plantDetail(whole);
    await plantCell(session, summaryOf(whole, planted.marker));
    rmSync(planted.file);
    const r = await owner.request(detailAddress(session, planted.id));
    expect(r.status).toBe(404);
    expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/detail does not exist/);
  });
});

describe("importing a session keeps a detail marker only for an importer who can read it already", () => {
  // The detail route serves whoever holds the marker; an import is text the importer wrote,
  // so a marker copied from someone else's export (or guessed) must not open their detail.
  it("drops the marker for an outsider (the summary stays), keeps it for the owner's own export", async () => {
    const session = await newSession(owner, "large values, exported");
    const whole = wholeComplex("exported");
    const planted = plantDetail(whole);
    await plantCell(session, summaryOf(whole, planted.marker), "C");
    const exported = await owner.request(`/api/sessions/${session}/export?format=json`);
    expect(exported.status).toBe(200);
    const doc = await exported.json();
    expect(JSON.stringify(doc)).toContain(planted.id);

    const stolen = await outsider.json("/api/sessions/import", doc);
    expect(stolen.status).toBe(201);
    const theirs = ((await stolen.json()) as { session: { id: string } }).session.id;
    expect((await outsider.request(detailAddress(theirs, planted.id))).status).toBe(404);
    const [cell] = await db().execute<{ result: unknown }>(sql`SELECT result FROM cells WHERE session_id = ${theirs}`);
    expect(JSON.stringify(cell!.result)).not.toContain(planted.id);
    expect(JSON.stringify(cell!.result)).toContain("kept as a summary");
    const [object] = await db().execute<{ value: unknown }>(sql`SELECT value FROM named_objects WHERE session_id = ${theirs}`);
    expect(JSON.stringify(object!.value)).not.toContain(planted.id);

    const again = await owner.json("/api/sessions/import", doc);
    expect(again.status).toBe(201);
    const mine = ((await again.json()) as { session: { id: string } }).session.id;
    const served = await owner.request(detailAddress(mine, planted.id));
    expect(served.status).toBe(200);
    expect(await served.text()).toBe(planted.json);
  });
});

describe("the detail folder is pruned with the values that hold it", () => {
  it("deleting a named object keeps the file while its cell holds it; deleting the session removes it", async () => {
    const session = await newSession(owner, "large values, session deleted");
    const whole = wholeComplex("session");
    const planted = plantDetail(whole);
    const { objectId } = await plantCell(session, summaryOf(whole, planted.marker), "C");
    age(planted.file);
    expect((await owner.request(`/api/sessions/${session}/objects/${objectId}`, { method: "DELETE" })).status).toBe(200);
    expect(existsSync(planted.file)).toBe(true);
    expect((await owner.request(detailAddress(session, planted.id))).status).toBe(200);
    expect((await owner.request(`/api/sessions/${session}`, { method: "DELETE" })).status).toBeLessThan(300);
    expect(existsSync(planted.file)).toBe(false);
  });

  it("a detail another session still holds survives the session's deletion, and goes with the last holder", async () => {
    const first = await newSession(owner, "large values, first holder");
    const second = await newSession(owner, "large values, imported copy");
    const whole = wholeComplex("shared");
    const planted = plantDetail(whole);
    const summary = summaryOf(whole, planted.marker);
    await plantCell(first, summary, "C");
    const copy = await plantObject(second, "D", summary);
    age(planted.file);
    expect((await owner.request(`/api/sessions/${first}`, { method: "DELETE" })).status).toBeLessThan(300);
    expect(existsSync(planted.file)).toBe(true);
    expect((await owner.request(detailAddress(second, planted.id))).status).toBe(200);
    expect((await owner.request(`/api/sessions/${second}/objects/${copy}`, { method: "DELETE" })).status).toBe(200);
    expect(existsSync(planted.file)).toBe(false);
  });

  it("binding a name again removes the detail of the value it replaced", async () => {
    const session = await newSession(owner, "large values, bound again");
    const whole = wholeComplex("rebound");
    const planted = plantDetail(whole);
    // An imported copy: no cell of any session holds the summary, only this object.
    await plantObject(session, "E", summaryOf(whole, planted.marker));
    age(planted.file);
    const events = await allEvents(
      await owner.request(`/api/sessions/${session}/cells`, {
        method: "POST",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ source: "E := 2 + 3" }),
      }),
    );
    expect(events.at(-1)).toMatchObject({ event: "done", status: "done" });
    expect(existsSync(planted.file)).toBe(false);
    const objects = (await (await owner.request(`/api/sessions/${session}/objects`)).json()) as {
      objects: { name: string; value: { text: string } }[];
    };
    expect(objects.objects.find((o) => o.name === "E")?.value.text).toBe("5");
  });

  it("keeps a file written moments ago: a running cell may be about to store it", async () => {
    const session = await newSession(owner, "large values, fresh file");
    const whole = wholeComplex("fresh");
    const planted = plantDetail(whole);
    const objectId = await plantObject(session, "F", summaryOf(whole, planted.marker));
    expect((await owner.request(`/api/sessions/${session}/objects/${objectId}`, { method: "DELETE" })).status).toBe(200);
    expect(existsSync(planted.file)).toBe(true);
  });

  it("the sweep a server runs at start deletes the files no stored value holds, and abandoned half-written ones", async () => {
    const session = await newSession(owner, "large values, swept");
    const held = wholeComplex("held at the sweep");
    const heldDetail = plantDetail(held);
    await plantCell(session, summaryOf(held, heldDetail.marker), "H");
    const stray = plantDetail(wholeComplex("never stored"));
    const fresh = plantDetail(wholeComplex("being stored"));
    const halfWritten = `${stray.file}.4242.tmp`;
    writeFileSync(halfWritten, "{", { mode: 0o600 });
    for (const file of [heldDetail.file, stray.file, halfWritten]) age(file);
    expect(await sweepDetails()).toBeGreaterThanOrEqual(2);
    expect(existsSync(stray.file)).toBe(false);
    expect(existsSync(halfWritten)).toBe(false);
    expect(existsSync(heldDetail.file)).toBe(true);
    expect(existsSync(fresh.file)).toBe(true);
    expect((await owner.request(detailAddress(session, heldDetail.id))).status).toBe(200);
  });
});
