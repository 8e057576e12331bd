/// A value above largeValueBytes leaves its engine slot as a summary (a Complex keeps its ranks
/// and Betti table) with its detail written to disk, and a later computation that uses it gets
/// the whole value back inside its slot. Runs the real cell job in real slots; no database.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import type { CellEvent, CellJob } from "../../lib/compute/cell-events";
import { SlotPool } from "../../lib/compute/slot-pool";

const detailDir = mkdtempSync(path.join(os.tmpdir(), "ringside-details-"));
let pool: SlotPool;

beforeAll(() => {
  // The slots inherit this environment.
  process.env.RINGSIDE_LARGE_VALUE_BYTES = "4000";
  process.env.RINGSIDE_DETAIL_DIR = detailDir;
  pool = new SlotPool({
    entry: path.resolve(__dirname, "../../lib/compute/cell-job.ts"),
    slots: 1,
    userRunning: 1,
    userQueued: 4,
    engineQueue: 4,
    heapLimitMb: 512,
    memoryLimitMb: 1024,
    graceMs: 1000,
    jobsPerSlot: 100,
  });
});
afterAll(async () => {
  await pool.close();
  rmSync(detailDir, { recursive: true, force: true });
  delete process.env.RINGSIDE_LARGE_VALUE_BYTES;
  delete process.env.RINGSIDE_DETAIL_DIR;
});

async function run(job: CellJob): Promise<CellEvent[]> {
  const events: CellEvent[] = [];
  const end = await pool.submit(job, { user: "u", timeLimitMs: 60_000, onEvent: (e) => events.push(e as CellEvent) }).done;
  expect(end.status).toBe("finished");
  return events;
}

describe("large values", () => {
  it("are sent as a summary with the Betti table and a detail marker; the detail holds the whole value", async () => {
    // The Koszul complex of 7 variables: ranks C(7, i) (common practice).
    const events = await run({
      source: "S := GF(32003)[a, b, c, d, e, f, g]\nC := resolve(S / S.maximal)",
      bindings: [],
      currentRing: null,
    });
    const result = events.find((e) => e.event === "result" && e.statement === 1) as Extract<CellEvent, { event: "result" }>;
    const value = result.value as unknown as {
      type: string;
      ranks: number[];
      maps: unknown;
      detail: { id: string; bytes: number; type: string };
      note: string;
    };
    expect(value.type).toBe("Complex");
    expect(value.ranks).toEqual([1, 7, 21, 35, 35, 21, 7, 1]);
    expect(value.maps).toBeNull();
    expect(value.note).toMatch(/largeValueBytes/);
    expect(value.detail.type).toBe("Complex");
    expect(value.detail.bytes).toBeGreaterThan(4000);
    expect(JSON.stringify(value).length).toBeLessThan(4000);
    const file = path.join(detailDir, `${value.detail.id}.json`);
    expect(existsSync(file)).toBe(true);
    const whole = JSON.parse(readFileSync(file, "utf8")) as { maps: unknown[]; ranks: number[] };
    expect(whole.maps).toHaveLength(7);
    expect(whole.ranks).toEqual(value.ranks);
    // The binding carries the same summary (one file for both).
    const bound = events.filter((e) => e.event === "bound" && e.name === "C").at(-1) as Extract<CellEvent, { event: "bound" }>;
    expect((bound.value as unknown as { detail: { id: string } }).detail.id).toBe(value.detail.id);

    // A later cell uses the summarized binding: its differentials come back from the detail.
    const ring = events.filter((e) => e.event === "bound" && e.name === "S").at(-1) as Extract<CellEvent, { event: "bound" }>;
    const later = await run({
      source: "C.map(1) * C.map(2)",
      bindings: [
        { name: "S", type: ring.type, value: ring.value },
        { name: "C", type: bound.type, value: bound.value },
      ],
      currentRing: "S",
    });
    const product = later.find((e) => e.event === "result") as Extract<CellEvent, { event: "result" }> | undefined;
    expect(later.find((e) => e.event === "error")).toBeUndefined();
    // d1 ∘ d2 = 0 in a complex: a 1 × 21 zero matrix.
    const matrix = product!.value as { type: string; cols: number; rows: string[][] };
    expect(matrix.type).toBe("Matrix");
    expect(matrix.cols).toBe(21);
    expect(matrix.rows).toEqual([Array(21).fill("0")]);
  });
});
