/// The experiments API over HTTP against the production server and the real database:
/// uploads (a bad line 3 is refused with "line 3" and nothing is stored), creating from an
/// upload and from a cell, progress, rows paged/sorted/filtered, exports, pause/resume/cancel,
/// and the session's roles (owner, team guest as viewer, outsider, read-only link).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { namedObjects, sessions, uploads } from "@/db/schema";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { startWorker, stopGently, waitFor, type Proc } from "./helpers";

const owner = new TestClient(testAddress(171));
const guest = new TestClient(testAddress(172));
const outsider = new TestClient(testAddress(173));
const anonymous = new TestClient(testAddress(174));
let sessionId = "";
let worker: Proc;

beforeAll(async () => {
  const group = await ensureTestGroup();
  expect((await owner.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
  expect((await guest.signIn(TEST_ACCOUNTS.guest.email, TEST_ACCOUNTS.guest.password)).status).toBe(200);
  expect((await outsider.signIn(TEST_ACCOUNTS.outsider.email, TEST_ACCOUNTS.outsider.password)).status).toBe(200);
  const created = await owner.json("/api/sessions", { title: "experiments over HTTP" });
  expect(created.status).toBe(201);
  sessionId = ((await created.json()) as { id: string }).id;
  await db().update(sessions).set({ teamId: group.teamId, visibility: "team" }).where(eq(sessions.id, sessionId));
  worker = startWorker("api", 1);
});

afterAll(async () => {
  await stopGently(worker);
  await closeDb();
});

type Experiment = {
  id: string;
  status: string;
  done: number;
  total: number;
  failures: number;
  columns: string[];
  familyDefinition: string;
  probe: string;
  engineVersion: string;
  progress: { rate: number | null };
};

async function experiment(
  client: TestClient,
  id: string,
  link?: string,
): Promise<{ status: number; body: { experiment: Experiment; canEdit: boolean } }> {
  const r = await client.request(`/api/experiments/${id}${link ? `?link=${link}` : ""}`);
  return { status: r.status, body: (await r.json()) as { experiment: Experiment; canEdit: boolean } };
}

const RING = "Q[x, y, z]";
let uploadId = "";

describe("uploads", () => {
  it("a file whose line 3 is malformed is refused with 'line 3' and nothing is stored", async () => {
    const count = async () =>
      (
        await db()
          .select({ n: sql<number>`count(*)::int` })
          .from(uploads)
          .where(eq(uploads.sessionId, sessionId))
      )[0].n;
    const before = await count();
    const r = await owner.json("/api/experiments/uploads", {
      sessionId,
      name: "bad",
      format: "text",
      ring: RING,
      content: "<x^2, y>\n<x*y, z^2>\n<x^2 +* y>\n<z>",
    });
    expect(r.status).toBe(422);
    const body = (await r.json()) as { error: { message: string; details: { line: number; message: string }[] } };
    expect(body.error.message).toMatch(/line 3/);
    expect(body.error.details[0].line).toBe(3);
    expect(await count()).toBe(before);
    expect(
      await db()
        .select()
        .from(namedObjects)
        .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.name, "bad"))),
    ).toHaveLength(0);
    // a value that is not an ideal is a bad line too
    const poly = await owner.json("/api/experiments/uploads", {
      sessionId,
      name: "bad",
      format: "text",
      ring: RING,
      content: "<x>\nx^2 + y",
    });
    expect(poly.status).toBe(422);
    expect(((await poly.json()) as { error: { message: string } }).error.message).toMatch(/line 2: expected an ideal/);
  });

  it("a valid text upload becomes a family of the right length (and a named object)", async () => {
    const content = "# squares and products\n<x^2, y^2>\n<x*y>\n\n<x^2, x*y, y^2>\n<x, y, z>\n";
    const r = await owner.json("/api/experiments/uploads", { sessionId, name: "mine", format: "text", ring: RING, content });
    expect(r.status).toBe(201);
    const body = (await r.json()) as { upload: { id: string; length: number } };
    expect(body.upload.length).toBe(4);
    uploadId = body.upload.id;
    const [obj] = await db()
      .select()
      .from(namedObjects)
      .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.name, "mine")));
    expect(obj.type).toBe("Family");
    expect((obj.value as { length: number }).length).toBe(4);
  });

  it("JSON lists of generators; a bad item is named", async () => {
    const ok = await owner.json("/api/experiments/uploads", {
      sessionId,
      name: "fromjson",
      format: "json",
      ring: RING,
      content: '[["x^2", "y"], ["z^3"]]',
    });
    expect(ok.status).toBe(201);
    expect(((await ok.json()) as { upload: { length: number } }).upload.length).toBe(2);
    const bad = await owner.json("/api/experiments/uploads", {
      sessionId,
      name: "fromjson2",
      format: "json",
      ring: RING,
      content: '[["x^2"], [], ["q"]]',
    });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { message: string } }).error.message).toMatch(/item 2/);
  });

  it("the preview reads every file exactly as the upload does (one reader, readFamilyFile)", async () => {
    // Good and bad files of both formats, bad lines given out of order in the JSON case and
    // a line whose problem the engine finds (x^2 + y is no ideal) beside a parse error.
    const files: { format: "text" | "json"; content: string }[] = [
      { format: "text", content: "# two good ideals\n<x^2, y>\n\n<x*y, z^2>\n" },
      { format: "text", content: "<x^2, y>\nx^2 + y\n<x^2 +* y>\n<z>" },
      { format: "json", content: '[["x^2", "y"], ["z^3"], ["x*y", "z"]]' },
      { format: "json", content: '[[], ["x^2"], "y", ["z"]]' },
    ];
    for (const [k, f] of files.entries()) {
      const p = await owner.json("/api/experiments/uploads/preview", { format: f.format, ring: RING, content: f.content });
      expect(p.status).toBe(200);
      const { preview } = (await p.json()) as {
        preview: { count: number; problems: { line: number; message: string }[]; problemCount: number; unit: string };
      };
      expect(preview.unit).toBe(f.format === "json" ? "item" : "line");
      const u = await owner.json("/api/experiments/uploads", { sessionId, name: `same${k}`, ...f, ring: RING });
      if (preview.problemCount === 0) {
        expect(u.status, f.content).toBe(201);
        expect(((await u.json()) as { upload: { length: number } }).upload.length).toBe(preview.count);
        expect(preview.count).toBeGreaterThan(0);
      } else {
        expect(u.status, f.content).toBe(422);
        const details = ((await u.json()) as { error: { details: { line: number; message: string }[] } }).error.details;
        // the same lines in the same (line) order, each with the same reason
        expect(details.map((d) => d.line)).toEqual(preview.problems.map((q) => q.line));
        expect(details.map((d) => d.message)).toEqual(preview.problems.map((q) => `${preview.unit} ${q.line}: ${q.message}`));
      }
    }
  });

  it("a viewer cannot upload", async () => {
    const r = await guest.json("/api/experiments/uploads", { sessionId, name: "g", format: "text", ring: RING, content: "<x>" });
    expect(r.status).toBe(403);
  });
});

