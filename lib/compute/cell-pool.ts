/// The process-wide pool that runs cells, configured from the environment.
import os from "node:os";
import path from "node:path";
import { WorkerPool } from "./pool";

export interface CellLimits {
  timeLimitMs: number;
  heapLimitMb: number;
}

function numberFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  const value = raw === undefined ? NaN : Number(raw);
  return Number.isFinite(value) && value > 0 ? value : fallback;
}

/// RINGSIDE_CELL_TIME_LIMIT_MS (default 10 minutes), RINGSIDE_CELL_HEAP_MB (default 2048),
/// RINGSIDE_ENGINE_WORKERS (default: cores − 1, at least 2), RINGSIDE_ENGINE_QUEUE (default 32).
export function cellLimits(): CellLimits {
  return {
    timeLimitMs: numberFromEnv("RINGSIDE_CELL_TIME_LIMIT_MS", 10 * 60 * 1000),
    heapLimitMb: numberFromEnv("RINGSIDE_CELL_HEAP_MB", 2048),
  };
}

const holder = globalThis as typeof globalThis & { __ringsideCellPool?: WorkerPool };

export function cellPool(): WorkerPool {
  if (!holder.__ringsideCellPool) {
    const root = process.env.RINGSIDE_ROOT ?? process.cwd();
    holder.__ringsideCellPool = new WorkerPool({
      entry: path.join(root, "lib", "compute", "cell-job.ts"),
      size: numberFromEnv("RINGSIDE_ENGINE_WORKERS", Math.max(2, os.availableParallelism() - 1)),
      maxQueue: numberFromEnv("RINGSIDE_ENGINE_QUEUE", 32),
      heapLimitMb: cellLimits().heapLimitMb,
      graceMs: 3000,
    });
  }
  return holder.__ringsideCellPool;
}
