/// Bounded concurrency for bcrypt. bcryptjs runs on the server's own event loop, so a flood
/// of sign-ins with wrong passwords would otherwise keep every core hashing and starve every
/// other request. At most HASH_SLOTS hashes run at once; up to MAX_WAITING more wait their
/// turn in arrival order, and beyond that callers are told to come back later (the sign-in
/// and sign-up routes answer 503 with Retry-After instead of queueing without bound).

export const HASH_SLOTS = positive(process.env.RINGSIDE_HASH_CONCURRENCY, 2);
export const MAX_WAITING = positive(process.env.RINGSIDE_HASH_QUEUE, 32);

function positive(raw: string | undefined, fallback: number): number {
  const n = Number(raw);
  return Number.isInteger(n) && n > 0 ? n : fallback;
}

/// Thrown by withHashSlot when MAX_WAITING callers are already waiting.
export class HashQueueFull extends Error {
  constructor() {
    super("Too many sign-ins are being checked right now; try again in a few seconds.");
    this.name = "HashQueueFull";
  }
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
