/// Bounded bcrypt concurrency (issue 13, item 5): at most HASH_SLOTS hashes run at once,
/// MAX_WAITING more wait in arrival order, and beyond that callers are refused at once
/// instead of queueing without bound.
import { describe, expect, it } from "vitest";
import { HASH_SLOTS, HashQueueFull, hashQueueFull, MAX_WAITING, withHashSlot } from "@/lib/auth/hash-slots";

describe("withHashSlot", () => {
  it("runs at most HASH_SLOTS at once, queues MAX_WAITING in order and refuses the rest", async () => {
    let running = 0;
    let most = 0;
    const order: number[] = [];
    const gates: (() => void)[] = [];
    const task = (i: number) =>
      withHashSlot(async () => {
        running += 1;
        most = Math.max(most, running);
        order.push(i);
        await new Promise<void>((resolve) => gates.push(resolve));
        running -= 1;
        return i;
      });
    const total = HASH_SLOTS + MAX_WAITING + 3;
    const outcomes = Array.from({ length: total }, (_, i) =>
      task(i).then(
        (v) => ({ ok: v }),
        (e: unknown) => ({ error: e }),
      ),
    );
    await new Promise((r) => setTimeout(r, 10));
    expect(running).toBe(HASH_SLOTS);
    expect(hashQueueFull()).toBe(true);
    // release everything that runs, in waves, until all accepted tasks are done
    for (let released = 0; released < HASH_SLOTS + MAX_WAITING; released++) {
      while (gates.length === 0) await new Promise((r) => setTimeout(r, 1));
      gates.shift()!();
      await new Promise((r) => setTimeout(r, 0));
    }
    const settled = await Promise.all(outcomes);
    const refused = settled.filter((s) => "error" in s);
    expect(refused).toHaveLength(3);
    for (const r of refused) expect((r as { error: unknown }).error).toBeInstanceOf(HashQueueFull);
    expect(most).toBe(HASH_SLOTS);
    expect(order).toEqual(Array.from({ length: HASH_SLOTS + MAX_WAITING }, (_, i) => i));
    expect(hashQueueFull()).toBe(false);
  });
});
