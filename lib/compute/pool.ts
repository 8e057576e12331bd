import { Worker } from "node:worker_threads";
import path from "node:path";
import type { FromWorker, ToWorker } from "./protocol";
import { createStopFlag, raiseStopFlag, StopReason } from "./shared-signal";

/// How a job ended. `outcome` is whatever the job module returned, when it returned.
export type JobEnd =
  | { status: "finished"; outcome: unknown }
  | { status: "cancelled"; outcome?: unknown }
  | { status: "limit"; limit: "time" | "memory"; message: string; outcome?: unknown }
  | { status: "crashed"; message: string };

export interface JobHandle {
  /// Ask the job to stop; the worker is terminated if it does not stop within the grace time.
  cancel(): void;
  done: Promise<JobEnd>;
}

export interface PoolOptions {
  /// Absolute path of the TypeScript module exporting `handleJob`.
  entry: string;
  size: number;
  /// Jobs waiting beyond this many are refused with PoolBusyError.
  maxQueue: number;
  heapLimitMb: number;
  /// Time a stopped job gets to return its partial outcome before its worker is killed.
  graceMs: number;
}

export interface SubmitOptions {
  onEvent?: (event: unknown) => void;
  timeLimitMs: number;
}

export class PoolBusyError extends Error {
  constructor(queued: number) {
    super(`the engine is busy: ${queued} computations are already waiting; try again shortly`);
    this.name = "PoolBusyError";
  }
}

interface Job {
  id: number;
  payload: unknown;
  options: SubmitOptions;
  flag: SharedArrayBuffer;
  stop: StopReason;
  ended: boolean;
  resolve(end: JobEnd): void;
  timer?: NodeJS.Timeout;
  killTimer?: NodeJS.Timeout;
  slot?: Slot;
}

interface Slot {
  worker: Worker;
  ready: Promise<void>;
  job?: Job;
}

const BOOT = "worker-boot.mjs";

export class WorkerPool {
  private readonly slots: (Slot | undefined)[];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(private readonly options: PoolOptions) {
    this.slots = new Array(options.size).fill(undefined);
  }

  submit(payload: unknown, options: SubmitOptions): JobHandle {
    if (this.closed) throw new Error("WorkerPool.submit: the pool is closed");
    if (this.queue.length >= this.options.maxQueue) throw new PoolBusyError(this.queue.length);
    let resolve!: (end: JobEnd) => void;
    const done = new Promise<JobEnd>((r) => (resolve = r));
    const job: Job = { id: this.nextId++, payload, options, flag: createStopFlag(), stop: StopReason.None, ended: false, resolve };
    this.queue.push(job);
    this.dispatch();
    return { cancel: () => this.stop(job, StopReason.Cancelled), done };
  }

  /// Terminates every worker; running jobs end as cancelled.
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) this.finish(job, { status: "cancelled" });
    await Promise.all(
      this.slots.map(async (slot) => {
        if (!slot) return;
        if (slot.job) this.finish(slot.job, { status: "cancelled" });
        await slot.worker.terminate();
      }),
    );
  }

  private stop(job: Job, reason: StopReason): void {
    if (job.stop !== StopReason.None) return;
    job.stop = reason;
    raiseStopFlag(job.flag, reason);
    const queued = this.queue.indexOf(job);
    if (queued >= 0) {
      this.queue.splice(queued, 1);
      this.finish(job, this.stoppedEnd(job));
      return;
    }
    // The engine polls the flag; a worker stuck outside the engine is killed after the grace time.
    job.killTimer = setTimeout(() => {
      const slot = job.slot;
      if (!slot || slot.job !== job) return;
      this.finish(job, this.stoppedEnd(job));
      this.discard(slot);
    }, this.options.graceMs);
  }

  private stoppedEnd(job: Job, outcome?: unknown): JobEnd {
    if (job.stop === StopReason.TimeLimit) {
      const seconds = job.options.timeLimitMs / 1000;
      return { status: "limit", limit: "time", message: `time limit of ${seconds} s reached`, outcome };
    }
    return { status: "cancelled", outcome };
  }

  private dispatch(): void {
    for (let i = 0; i < this.slots.length && this.queue.length > 0; i++) {
      const slot = this.slots[i] ?? (this.slots[i] = this.spawn(i));
      if (slot.job) continue;
      const job = this.queue.shift()!;
      slot.job = job;
      job.slot = slot;
      void slot.ready.then(() => {
        if (slot.job !== job) return;
        job.timer = setTimeout(() => this.stop(job, StopReason.TimeLimit), job.options.timeLimitMs);
        const message: ToWorker = { type: "run", jobId: job.id, payload: job.payload, flag: job.flag };
        slot.worker.postMessage(message);
      });
    }
  }

  private spawn(index: number): Slot {
    // Constructed indirectly so Next's bundler leaves the worker's files alone: the worker
    // bundles its job from the source tree itself (worker-boot.mjs).
    const worker: Worker = Reflect.construct(Worker, [
      path.join(workerDirectory(), BOOT),
      {
        workerData: { entry: this.options.entry },
        resourceLimits: { maxOldGenerationSizeMb: this.options.heapLimitMb },
        stdout: false,
        stderr: false,
      },
    ]);
    worker.unref();
    let markReady!: () => void;
    const slot: Slot = { worker, ready: new Promise<void>((r) => (markReady = r)) };
    worker.on("message", (message: FromWorker) => {
      if (message.type === "ready") return markReady();
      const job = slot.job;
      if (!job || message.jobId !== job.id) return;
      if (message.type === "event") job.options.onEvent?.(message.event);
      else if (message.type === "finished")
        this.finish(job, job.stop === StopReason.None ? { status: "finished", outcome: message.outcome } : this.stoppedEnd(job, message.outcome));
      else this.finish(job, job.stop === StopReason.None ? { status: "crashed", message: message.message } : this.stoppedEnd(job));
    });
    const onDeath = (err?: Error) => {
      if (this.slots[index] === slot) this.slots[index] = undefined;
      const job = slot.job;
      if (job) {
        const outOfMemory = (err as { code?: string } | undefined)?.code === "ERR_WORKER_OUT_OF_MEMORY";
        this.finish(
          job,
          outOfMemory
            ? { status: "limit", limit: "memory", message: `memory limit of ${this.options.heapLimitMb} MB reached` }
            : job.stop !== StopReason.None
              ? this.stoppedEnd(job)
              : { status: "crashed", message: err?.message ?? "the engine worker stopped unexpectedly" },
        );
      }
      markReady();
      if (!this.closed) this.dispatch();
    };
    worker.on("error", onDeath);
    worker.on("exit", () => onDeath());
    return slot;
  }

  private finish(job: Job, end: JobEnd): void {
    if (job.ended) return;
    job.ended = true;
    clearTimeout(job.timer);
    clearTimeout(job.killTimer);
    const slot = job.slot;
    if (slot && slot.job === job) slot.job = undefined;
    job.slot = undefined;
    job.resolve(end);
    if (!this.closed) queueMicrotask(() => this.dispatch());
  }

  private discard(slot: Slot): void {
    const index = this.slots.indexOf(slot);
    if (index >= 0) this.slots[index] = undefined;
    void slot.worker.terminate();
  }
}

// Resolved at run time from the working directory, not from the bundle: Next bundles route
// handlers into .next/, but the worker files stay in the source tree.
function workerDirectory(): string {
  return path.join(process.env.RINGSIDE_ROOT ?? process.cwd(), "lib", "compute");
}
