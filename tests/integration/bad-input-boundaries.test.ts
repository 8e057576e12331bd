/// Bad input at every boundary (issue 13, item 7): NUL characters, lone surrogates,
/// 100 000-deep nesting and numbers JSON or PostgreSQL cannot keep are refused with 400 and
/// a message naming the place — for titles, cell sources, object names, team names,
/// sign-up fields, credentials and imports — never a 500, and never a cell left running.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { cells, sessions } from "@/db/schema";
import { ensureTestGroup, TEST_ACCOUNTS, uniqueEmail } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

const client = new TestClient(testAddress(130));
let sessionId = "";
let objectId = "";

/// 100 000 levels: 200 kB, so routes with a smaller body limit answer 413 before reading it;
/// 20 000 levels (40 kB) fits under every limit and must be refused for its depth.
const DEEP = `${"[".repeat(100_000)}${"]".repeat(100_000)}`;
const DEEP_SMALL = `${"[".repeat(20_000)}${"]".repeat(20_000)}`;

/// A body with `text` spliced in raw where the placeholder "@" stands, so numbers such as
/// 1e400 reach the server as written (JSON.stringify would have turned them into null).
function raw(template: unknown, text: string): string {
  return JSON.stringify(template).replace('"@"', text);
}

function exportDoc(overrides: { position?: string; value?: string; source?: string; title?: string } = {}): string {
  const doc = {
    format: "ringside.session",
    version: 1,
    exportedAt: "2026-01-01T00:00:00.000Z",
    session: { title: "@T", ownerName: "Imported" },
    cells: [
      {
        position: "@P",
        source: "@S",
        status: "done",
        results: [{ statement: 0, span: null, value: "@V" }],
        error: null,
        currentRing: null,
        durationMs: 5,
        engineVersion: null,
      },
    ],
    objects: [],
  };
  return JSON.stringify(doc)
    .replace('"@T"', overrides.title ?? '"Boundary import"')
    .replace('"@P"', overrides.position ?? "0")
    .replace('"@S"', overrides.source ?? '"I = 1"')
    .replace('"@V"', overrides.value ?? '{"type":"Integer","text":"1"}');
}

async function send(path: string, body: string, method = "POST"): Promise<{ status: number; error: { code: string; message: string } }> {
  const r = await client.request(path, { method, headers: { "Content-Type": "application/json" }, body });
  const text = await r.text();
  let error = { code: "", message: text.slice(0, 200) };
  try {
    error = (JSON.parse(text) as { error: { code: string; message: string } }).error ?? error;
  } catch {
    // not JSON: the assertion on the status says enough
  }
  return { status: r.status, error };
}

beforeAll(async () => {
  await ensureTestGroup();
  expect((await client.signIn(TEST_ACCOUNTS.outsider.email, TEST_ACCOUNTS.outsider.password)).status).toBe(200);
  const created = await client.json("/api/sessions", { title: "boundaries" });
  sessionId = ((await created.json()) as { id: string }).id;
  // an object to rename, brought in by an import
  const doc = JSON.parse(exportDoc()) as { objects: unknown[] };
  doc.objects.push({ name: "J", type: "Integer", value: { type: "Integer", text: "1" }, source: "J = 1", cell: 0, origin: null });
  const imported = await send("/api/sessions/import", JSON.stringify(doc));
  expect(imported.status).toBe(201);
  const [row] = await db().select().from(sessions).where(eq(sessions.title, "Boundary import"));
  const objects = (await (await client.request(`/api/sessions/${row!.id}/objects`)).json()) as { objects: { id: string }[] };
  objectId = `${row!.id}/objects/${objects.objects[0]!.id}`;
}, 60_000);
afterAll(() => closeDb());

const NUL = JSON.stringify("a\u0000b");
const LONE = '"a\\ud800b"';
const LONE_LOW = '"\\udc00"';

