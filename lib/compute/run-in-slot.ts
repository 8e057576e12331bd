/// The one way to run a computation with Ringside's isolation and limits: `runInSlot`.
/// Cells (lib/sessions/run-cell.ts) and experiment members call it alike; see README.md here.
import os from "node:os";
import path from "node:path";
import { limitValue } from "../limits";
import type { CellEvent, CellJob, CellJobOutcome } from "./cell-events";
import { SlotPool, type JobEnd } from "./slot-pool";

export { EngineFullError, isEngineFull } from "./fair-queue";
export type { JobEnd } from "./slot-pool";

/// One computation: who asks (the fair queue serves users round robin) and the program.
export interface SlotJob {
  /// the user the computation is for (a user id; experiments use their owner's)
  user: string;
  payload: CellJob;
}

export interface RunInSlotOptions {
  /// every event of the computation, in order (checked, progress, partial, result, bound, error)
  onEvent?: (event: CellEvent) => void;
  /// aborting it stops the computation; the outcome is then "cancelled" with the work done
  signal?: AbortSignal;
  /// tighter bounds for this computation than lib/limits.ts gives (time, resident memory)
  limits?: { cellTimeMs?: number; cellMemoryMb?: number };
}

/// How the computation ended; `outcome` (when the evaluator returned) is a CellJobOutcome.
export type SlotOutcome = JobEnd & { outcome?: CellJobOutcome };

/// Engine settings in force: lib/limits.ts, with the slot count following the machine when
/// RINGSIDE_ENGINE_WORKERS is unset, and a user's cap one below it so one slot stays free.
export function engineSettings() {
  const slots = process.env.RINGSIDE_ENGINE_WORKERS
    ? limitValue("engineSlots")
    : Math.max(limitValue("engineSlots"), os.availableParallelism() - 1);
  const userRunning = process.env.RINGSIDE_USER_RUNNING ? limitValue("userRunning") : Math.max(limitValue("userRunning"), slots - 1);
  return {
    slots,
    userRunning,
    userQueued: limitValue("userQueued"),
    engineQueue: limitValue("engineQueue"),
    heapLimitMb: limitValue("cellHeapMb"),
    memoryLimitMb: limitValue("cellMemoryMb"),
    timeLimitMs: limitValue("cellTimeMs"),
    graceMs: limitValue("stopGraceMs"),
    jobsPerSlot: limitValue("slotJobs"),
  };
}

const holder = globalThis as typeof globalThis & { __ringsideSlotPool?: SlotPool };

/// The process-wide slots (started on first use, all at once so later cells find one warm).
export function slotPool(): SlotPool {
  if (!holder.__ringsideSlotPool) {
    const root = process.env.RINGSIDE_ROOT ?? process.cwd();
    const s = engineSettings();
    holder.__ringsideSlotPool = new SlotPool({
      entry: path.join(root, "lib", "compute", "cell-job.ts"),
      slots: s.slots,
      userRunning: s.userRunning,
      userQueued: s.userQueued,
      engineQueue: s.engineQueue,
      heapLimitMb: s.heapLimitMb,
      memoryLimitMb: s.memoryLimitMb,
      graceMs: s.graceMs,
      jobsPerSlot: s.jobsPerSlot,
      warm: true,
    });
  }
  return holder.__ringsideSlotPool;
}

/// Runs `job` in an engine slot. Throws EngineFullError at once — before anything is queued
/// or stored — when the user's queue or the engine's is full; otherwise resolves when the
/// computation ends (finished, cancelled, a limit, or a crash), never rejects.
export function runInSlot(job: SlotJob, options: RunInSlotOptions = {}): Promise<SlotOutcome> {
  const settings = engineSettings();
  const handle = slotPool().submit(job.payload, {
    user: job.user,
    onEvent: options.onEvent as ((event: unknown) => void) | undefined,
    timeLimitMs: Math.min(options.limits?.cellTimeMs ?? settings.timeLimitMs, settings.timeLimitMs),
    memoryLimitMb: options.limits?.cellMemoryMb,
  });
  const signal = options.signal;
  if (signal) {
    if (signal.aborted) handle.cancel();
    else signal.addEventListener("abort", () => handle.cancel(), { once: true });
  }
  return handle.done as Promise<SlotOutcome>;
}
