import { afterAll, describe, expect, it } from "vitest";
import path from "node:path";
import { readdirSync, readFileSync } from "node:fs";
import { EngineFullError } from "../../lib/compute/fair-queue";
import { residentMb, SlotPool, type SubmitOptions } from "../../lib/compute/slot-pool";

const pool = new SlotPool({
  entry: path.resolve(__dirname, "fixtures/jobs.ts"),
  slots: 2,
  userRunning: 2,
  userQueued: 2,
  engineQueue: 2,
  heapLimitMb: 64,
  memoryLimitMb: 300,
  graceMs: 500,
  jobsPerSlot: 100,
});
afterAll(() => pool.close());

const opts = (extra: Partial<SubmitOptions> = {}): SubmitOptions => ({ user: "u1", timeLimitMs: 10_000, ...extra });

describe("SlotPool (engine slots as child processes)", () => {
  it("runs a job and forwards its events in order", async () => {
    const events: unknown[] = [];
    const end = await pool.submit({ kind: "echo", value: 42 }, opts({ onEvent: (e) => events.push(e) })).done;
    expect(end).toEqual({ status: "finished", outcome: { echoed: 42 } });
    expect(events).toEqual([{ step: 1 }, { step: 2 }]);
  });

  it("runs jobs in a child process, not in the test's process", async () => {
    const end = await pool.submit({ kind: "pid" }, opts()).done;
    expect(end.status).toBe("finished");
    const pid = (end as { outcome: { pid: number } }).outcome.pid;
    expect(pid).not.toBe(process.pid);
  });

  it("cancels a job through the shared flag and keeps its partial outcome", async () => {
    const handle = pool.submit({ kind: "poll" }, opts());
    setTimeout(() => handle.cancel(), 200);
    expect(await handle.done).toEqual({ status: "cancelled", outcome: { stoppedAfter: true } });
  });

  it("ends a job with a time limit", async () => {
    const end = await pool.submit({ kind: "poll" }, opts({ timeLimitMs: 300 })).done;
    expect(end.status).toBe("limit");
    expect(end.status === "limit" && end.limit).toBe("time");
  });

  it("kills a slot that ignores the flag and keeps serving", async () => {
    const handle = pool.submit({ kind: "spin" }, opts());
    setTimeout(() => handle.cancel(), 200);
    expect((await handle.done).status).toBe("cancelled");
    const again = await pool.submit({ kind: "echo", value: "after" }, opts()).done;
    expect(again).toEqual({ status: "finished", outcome: { echoed: "after" } });
  });

  it("ends a job that exhausts its heap with a memory limit", async () => {
    const end = await pool.submit({ kind: "hog" }, opts({ timeLimitMs: 60_000 })).done;
    expect(end.status).toBe("limit");
    expect(end.status === "limit" && end.limit).toBe("memory");
  });

  it("kills a slot whose typed arrays pass the resident-memory bound, names the bound, and replaces the slot", async () => {
    const before = residentMb(process.pid)!;
    const end = await pool.submit({ kind: "typed-hog" }, opts({ timeLimitMs: 60_000, memoryLimitMb: 200 })).done;
    expect(end.status).toBe("limit");
    if (end.status !== "limit") return;
    expect(end.limit).toBe("memory");
    expect(end.name).toBe("cellMemoryMb");
    expect(end.message).toMatch(/200 MB/);
    // The arrays lived in the slot, not here (generous: this process may grow for other reasons).
    expect(residentMb(process.pid)!).toBeLessThan(before + 150);
    const again = await pool.submit({ kind: "echo", value: "fresh slot" }, opts()).done;
    expect(again).toEqual({ status: "finished", outcome: { echoed: "fresh slot" } });
  });

  it("lowers the priority of every thread of a slot whose computation runs long", async () => {
    let pid = 0;
    const handle = pool.submit({ kind: "poll-pid" }, opts({ onEvent: (e) => (pid = (e as { pid: number }).pid) }));
    await new Promise((r) => setTimeout(r, 1800));
    expect(pid).toBeGreaterThan(0);
    const nices = readdirSync(`/proc/${pid}/task`).map((tid) =>
      Number(readFileSync(`/proc/${pid}/task/${tid}/stat`, "utf8").split(") ")[1]!.split(" ")[16]),
    );
    expect(nices.length).toBeGreaterThan(1);
    expect(new Set(nices)).toEqual(new Set([10]));
    handle.cancel();
    expect((await handle.done).status).toBe("cancelled");
  });

  it("reports a job that throws", async () => {
    expect(await pool.submit({ kind: "throw" }, opts()).done).toEqual({ status: "crashed", message: "deliberate failure" });
  });

  it("refuses jobs beyond the queue bound", async () => {
    const running = [pool.submit({ kind: "poll" }, opts()), pool.submit({ kind: "poll" }, opts())];
    const queued = [pool.submit({ kind: "echo", value: 1 }, opts()), pool.submit({ kind: "echo", value: 2 }, opts())];
    expect(() => pool.submit({ kind: "echo", value: 3 }, opts())).toThrow(EngineFullError);
    await new Promise((r) => setTimeout(r, 100));
    running.forEach((h) => h.cancel());
    expect((await queued[1].done).status).toBe("finished");
  });
});
