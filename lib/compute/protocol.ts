/// Messages between the pool (main thread) and a worker thread.

export type ToWorker = { type: "run"; jobId: number; payload: unknown; flag: SharedArrayBuffer };

export type FromWorker =
  | { type: "ready" }
  | { type: "event"; jobId: number; event: unknown }
  | { type: "finished"; jobId: number; outcome: unknown }
  | { type: "failed"; jobId: number; message: string };

/// What a worker's job module exports: one function run once per job.
export interface JobContext {
  signal: AbortSignal;
  emit(event: unknown): void;
}
export type JobHandler = (payload: unknown, context: JobContext) => Promise<unknown> | unknown;
