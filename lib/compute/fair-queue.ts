/// The queue in front of the engine slots: one line per user, served round robin, with a cap
/// on how many slots one user may hold and bounds on how much may wait. Pure bookkeeping
/// (no timers, no processes) so its fairness can be tested alone.
import type { LimitName } from "../limits";

export interface FairQueueBounds {
  /// slots one user may hold at once
  userRunning: number;
  /// computations one user may have waiting
  userQueued: number;
  /// computations waiting, all users together
  engineQueue: number;
}

/// A refusal: nothing was queued. `limit` names the bound in lib/limits.ts.
export class EngineFullError extends Error {
  readonly kind = "limit" as const;
  constructor(
    readonly limit: Extract<LimitName, "userQueued" | "engineQueue">,
    readonly bound: number,
    readonly retryAfterSeconds: number,
  ) {
    super(
      limit === "userQueued"
        ? `you already have ${bound} computations waiting (limit userQueued = ${bound}); try again when one has finished`
        : `the engine is full: ${bound} computations are waiting (limit engineQueue = ${bound}); try again shortly`,
    );
    this.name = "EngineFullError";
  }
}

/// Whether `error` is an EngineFullError — also one thrown by another bundle's copy of this
/// module (Next bundles instrumentation and routes apart; the pool is shared through globalThis).
export function isEngineFull(error: unknown): error is EngineFullError {
  return (
    error instanceof EngineFullError ||
    (error instanceof Error && error.name === "EngineFullError" && (error as { kind?: unknown }).kind === "limit")
  );
}

export class FairQueue<T> {
  /// Users with something waiting, in serving order: a served user moves to the back.
  private readonly lines = new Map<string, T[]>();
  private readonly holding = new Map<string, number>();
  private waitingCount = 0;

  constructor(private readonly bounds: FairQueueBounds) {}

  get waiting(): number {
    return this.waitingCount;
  }

  running(user: string): number {
    return this.holding.get(user) ?? 0;
  }

  waitingFor(user: string): number {
    return this.lines.get(user)?.length ?? 0;
  }

  /// Queues `item` for `user`, or throws EngineFullError (and queues nothing).
  push(user: string, item: T, retryAfterSeconds = 10): void {
    if (this.waitingFor(user) >= this.bounds.userQueued) throw new EngineFullError("userQueued", this.bounds.userQueued, retryAfterSeconds);
    if (this.waitingCount >= this.bounds.engineQueue) throw new EngineFullError("engineQueue", this.bounds.engineQueue, retryAfterSeconds);
    const line = this.lines.get(user);
    if (line) line.push(item);
    else this.lines.set(user, [item]);
    this.waitingCount++;
  }

  /// The next item to run: the first user in serving order below their cap. The user is
  /// counted as holding one more slot until `release(user)` and moves to the back of the order.
  take(): { user: string; item: T } | undefined {
    for (const [user, line] of this.lines) {
      if (this.running(user) >= this.bounds.userRunning) continue;
      const item = line.shift()!;
      this.waitingCount--;
      this.lines.delete(user);
      if (line.length > 0) this.lines.set(user, line);
      this.holding.set(user, this.running(user) + 1);
      return { user, item };
    }
    return undefined;
  }

  /// A slot the user held is free again.
  release(user: string): void {
    const n = this.running(user) - 1;
    if (n > 0) this.holding.set(user, n);
    else this.holding.delete(user);
  }

  /// Takes a waiting item out of the queue (a cancel before it ran); false when not waiting.
  remove(user: string, item: T): boolean {
    const line = this.lines.get(user);
    const at = line?.indexOf(item) ?? -1;
    if (!line || at < 0) return false;
    line.splice(at, 1);
    this.waitingCount--;
    if (line.length === 0) this.lines.delete(user);
    return true;
  }

  /// Every waiting item, emptying the queue.
  drain(): T[] {
    const all = [...this.lines.values()].flat();
    this.lines.clear();
    this.waitingCount = 0;
    return all;
  }
}
