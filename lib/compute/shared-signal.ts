/// An AbortSignal look-alike backed by shared memory, so the main thread can abort a worker
/// that is busy in a synchronous loop (a real AbortSignal only flips between event-loop turns).

/// Why a job was stopped, written into the flag's first slot.
export const enum StopReason {
  None = 0,
  Cancelled = 1,
  TimeLimit = 2,
}

/// A signal whose `aborted` reads the shared flag on every access.
export function signalFromStopFlag(flag: SharedArrayBuffer): AbortSignal {
  const cells = new Int32Array(flag);
  const reasonText = () => (Atomics.load(cells, 0) === StopReason.TimeLimit ? "time limit reached" : "cancelled");
  const signal = {
    get aborted() {
      return Atomics.load(cells, 0) !== StopReason.None;
    },
    get reason() {
      return this.aborted ? new Error(reasonText()) : undefined;
    },
    throwIfAborted() {
      if (this.aborted) throw new Error(reasonText());
    },
    onabort: null,
    addEventListener() {},
    removeEventListener() {},
    dispatchEvent() {
      return false;
    },
  };
  return signal as unknown as AbortSignal;
}
