/// The fair queue alone (no processes, no database): round robin across users, the per-user
/// cap on slots held, and refusals that queue nothing.
import { describe, expect, it } from "vitest";
import { EngineFullError, FairQueue } from "../../lib/compute/fair-queue";

function takeAll<T>(q: FairQueue<T>, release = true): { user: string; item: T }[] {
  const out: { user: string; item: T }[] = [];
  for (let next = q.take(); next; next = q.take()) {
    out.push(next);
    if (release) q.release(next.user);
  }
  return out;
}

describe("FairQueue", () => {
  it("serves users round robin, not in arrival order", () => {
    const q = new FairQueue<string>({ userRunning: 10, userQueued: 10, engineQueue: 100 });
    for (let i = 1; i <= 4; i++) q.push("alice", `a${i}`);
    q.push("bob", "b1");
    q.push("bob", "b2");
    q.push("carol", "c1");
    expect(takeAll(q).map((t) => t.item)).toEqual(["a1", "b1", "c1", "a2", "b2", "a3", "a4"]);
    expect(q.waiting).toBe(0);
  });

  it("a user who arrives late is served before the heavy user's next item", () => {
    const q = new FairQueue<string>({ userRunning: 1, userQueued: 10, engineQueue: 100 });
    for (let i = 1; i <= 10; i++) q.push("heavy", `h${i}`);
    expect(q.take()).toEqual({ user: "heavy", item: "h1" });
    // heavy holds its one slot: the rest of its line waits, whatever else is free.
    expect(q.take()).toBeUndefined();
    q.push("light", "1 + 1");
    expect(q.take()).toEqual({ user: "light", item: "1 + 1" });
    q.release("heavy");
    expect(q.take()).toEqual({ user: "heavy", item: "h2" });
  });

  it("caps the slots one user holds until they are released", () => {
    const q = new FairQueue<number>({ userRunning: 2, userQueued: 10, engineQueue: 100 });
    for (let i = 0; i < 5; i++) q.push("u", i);
    expect([q.take()?.item, q.take()?.item, q.take()]).toEqual([0, 1, undefined]);
    expect(q.running("u")).toBe(2);
    q.release("u");
    expect(q.take()?.item).toBe(2);
    expect(q.running("u")).toBe(2);
  });

  it("refuses beyond a user's waiting bound and beyond the engine's, queueing nothing", () => {
    const q = new FairQueue<number>({ userRunning: 1, userQueued: 2, engineQueue: 3 });
    q.push("u", 1);
    q.push("u", 2);
    const refusal = (() => {
      try {
        q.push("u", 3, 7);
      } catch (e) {
        return e;
      }
    })();
    expect(refusal).toBeInstanceOf(EngineFullError);
    expect((refusal as EngineFullError).limit).toBe("userQueued");
    expect((refusal as EngineFullError).kind).toBe("limit");
    expect((refusal as EngineFullError).retryAfterSeconds).toBe(7);
    expect(q.waitingFor("u")).toBe(2);
    q.push("v", 1);
    expect(() => q.push("w", 1)).toThrow(/engineQueue = 3/);
    expect(q.waiting).toBe(3);
  });

  it("removes a waiting item (a cancel before it ran) and keeps the order of the rest", () => {
    const q = new FairQueue<string>({ userRunning: 5, userQueued: 5, engineQueue: 10 });
    q.push("a", "a1");
    q.push("a", "a2");
    q.push("b", "b1");
    expect(q.remove("a", "a1")).toBe(true);
    expect(q.remove("a", "a1")).toBe(false);
    expect(takeAll(q).map((t) => t.item)).toEqual(["a2", "b1"]);
  });
});
