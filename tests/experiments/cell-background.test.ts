/// A sweep in a cell, over HTTP against the production server and the real database
/// (notation.md §11; grammar/README.md "Families, sweeps and searches"): a sweep of more
/// than `inlineSweepMembers` (25) members becomes a durable experiment — the stored cell's
/// value is an Experiment whose id reads back from GET /api/experiments/:id and whose rows a
/// worker completes — while a small sweep stays inline (a Table) and background = false
/// forces inline.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { startWorker, stopGently, waitFor, type Proc } from "./helpers";

const owner = new TestClient(testAddress(186));
let sessionId = "";
let worker: Proc;

beforeAll(async () => {
  await ensureTestGroup(); // creates the fixture accounts
  expect((await owner.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
  const created = await owner.json("/api/sessions", { title: "sweeps in cells" });
  expect(created.status).toBe(201);
  sessionId = ((await created.json()) as { id: string }).id;
  // the shared test server runs without an embedded worker
  worker = startWorker("cell-background", 1);
});

afterAll(async () => {
  if (worker) await stopGently(worker);
  await closeDb();
});

type ValueJson = { type: string; text: string; [k: string]: unknown };
type StreamEvent = { event: string; cellId?: string; value?: ValueJson; status?: string; objects?: { name: string; type: string }[] };

async function runCell(source: string): Promise<{ events: StreamEvent[]; cellId: string; last: ValueJson; status: string }> {
  const r = await owner.json(`/api/sessions/${sessionId}/cells`, { source });
  expect(r.status).toBe(200);
  const events = (await r.text())
    .trim()
    .split("\n")
    .map((l) => JSON.parse(l) as StreamEvent);
  const results = events.filter((e) => e.event === "result");
  const done = events.find((e) => e.event === "done")!;
  return {
    events,
    cellId: events.find((e) => e.event === "accepted")!.cellId!,
    last: results[results.length - 1].value!,
    status: done.status!,
  };
}

async function storedValue(cellId: string): Promise<ValueJson> {
  const r = await owner.request(`/api/sessions/${sessionId}/cells`);
  const cells = ((await r.json()) as { cells: { id: string; results: { value: ValueJson }[] }[] }).cells;
  const cell = cells.find((c) => c.id === cellId)!;
  return cell.results[cell.results.length - 1].value;
}

async function experimentCount(): Promise<number> {
  const r = await owner.request(`/api/experiments?session=${sessionId}`);
  return ((await r.json()) as { experiments: unknown[] }).experiments.length;
}

// The members S / m^p of S = Q[x, y], m = (x, y): the monomials of degree < p form a basis of
// S/m^p, so its length is 1 + 2 + … + p = p(p+1)/2 (common practice: counting monomials).
const family = (n: number) => `S := Q[x, y]\nF := family([S / S.maximal^p for p in 1..${n}])\n`;
const length = (p: number) => String((p * (p + 1)) / 2);

describe("a sweep in a cell", () => {
  it("of 30 members (> inlineSweepMembers) stores an Experiment that a worker completes", async () => {
    const before = await experimentCount();
    const cell = await runCell(family(30) + "T := sweep(F, R -> {len: R.length})");
    expect(cell.status).toBe("done");
    expect(cell.last).toMatchObject({ type: "Experiment", status: "queued", done: 0, total: 30, failures: 0 });
    expect(cell.last.text).toMatch(/0\/30 members done — runs in the background/);
    // no rows were streamed inline
    expect(cell.events.filter((e) => e.event === "partial")).toHaveLength(0);
    const T = cell.events.find((e) => e.event === "done")!.objects!.find((o) => o.name === "T")!;
    expect(T.type).toBe("Experiment");

    const stored = await storedValue(cell.cellId);
    expect(stored).toMatchObject({ type: "Experiment", id: cell.last.id, total: 30 });
    const id = stored.id as string;

    const read = await owner.request(`/api/experiments/${id}`);
    expect(read.status).toBe(200);
    const e = (
      (await read.json()) as { experiment: { id: string; total: number; sourceCellId: string; program: string; familyDefinition: string } }
    ).experiment;
    expect(e).toMatchObject({ id, total: 30, sourceCellId: cell.cellId });
    expect(e.program).toContain("sweep(F, R -> {len: R.length})");
    expect(e.familyDefinition).toMatch(/^family\(\[/);
    expect(await experimentCount()).toBe(before + 1);

    await waitFor(
      async () => {
        const x = ((await (await owner.request(`/api/experiments/${id}`)).json()) as { experiment: { status: string } }).experiment;
        return x.status === "done";
      },
      180_000,
      () => `experiment ${id} did not finish:\n${worker.output()}`,
    );
    const rows = (
      (await (await owner.request(`/api/experiments/${id}/rows?limit=100`)).json()) as {
        rows: { index: number; status: string; fields: Record<string, { text: string }> }[];
      }
    ).rows;
    expect(rows).toHaveLength(30);
    expect(rows.map((r) => r.index)).toEqual([...Array(30).keys()]);
    for (const r of rows) {
      expect(r.status).toBe("ok");
      expect(r.fields.len.text).toBe(length(r.index + 1));
    }
  });

  it("of 5 members stays inline: a Table streamed row by row, no experiment", async () => {
    const before = await experimentCount();
    const cell = await runCell(family(5) + "sweep(F, R -> {len: R.length})");
    expect(cell.status).toBe("done");
    expect(cell.last.type).toBe("Table");
    const rows = cell.last.rows as { text: string }[][];
    expect(rows.map((r) => r[r.length - 1].text)).toEqual([1, 2, 3, 4, 5].map(length));
    expect(cell.events.filter((e) => e.event === "partial")).toHaveLength(5);
    expect((await storedValue(cell.cellId)).type).toBe("Table");
    expect(await experimentCount()).toBe(before);
  });

  it("background = false runs 30 members inline; background = true sends 2 to the background", async () => {
    const before = await experimentCount();
    const inline = await runCell(family(30) + "sweep(F, R -> {len: R.length}, background = false)");
    expect(inline.status).toBe("done");
    expect(inline.last.type).toBe("Table");
    const rows = inline.last.rows as { text: string }[][];
    expect(rows).toHaveLength(30);
    expect(rows[29][rows[29].length - 1].text).toBe(length(30));
    expect(await experimentCount()).toBe(before);

    const background = await runCell(family(2) + "sweep(F, R -> {len: R.length}, background = true)");
    expect(background.last).toMatchObject({ type: "Experiment", total: 2 });
    expect((await owner.request(`/api/experiments/${background.last.id as string}`)).status).toBe(200);
    expect(await experimentCount()).toBe(before + 1);
  });
});