describe("experiments over HTTP", () => {
  let id = "";

  it("creates from an upload and a probe; progress and rows are readable while it runs and after", async () => {
    const r = await owner.json("/api/experiments", { sessionId, uploadId, probe: "I -> {codim: I.codim, e: I.degree}" });
    expect(r.status).toBe(201);
    const created = ((await r.json()) as { experiment: Experiment }).experiment;
    id = created.id;
    expect(created.total).toBe(4);
    expect(created.familyDefinition).toMatch(/^upload mine/);
    await waitFor(
      async () => (await experiment(owner, id)).body.experiment.status === "done",
      90_000,
      () => "upload experiment not done",
    );
    const { body } = await experiment(owner, id);
    expect(body.experiment).toMatchObject({
      done: 4,
      total: 4,
      failures: 0,
      columns: ["index", "label", "status", "seconds", "codim", "e"],
    });
    expect(body.experiment.engineVersion).toMatch(/ringside-engine/);
    // codimension and degree by hand: (x^2, y^2) complete intersection 2, degree 4; (xy) 1, 2;
    // (x^2, xy, y^2) = (x, y)^2: 2, 3; (x, y, z): 3, 1
    const rows = (await (await owner.request(`/api/experiments/${id}/rows?sort=e&order=desc`)).json()) as {
      rows: { index: number; fields: Record<string, { text: string }> }[];
      matched: number;
    };
    expect(rows.matched).toBe(4);
    expect(rows.rows.map((x) => [x.index, x.fields.codim.text, x.fields.e.text])).toEqual([
      [0, "2", "4"],
      [2, "2", "3"],
      [1, "1", "2"],
      [3, "3", "1"],
    ]);
    const paged = (await (await owner.request(`/api/experiments/${id}/rows?limit=2&offset=2`)).json()) as { rows: { index: number }[] };
    expect(paged.rows.map((x) => x.index)).toEqual([2, 3]);
    const filtered = (await (await owner.request(`/api/experiments/${id}/rows?where=codim:eq:2`)).json()) as {
      rows: { index: number }[];
      matched: number;
    };
    expect(filtered.rows.map((x) => x.index)).toEqual([0, 2]);
    const bad = await owner.request(`/api/experiments/${id}/rows?sort=nope`);
    expect(bad.status).toBe(400);
  });

  it("exports CSV, JSON and a LaTeX tabular whose caption names family, probe and engine", async () => {
    const csv = await (await owner.request(`/api/experiments/${id}/export?format=csv`)).text();
    expect(csv.split("\r\n")[0]).toBe("index,label,status,seconds,codim,e,message,worker");
    expect(csv.split("\r\n")[1]).toMatch(/^0,"<x\^2, y\^2>",ok,\d+\.\d{3},2,4,,/);
    const json = (await (await owner.request(`/api/experiments/${id}/export?format=json`)).json()) as {
      table: { type: string; columns: string[]; rows: unknown[][] };
    };
    expect(json.table.type).toBe("Table");
    expect(json.table.rows).toHaveLength(4);
    const tex = await (await owner.request(`/api/experiments/${id}/export?format=latex`)).text();
    expect(tex).toContain("\\begin{tabular}");
    expect(tex).toMatch(/\\caption\{Family: upload mine.*Probe: I -> \\\{codim: I.codim, e: I.degree\\\}.*Engine: ringside-engine/);
  });

  it("creates from a cell of the session", async () => {
    const cell = await owner.json(`/api/sessions/${sessionId}/cells`, {
      source: "S := Q[a, b]\nT := sweep(monomial_ideals(S, degree = 2, max_gens = 3), I -> {pd: (S / I).pd})",
    });
    expect(cell.status).toBe(200);
    const events = (await cell.text())
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l) as { event: string; cellId?: string });
    const cellId = events.find((e) => e.event === "accepted")!.cellId!;
    const r = await owner.json("/api/experiments", { sessionId, cellId });
    expect(r.status).toBe(201);
    const e = ((await r.json()) as { experiment: Experiment }).experiment;
    expect(e.total).toBe(7);
    expect(e.familyDefinition).toBe("monomial_ideals(Q[a, b], degree = 2, max_gens = 3)");
    await waitFor(
      async () => (await experiment(owner, e.id)).body.experiment.status === "done",
      90_000,
      () => "cell experiment not done",
    );
    // a program without a sweep is refused, saying why
    const none = await owner.json("/api/experiments", { sessionId, source: "S := Q[a]\nS.dim" });
    expect(none.status).toBe(422);
  });

  it("pause, resume and cancel; only editors may; a viewer, an outsider and a link holder", async () => {
    const r = await owner.json("/api/experiments", {
      sessionId,
      source:
        "S := GF(32003)[x, y, z, w]\nsweep(random_ideals(S, count = 40, gens = 3, degree = 2, seed = 9), I -> {b: resolve(S / I).betti.totals})",
    });
    const e = ((await r.json()) as { experiment: Experiment }).experiment;
    expect((await guest.request(`/api/experiments/${e.id}/pause`, { method: "POST" })).status).toBe(403);
    expect((await outsider.request(`/api/experiments/${e.id}`)).status).toBe(404);
    expect((await guest.request(`/api/experiments/${e.id}`)).status).toBe(200);
    const paused = await owner.request(`/api/experiments/${e.id}/pause`, { method: "POST" });
    expect(paused.status).toBe(200);
    expect((await owner.request(`/api/experiments/${e.id}/pause`, { method: "POST" })).status).toBe(409);
    expect((await owner.request(`/api/experiments/${e.id}/resume`, { method: "POST" })).status).toBe(200);
    expect((await owner.request(`/api/experiments/${e.id}/cancel`, { method: "POST" })).status).toBe(200);
    const after = (await experiment(owner, e.id)).body.experiment;
    expect(after.status).toBe("cancelled");
    expect(after.done).toBe(40);

    // a published read-only link opens the experiment to a signed-out visitor, read-only
    const link = await owner.json(`/api/sessions/${sessionId}/link`, {});
    expect(link.status).toBeLessThan(300);
    const [s] = await db().select().from(sessions).where(eq(sessions.id, sessionId));
    const token = s.shareToken!;
    expect((await experiment(anonymous, e.id, token)).status).toBe(200);
    expect((await anonymous.request(`/api/experiments/${e.id}/rows?link=${token}`)).status).toBe(200);
    expect((await anonymous.request(`/api/experiments/${e.id}/cancel?link=${token}`, { method: "POST" })).status).toBe(401);
    expect((await anonymous.request(`/api/experiments/${e.id}`)).status).toBe(401);
  });

  it("lists a session's experiments", async () => {
    const r = await owner.request(`/api/experiments?session=${sessionId}`);
    expect(r.status).toBe(200);
    const list = ((await r.json()) as { experiments: { id: string }[] }).experiments;
    expect(list.length).toBeGreaterThanOrEqual(3);
    expect((await outsider.request(`/api/experiments?session=${sessionId}`)).status).toBe(404);
  });

  it("a read-only link lists its session's experiments, signed in or not, and creates none", async () => {
    // the session's link was published by the test above
    const [s] = await db().select().from(sessions).where(eq(sessions.id, sessionId));
    const token = s.shareToken!;
    const ids = async (client: TestClient, query: string) => {
      const r = await client.request(`/api/experiments?${query}`);
      expect(r.status, `${query}`).toBe(200);
      return ((await r.json()) as { experiments: { id: string }[] }).experiments.map((e) => e.id);
    };
    const all = await ids(owner, `session=${sessionId}`);
    expect(all.length).toBeGreaterThanOrEqual(3);
    // the same list as the owner's, for a stranger to the session holding the link and for a
    // signed-out visitor holding it (as GET /api/experiments/:id?link= already answered)
    expect(await ids(outsider, `session=${sessionId}&link=${token}`)).toEqual(all);
    expect(await ids(anonymous, `session=${sessionId}&link=${token}`)).toEqual(all);
    // a wrong token opens nothing; a link names no list of "every session I can read"
    expect((await outsider.request(`/api/experiments?session=${sessionId}&link=${token}x`)).status).toBe(404);
    expect((await anonymous.request(`/api/experiments?session=${sessionId}&link=${token}x`)).status).toBe(404);
    expect((await anonymous.request(`/api/experiments?link=${token}`)).status).toBe(401);
    const outsiderAll = await ids(outsider, `link=${token}`);
    expect(outsiderAll.filter((id) => all.includes(id))).toEqual([]);
    // reading through the link is no licence to create (the create names its session in the
    // body and takes no link: to the outsider the session stays invisible, 404)
    const before = all.length;
    const create = await outsider.json(`/api/experiments?session=${sessionId}&link=${token}`, {
      sessionId,
      source: "S := Q[a]\nsweep(monomial_ideals(S, degree = 1, max_gens = 1), I -> {c: I.codim})",
    });
    expect(create.status).toBe(404);
    expect((await anonymous.json(`/api/experiments?link=${token}`, { sessionId, source: "S := Q[a]" })).status).toBe(401);
    expect(await ids(owner, `session=${sessionId}`)).toHaveLength(before);
  });
});