describe("each boundary answers 400 with the place and the reason", () => {
  const cases: [string, () => [string, string, string?], RegExp][] = [
    ["a title with NUL", () => ["/api/sessions", raw({ title: "@" }, NUL)], /title.*NUL/],
    ["a title with a lone surrogate", () => ["/api/sessions", raw({ title: "@" }, LONE)], /title.*surrogate/],
    ["a title nested 20 000 deep", () => ["/api/sessions", raw({ title: "@" }, DEEP_SMALL)], /more than 64 levels/],
    ["a title that is 1e400", () => ["/api/sessions", raw({ title: "@" }, "1e400")], /title.*too large/],
    [
      "a cell source with NUL",
      () => [`/api/sessions/${sessionId}/cells`, raw({ source: "@" }, JSON.stringify("1 +\u0000 1"))],
      /source.*NUL/,
    ],
    [
      "a cell source with a lone low surrogate",
      () => [`/api/sessions/${sessionId}/cells`, raw({ source: "@" }, LONE_LOW)],
      /source.*surrogate/,
    ],
    ["a cell source nested 20 000 deep", () => [`/api/sessions/${sessionId}/cells`, raw({ source: "@" }, DEEP_SMALL)], /levels deep/],
    ["an object name with NUL", () => [`/api/sessions/${objectId}`, raw({ name: "@" }, JSON.stringify("K\u0000")), "PATCH"], /name.*NUL/],
    ["a team name with a lone surrogate", () => ["/api/teams", raw({ name: "@" }, LONE)], /name.*surrogate/],
    [
      "a sign-up name with NUL",
      () => ["/api/auth/signup", raw({ email: uniqueEmail("nul"), password: "boundary-check-4471", name: "@" }, NUL)],
      /name.*NUL/,
    ],
    ["a key with NUL", () => ["/api/sessions", JSON.stringify({ title: "x", "k\u0000": 1 })], /key.*NUL/],
    ["an import with a NUL in a source", () => ["/api/sessions/import", exportDoc({ source: NUL })], /cells\.0\.source.*NUL/],
    [
      "an import with a lone surrogate in a value",
      () => ["/api/sessions/import", exportDoc({ value: `{"type":"Integer","text":${LONE}}` })],
      /cells\.0\.results\.0\.value\.text.*surrogate/,
    ],
    [
      "an import nested 100 000 deep in a value",
      () => ["/api/sessions/import", exportDoc({ value: `{"type":"Integer","text":"1","x":${DEEP}}` })],
      /levels deep/,
    ],
    ["an import position of 1e400", () => ["/api/sessions/import", exportDoc({ position: "1e400" })], /cells\.0\.position.*too large/],
    ["an import position of 2^60", () => ["/api/sessions/import", exportDoc({ position: String(2 ** 60) })], /cells\.0\.position.*exactly/],
    [
      "an import position beyond int4",
      () => ["/api/sessions/import", exportDoc({ position: "3000000000" })],
      /cells\.0\.position.*larger than 2147483647/,
    ],
    ["an import title with NUL", () => ["/api/sessions/import", exportDoc({ title: NUL })], /session\.title.*NUL/],
  ];

  it.each(cases)("%s", async (_label, make, message) => {
    const [path, body, method] = make();
    const r = await send(path, body, method);
    expect(r.status).toBe(400);
    expect(r.error.message).toMatch(message);
  });

  it("answers 413 for 100 000 levels where the body limit is smaller than the body", async () => {
    for (const path of ["/api/sessions", `/api/sessions/${sessionId}/cells`]) {
      const r = await send(path, raw({ title: "@" }, DEEP));
      expect(r.status).toBe(413);
      expect(r.error.code).toBe("body_too_large");
    }
  });

  it("refuses credentials with NUL (form) or a lone surrogate (JSON) with 400", async () => {
    const other = new TestClient(testAddress(131));
    const csrf = (await (await other.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const form = new URLSearchParams({ csrfToken: csrf.csrfToken, email: "a\u0000@b.example", password: "whatever-it-is-1", json: "true" });
    const viaForm = await other.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: form.toString(),
    });
    expect(viaForm.status).toBe(400);
    // A form cannot carry a lone surrogate (it is encoded as U+FFFD); JSON can.
    const viaJson = await other.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: `{"csrfToken":${JSON.stringify(csrf.csrfToken)},"email":"\\ud800@b.example","password":"whatever-it-is-1","json":"true"}`,
    });
    expect(viaJson.status).toBe(400);
    expect(((await viaJson.json()) as { error: { message: string } }).error.message).toMatch(/email.*surrogate/);
  });

  it("leaves no cell behind, running or otherwise, after the refused sources", async () => {
    const rows = await db().select({ status: cells.status }).from(cells).where(eq(cells.sessionId, sessionId));
    expect(rows).toEqual([]);
  });

  it("still accepts the same routes with good input", async () => {
    expect((await send("/api/sessions", JSON.stringify({ title: "Grüße 👋 ∂" }))).status).toBe(201);
    expect((await send("/api/sessions/import", exportDoc({ position: "2147483647" }))).status).toBe(201);
  });
});
