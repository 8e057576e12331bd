/// Cancelling a cell whose sweep went to the background (lib/experiments/README.md, "Sweeps in
/// a cell"), over HTTP against the production server and the real database: the user's cancel
/// cancels the experiment the cell started, and the cell's stored "stopped" line says so; a
/// cell stopped by its time limit leaves its experiment running (a background experiment is
/// meant to outlive what started it unless the user cancels); a cell whose server is gone is
/// cancelled with the experiments its stored values name, and only those made from it.
///
/// No worker of this file's own: the experiments must stay unfinished while the cell runs, so
/// each member recomputes katsura-13's Gröbner basis (OUTLASTING_KATSURA), which outlasts the member time limit (a
/// worker of another suite may take a member; none can finish three within the test).
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { cells, experiments } from "@/db/schema";
import { ndjsonEvents } from "../api/ndjson";
import { katsuraIdealText, OUTLASTING_KATSURA } from "../bench/families";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

const owner = new TestClient(testAddress(187));
let sessionId = "";

beforeAll(async () => {
  await ensureTestGroup(); // creates the fixture accounts
  expect((await owner.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
  const created = await owner.json("/api/sessions", { title: "cancelling a cell with a background sweep" });
  expect(created.status).toBe(201);
  sessionId = ((await created.json()) as { id: string }).id;
});

afterAll(() => closeDb());

// A background sweep (forced: three members) whose probe is slow, then a statement that keeps
// the cell running past the sweep: katsura-13's Gröbner basis takes our engine far longer than
// the test server's 8 s cell limit (tests/api/cells.test.ts; Katsura's family: common practice).
const CELL = [
  "S := Q[x, y]",
  "F := family([S / S.maximal^p for p in 1..3])",
  `K := GF(32003)[u0..u${OUTLASTING_KATSURA}]`,
  `G := ${katsuraIdealText(OUTLASTING_KATSURA)}`,
  "T := sweep(F, R -> {n: G.groebner.length}, background = true)",
  "G.groebner",
].join("\n");

type Event = { event: string; cellId?: string; status?: string; value?: { type: string; id?: string } };

/// Runs CELL; `onExperiment` is called once the Experiment value has streamed (the experiment
/// is stored by then). Answers the cell id, the experiment id and the final status.
async function runWithSweep(onExperiment: (cellId: string, experimentId: string) => Promise<void>) {
  const response = await owner.json(`/api/sessions/${sessionId}/cells`, { source: CELL });
  expect(response.status).toBe(200);
  let cellId = "";
  let experimentId = "";
  let status = "";
  for await (const raw of ndjsonEvents(response)) {
    const e = raw as Event;
    if (e.event === "accepted") cellId = e.cellId!;
    if (e.event === "result" && e.value?.type === "Experiment" && !experimentId) {
      experimentId = e.value.id!;
      await onExperiment(cellId, experimentId);
    }
    if (e.event === "done") status = e.status!;
  }
  expect(experimentId, "the sweep did not go to the background").not.toBe("");
  return { cellId, experimentId, status };
}

async function experimentOf(id: string) {
  const r = await owner.request(`/api/experiments/${id}`);
  expect(r.status).toBe(200);
  return ((await r.json()) as { experiment: { status: string; done: number; total: number; sourceCellId: string } }).experiment;
}

async function storedCell(cellId: string) {
  const r = await owner.request(`/api/sessions/${sessionId}/cells`);
  const cells = ((await r.json()) as { cells: { id: string; status: string; stopped: string | null }[] }).cells;
  return cells.find((c) => c.id === cellId)!;
}

describe("cancelling a cell whose sweep runs in the background", () => {
  it("cancels the experiment the cell started, and the cell says so", async () => {
    const run = await runWithSweep(async (cellId) => {
      const cancel = await owner.request(`/api/sessions/${sessionId}/cells/${cellId}/cancel`, { method: "POST" });
      expect(cancel.status).toBe(200);
    });
    expect(run.status).toBe("cancelled");
    const e = await experimentOf(run.experimentId);
    expect(e.sourceCellId).toBe(run.cellId);
    expect(e.status).toBe("cancelled");
    // every member has its row: the ones not run are `cancelled`
    expect(e.done).toBe(e.total);
    const rows = ((await (await owner.request(`/api/experiments/${run.experimentId}/rows`)).json()) as { rows: { status: string }[] }).rows;
    expect(rows.filter((r) => r.status === "cancelled").length).toBeGreaterThan(0);
    const cell = await storedCell(run.cellId);
    expect(cell.status).toBe("cancelled");
    expect(cell.stopped).toMatch(/: cancelled, and so was the background experiment it started$/);
  }, 120_000);

  it("a cell stopped by its time limit leaves its experiment running", async () => {
    const run = await runWithSweep(async () => {});
    expect(run.status).toBe("error");
    const cell = await storedCell(run.cellId);
    expect(cell.stopped).toMatch(/time limit/);
    expect(cell.stopped).not.toMatch(/experiment/);
    const e = await experimentOf(run.experimentId);
    expect(["queued", "running"]).toContain(e.status);
    // tidy up: nothing else needs its slow members
    expect((await owner.request(`/api/experiments/${run.experimentId}/cancel`, { method: "POST" })).status).toBe(200);
  }, 120_000);

  it("a cell whose server is gone: the cancel ends it with the experiments it made, and no other", async () => {
    // A running cell of a server that no longer exists (another host, a heartbeat an hour old),
    // whose heartbeat kept the Experiment value of its sweep; the experiment is queued.
    const old = new Date(Date.now() - 3600_000);
    const [orphan] = await db()
      .insert(cells)
      .values({
        sessionId,
        position: 100,
        source: "T := sweep(F, p)",
        status: "running",
        startedAt: old,
        serverId: "gone-host/1/x",
        heartbeatAt: old,
      })
      .returning();
    const experiment = (sourceCellId: string | null) => ({
      sessionId,
      title: "orphan's sweep",
      status: "queued" as const,
      program: "T := sweep(F, p)",
      familyDefinition: "[1]",
      family: { type: "Family", text: "[1]", definition: "[1]", members: [{ type: "Int", text: "1", value: "1" }] },
      labels: ["1"],
      probeText: "n -> {n: n}",
      probe: { type: "Function", text: "n -> {n: n}" },
      engineVersion: "test",
      limits: { timeLimitMs: 1000, heapLimitMb: 64 },
      total: 1,
      sourceCellId,
    });
    const [mine] = await db().insert(experiments).values(experiment(orphan!.id)).returning();
    // a value naming an experiment of another cell (as an imported or crafted value could)
    const [other] = await db().insert(experiments).values(experiment(null)).returning();
    const value = (id: string) => ({ type: "Experiment", text: "experiment", id, status: "queued", done: 0, total: 1, failures: 0 });
    await db()
      .update(cells)
      .set({
        result: {
          statements: [
            { statement: 0, value: value(mine!.id) },
            { statement: 1, value: value(other!.id) },
          ],
        },
      })
      .where(eq(cells.id, orphan!.id));

    const cancel = await owner.request(`/api/sessions/${sessionId}/cells/${orphan!.id}/cancel`, { method: "POST" });
    expect(cancel.status).toBe(200);
    expect((await experimentOf(mine!.id)).status).toBe("cancelled");
    expect((await experimentOf(other!.id)).status).toBe("queued");
    const cell = await storedCell(orphan!.id);
    expect(cell.status).toBe("cancelled");
    expect(cell.stopped).toMatch(/cancelled after the server running it had stopped, and so was its background experiment$/);
    await db().update(experiments).set({ status: "cancelled" }).where(eq(experiments.id, other!.id));
  });
});
