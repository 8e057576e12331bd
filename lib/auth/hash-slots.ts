/// Bounded concurrency for bcrypt. bcryptjs runs on the server's own event loop, so a flood
/// of sign-ins with wrong passwords would otherwise keep every core hashing and starve every
/// other request. At most `hashConcurrency` hashes run at once; up to `hashQueue` more wait
/// their turn in arrival order, and beyond that callers are told to come back later (the
/// sign-in and sign-up routes answer 503 with Retry-After and kind `limit` instead of
/// queueing without bound). Both are rows of lib/limits.ts.
import { limitValue } from "../limits";

export const HASH_SLOTS = Math.max(1, Math.floor(limitValue("hashConcurrency")));
export const MAX_WAITING = Math.max(1, Math.floor(limitValue("hashQueue")));

/// Seconds a refused caller is told to wait (Retry-After): a queue of `hashQueue` drains in
/// well under this at bcrypt's usual cost.
export const HASH_RETRY_AFTER_SECONDS = 5;

/// What a refused sign-in or sign-up reads (the refusal names the limit `hashQueue`).
export const HASH_QUEUE_FULL_MESSAGE = "Too many sign-ins are being checked right now; try again in a few seconds";

/// Thrown by withHashSlot when MAX_WAITING callers are already waiting.
export class HashQueueFull extends Error {
  constructor() {
    super(HASH_QUEUE_FULL_MESSAGE);
    this.name = "HashQueueFull";
  }
}

/// Whether `error` is a HashQueueFull — also one thrown by another bundle's copy of this
/// module (Next may bundle routes apart; the queue itself is shared through globalThis).
export function isHashQueueFull(error: unknown): error is HashQueueFull {
  return error instanceof Error && error.name === "HashQueueFull";
}

// One queue per process, even when the bundler gives several routes their own copy of
// this module.
const KEY = Symbol.for("ringside.hashSlots");
const state = ((globalThis as Record<symbol, unknown>)[KEY] ??= { running: 0, waiting: [] }) as {
  running: number;
  waiting: (() => void)[];
};

export async function withHashSlot<T>(work: () => Promise<T>): Promise<T> {
  if (state.running >= HASH_SLOTS) {
    if (state.waiting.length >= MAX_WAITING) throw new HashQueueFull();
    await new Promise<void>((resolve) => state.waiting.push(resolve));
  } else {
    state.running += 1;
  }
  try {
    return await work();
  } finally {
    const next = state.waiting.shift();
    if (next)
      next(); // the slot passes straight to the next caller
    else state.running -= 1;
  }
}

/// Whether a new caller would be refused now (checked before reading anything else).
export function hashQueueFull(): boolean {
  return state.running >= HASH_SLOTS && state.waiting.length >= MAX_WAITING;
}
