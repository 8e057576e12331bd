import { afterAll, describe, expect, it } from "vitest";
import path from "node:path";
import { PoolBusyError, WorkerPool } from "../../lib/compute/pool";

const pool = new WorkerPool({
  entry: path.resolve(__dirname, "fixtures/jobs.ts"),
  size: 2,
  maxQueue: 2,
  heapLimitMb: 64,
  graceMs: 500,
});
afterAll(() => pool.close());

describe("WorkerPool", () => {
  it("runs a job and forwards its events in order", async () => {
    const events: unknown[] = [];
    const end = await pool.submit({ kind: "echo", value: 42 }, { timeLimitMs: 10_000, onEvent: (e) => events.push(e) }).done;
    expect(end).toEqual({ status: "finished", outcome: { echoed: 42 } });
    expect(events).toEqual([{ step: 1 }, { step: 2 }]);
  });

  it("cancels a job through the shared flag and keeps its partial outcome", async () => {
    const handle = pool.submit({ kind: "poll" }, { timeLimitMs: 10_000 });
    setTimeout(() => handle.cancel(), 200);
    expect(await handle.done).toEqual({ status: "cancelled", outcome: { stoppedAfter: true } });
  });

  it("ends a job with a time limit", async () => {
    const end = await pool.submit({ kind: "poll" }, { timeLimitMs: 300 }).done;
    expect(end.status).toBe("limit");
    expect(end.status === "limit" && end.limit).toBe("time");
  });

  it("kills a worker that ignores the flag and keeps serving", async () => {
    const handle = pool.submit({ kind: "spin" }, { timeLimitMs: 10_000 });
    setTimeout(() => handle.cancel(), 200);
    expect((await handle.done).status).toBe("cancelled");
    const again = await pool.submit({ kind: "echo", value: "after" }, { timeLimitMs: 10_000 }).done;
    expect(again).toEqual({ status: "finished", outcome: { echoed: "after" } });
  });

  it("ends a job that exhausts its heap with a memory limit", async () => {
    const end = await pool.submit({ kind: "hog" }, { timeLimitMs: 60_000 }).done;
    expect(end.status).toBe("limit");
    expect(end.status === "limit" && end.limit).toBe("memory");
  });

  it("reports a job that throws", async () => {
    expect(await pool.submit({ kind: "throw" }, { timeLimitMs: 10_000 }).done).toEqual({ status: "crashed", message: "deliberate failure" });
  });

  it("refuses jobs beyond the queue bound", async () => {
    const running = [pool.submit({ kind: "poll" }, { timeLimitMs: 10_000 }), pool.submit({ kind: "poll" }, { timeLimitMs: 10_000 })];
    const queued = [pool.submit({ kind: "echo", value: 1 }, { timeLimitMs: 10_000 }), pool.submit({ kind: "echo", value: 2 }, { timeLimitMs: 10_000 })];
    expect(() => pool.submit({ kind: "echo", value: 3 }, { timeLimitMs: 10_000 })).toThrow(PoolBusyError);
    await new Promise((r) => setTimeout(r, 100));
    running.forEach((h) => h.cancel());
    expect((await queued[1].done).status).toBe("finished");
  });
});
