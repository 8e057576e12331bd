import { AlgebraError, limitError } from "./errors";

/// Options every long computation accepts.
export interface ComputeOptions {
  /// Polled while computing; once aborted the computation throws AlgebraError kind "cancelled".
  signal?: AbortSignal;
  /// Called at most every ~100 ms while a computation runs. It may abort `signal`.
  progress?: (p: { stage: string; detail?: string; fraction?: number }) => void;
  limits?: { maxBasisSize?: number; maxTerms?: number; maxDegree?: number };
}

export type ProgressInfo = { stage: string; detail?: string; fraction?: number };

const PROGRESS_INTERVAL_MS = 100;
const lastReport = new WeakMap<ComputeOptions, number>();

/// Throws "cancelled" when the signal is aborted; reports progress at most every ~100 ms.
/// Cheap enough for outer loops; hot inner loops should use a Ticker.
export function checkpoint(opts: ComputeOptions | undefined, info?: ProgressInfo | (() => ProgressInfo)): void {
  if (!opts) return;
  if (opts.progress && info) {
    const now = Date.now();
    const last = lastReport.get(opts);
    if (last === undefined || now - last >= PROGRESS_INTERVAL_MS) {
      lastReport.set(opts, now);
      opts.progress(typeof info === "function" ? info() : info);
    }
  }
  if (opts.signal?.aborted) throw cancelled();
}

function cancelled(): AlgebraError {
  return new AlgebraError("cancelled", "computation cancelled");
}

/// Reports a milestone at once (not held back by the ~100 ms interval) and checks the signal:
/// for the few steps a caller should always hear about, such as each new homological and
/// internal degree of a resolution.
export function announce(opts: ComputeOptions | undefined, info: ProgressInfo): void {
  if (!opts) return;
  if (opts.progress) {
    lastReport.set(opts, Date.now());
    opts.progress(info);
  }
  if (opts.signal?.aborted) throw cancelled();
}

/// A checkpoint for hot loops: the clock and the signal are read only every `every` ticks.
export class Ticker {
  private count = 0;
  constructor(
    private readonly opts: ComputeOptions | undefined,
    private readonly info: () => ProgressInfo,
    private readonly every = 512,
  ) {}

  tick(): void {
    if (++this.count < this.every) return;
    this.count = 0;
    checkpoint(this.opts, this.info);
  }
}

/// Throws a "limit" error when `value` exceeds the named limit.
export function checkLimit(
  opts: ComputeOptions | undefined,
  name: "maxBasisSize" | "maxTerms" | "maxDegree",
  value: number,
  what: string,
): void {
  const bound = opts?.limits?.[name];
  if (bound !== undefined && value > bound) {
    throw limitError(name, `${what} reached ${value}, above the limit ${name} = ${bound}`);
  }
}
