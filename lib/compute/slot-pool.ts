/// Engine slots: child processes (slot-process.mjs) that each run one computation at a time,
/// behind a fair queue. Each slot's whole memory is bounded — the V8 heap by its heap limit,
/// everything else (typed arrays, buffers) by a resident-memory watchdog that reads the
/// child's VmRSS from /proc and kills it above the bound — so no computation can take the
/// server's memory. A killed or exhausted slot is replaced; so is one that served
/// `slotJobs` computations or kept much memory after one.
import { fork, type ChildProcess } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { formatLimit } from "../limits";
import { EngineFullError, FairQueue } from "./fair-queue";
import { StopReason } from "./shared-signal";

/// How a job ended. `outcome` is whatever the job module returned, when it returned.
export type JobEnd =
  | { status: "finished"; outcome: unknown }
  | { status: "cancelled"; outcome?: unknown }
  | { status: "limit"; limit: "time" | "memory"; name: "cellTimeMs" | "cellHeapMb" | "cellMemoryMb"; message: string; outcome?: unknown }
  | { status: "crashed"; message: string };

export interface JobHandle {
  /// Ask the job to stop; its slot is killed if it does not stop within the grace time.
  cancel(): void;
  done: Promise<JobEnd>;
}

export interface SlotPoolOptions {
  /// Absolute path of the TypeScript module exporting `handleJob`.
  entry: string;
  slots: number;
  userRunning: number;
  userQueued: number;
  engineQueue: number;
  heapLimitMb: number;
  /// resident memory of a slot process above which the watchdog kills it
  memoryLimitMb: number;
  /// Time a stopped job gets to return its partial outcome before its slot is killed.
  graceMs: number;
  /// computations one slot process serves before it is replaced
  jobsPerSlot: number;
  /// how often the watchdog reads a busy slot's resident memory
  watchEveryMs?: number;
  /// start every slot at once (so the first computation does not wait for a process to boot)
  warm?: boolean;
}

export interface SubmitOptions {
  /// who asked: the fair queue serves users round robin
  user: string;
  onEvent?: (event: unknown) => void;
  timeLimitMs: number;
  /// resident-memory bound for this job (at most the pool's)
  memoryLimitMb?: number;
}

/// A computation that has run this long yields the processor: its slot's threads get a lower
/// priority (nice 10), so short cells and the web server stay quick while long ones run.
const YIELD_AFTER_MS = 1000;
const YIELDING_NICE = 10;

interface Job {
  id: number;
  /// when the slot started it (performance.now())
  startedAt?: number;
  payload: unknown;
  options: SubmitOptions;
  stop: StopReason;
  ended: boolean;
  resolve(end: JobEnd): void;
  timer?: NodeJS.Timeout;
  killTimer?: NodeJS.Timeout;
  slot?: Slot;
  /// the memory bound the watchdog enforced, when it killed the slot
  memoryKill?: number;
}

interface Slot {
  child: ChildProcess;
  ready: boolean;
  dead: boolean;
  served: number;
  /// being killed: takes no new job
  retired?: boolean;
  /// its threads run at the yielding priority
  yielding?: boolean;
  /// the engine thread reported its heap exhausted before the process exited
  heapExhausted?: boolean;
  job?: Job;
}

export class SlotPool {
  private readonly slots: (Slot | undefined)[];
  private readonly queue: FairQueue<Job>;
  private nextId = 1;
  private closed = false;
  private readonly watchdog: NodeJS.Timeout;

  constructor(private readonly options: SlotPoolOptions) {
    this.slots = new Array(options.slots).fill(undefined);
    this.queue = new FairQueue<Job>({ userRunning: options.userRunning, userQueued: options.userQueued, engineQueue: options.engineQueue });
    this.watchdog = setInterval(() => this.watch(), options.watchEveryMs ?? 200);
    this.watchdog.unref();
    if (options.warm) for (let i = 0; i < this.slots.length; i++) this.slots[i] = this.spawn();
  }

  /// Queues a job, or throws EngineFullError at once (nothing is queued then).
  submit(payload: unknown, options: SubmitOptions): JobHandle {
    if (this.closed) throw new Error("SlotPool.submit: the pool is closed");
    let resolve!: (end: JobEnd) => void;
    const done = new Promise<JobEnd>((r) => (resolve = r));
    const job: Job = { id: this.nextId++, payload, options, stop: StopReason.None, ended: false, resolve };
    this.queue.push(options.user, job, Math.max(1, Math.ceil(Math.min(options.timeLimitMs, 30_000) / 1000)));
    this.dispatch();
    return { cancel: () => this.stop(job, StopReason.Cancelled), done };
  }

  /// Counts for monitoring and tests.
  stats(): { slots: number; busy: number; waiting: number } {
    return { slots: this.slots.length, busy: this.slots.filter((s) => s?.job).length, waiting: this.queue.waiting };
  }

  /// Kills every slot; running and waiting jobs end as cancelled.
  async close(): Promise<void> {
    this.closed = true;
    clearInterval(this.watchdog);
    for (const job of this.queue.drain()) this.finish(job, { status: "cancelled" });
    await Promise.all(
      this.slots.map(async (slot) => {
        if (!slot) return;
        if (slot.job) this.finish(slot.job, { status: "cancelled" });
        await this.kill(slot);
      }),
    );
  }

  private stop(job: Job, reason: StopReason): void {
    if (job.ended || job.stop !== StopReason.None) return;
    job.stop = reason;
    if (!job.slot && this.queue.remove(job.options.user, job)) {
      this.finish(job, this.stoppedEnd(job));
      return;
    }
    const slot = job.slot;
    if (slot?.ready) slot.child.send({ type: "stop", jobId: job.id, reason }, () => {});
    // The engine polls the flag; a slot stuck outside the engine is killed after the grace time.
    job.killTimer = setTimeout(() => {
      const s = job.slot;
      if (!s || s.job !== job) return;
      this.finish(job, this.stoppedEnd(job));
      void this.kill(s);
    }, this.options.graceMs);
  }

  private stoppedEnd(job: Job, outcome?: unknown): JobEnd {
    if (job.stop === StopReason.TimeLimit) {
      return {
        status: "limit",
        limit: "time",
        name: "cellTimeMs",
        message: `time limit of ${formatLimit("cellTimeMs", job.options.timeLimitMs)} reached (cellTimeMs)`,
        outcome,
      };
    }
    return { status: "cancelled", outcome };
  }

  private memoryBound(job: Job): number {
    return Math.min(job.options.memoryLimitMb ?? this.options.memoryLimitMb, this.options.memoryLimitMb);
  }

  private dispatch(): void {
    if (this.closed) return;
    for (let i = 0; i < this.slots.length; i++) {
      let slot = this.slots[i];
      if (!slot || slot.dead || slot.retired) slot = this.slots[i] = this.spawn();
      if (slot.job) continue;
      const next = this.queue.take();
      if (!next) return;
      const job = next.item;
      slot.job = job;
      slot.served++;
      job.slot = slot;
      // A slot still booting takes its job when it says it is ready.
      if (slot.ready) this.start(slot, job);
    }
  }

  private start(slot: Slot, job: Job): void {
    job.startedAt = performance.now();
    job.timer = setTimeout(() => this.stop(job, StopReason.TimeLimit), job.options.timeLimitMs);
    slot.child.send({ type: "run", jobId: job.id, payload: job.payload }, (error) => {
      if (error && slot.job === job) this.finish(job, { status: "crashed", message: "the engine slot could not take the computation" });
    });
    // A stop asked for while the slot was booting.
    if (job.stop !== StopReason.None) slot.child.send({ type: "stop", jobId: job.id, reason: job.stop }, () => {});
  }

  private spawn(): Slot {
    // Called indirectly so Next's bundler leaves the slot's files alone (it would try to
    // resolve and bundle a literal fork target): the slot bundles its job itself.
    const child: ChildProcess = Reflect.apply(fork, undefined, [
      path.join(computeDirectory(), "slot-process.mjs"),
      [],
      {
        // The parent's flags (loaders, inspector) do not apply to a slot; its own heap bound does.
        execArgv: [`--max-old-space-size=${this.options.heapLimitMb}`],
        env: { ...process.env, RINGSIDE_SLOT_CONFIG: JSON.stringify({ entry: this.options.entry, heapMb: this.options.heapLimitMb }) },
        stdio: ["ignore", "inherit", "inherit", "ipc"],
        serialization: "advanced",
      },
    ]);
    const slot: Slot = { child, ready: false, dead: false, served: 0 };
    child.on("message", (message: SlotMessage) => this.onMessage(slot, message));
    child.on("error", () => this.onDeath(slot, null));
    child.on("exit", (code, signal) => this.onDeath(slot, code === 3 ? "heap" : signal === "SIGABRT" || code === 134 ? "heap" : null));
    return slot;
  }

  private onMessage(slot: Slot, message: SlotMessage): void {
    if (message.type === "ready") {
      slot.ready = true;
      if (slot.job) return this.start(slot, slot.job);
      return this.dispatch();
    }
    if (message.type === "died") {
      if (message.heapExhausted) slot.heapExhausted = true;
      return;
    }
    const job = slot.job;
    if (!job || message.jobId !== job.id) return;
    if (message.type === "event") {
      // A failing listener must not take the server down (this runs in an IPC handler).
      try {
        job.options.onEvent?.(message.event);
      } catch (error) {
        console.error("[ringside] a computation's event listener failed:", error);
      }
    } else if (message.type === "finished")
      this.finish(
        job,
        job.stop === StopReason.None ? { status: "finished", outcome: message.outcome } : this.stoppedEnd(job, message.outcome),
      );
    else this.finish(job, job.stop === StopReason.None ? { status: "crashed", message: message.message } : this.stoppedEnd(job));
  }

  private onDeath(slot: Slot, cause: "heap" | null): void {
    if (slot.dead) return;
    slot.dead = true;
    const index = this.slots.indexOf(slot);
    if (index >= 0) this.slots[index] = undefined;
    const job = slot.job;
    if (job) {
      const heap = cause === "heap" || slot.heapExhausted === true;
      this.finish(
        job,
        job.memoryKill !== undefined
          ? {
              status: "limit",
              limit: "memory",
              name: "cellMemoryMb",
              message: `memory limit of ${job.memoryKill} MB reached: the computation's resident memory grew past it (cellMemoryMb)`,
            }
          : heap
            ? {
                status: "limit",
                limit: "memory",
                name: "cellHeapMb",
                message: `memory limit of ${this.options.heapLimitMb} MB of heap reached (cellHeapMb)`,
              }
            : job.stop !== StopReason.None
              ? this.stoppedEnd(job)
              : { status: "crashed", message: "the engine slot stopped unexpectedly" },
      );
    }
    // A fresh slot takes the place of the dead one.
    if (!this.closed) queueMicrotask(() => this.dispatch());
  }

  /// The watchdog: a busy slot whose resident memory passed its job's bound is killed at once.
  private watch(): void {
    for (const slot of this.slots) {
      const job = slot?.job;
      if (!slot || !job || slot.dead || slot.child.pid === undefined) continue;
      const rss = residentMb(slot.child.pid);
      const bound = this.memoryBound(job);
      if (rss !== null && rss > bound) {
        job.memoryKill = bound;
        void this.kill(slot);
        continue;
      }
      if (!slot.yielding && job.startedAt !== undefined && performance.now() - job.startedAt > YIELD_AFTER_MS) {
        slot.yielding = true;
        setThreadsPriority(slot.child.pid, YIELDING_NICE);
      }
    }
  }

  private finish(job: Job, end: JobEnd): void {
    if (job.ended) return;
    job.ended = true;
    clearTimeout(job.timer);
    clearTimeout(job.killTimer);
    const slot = job.slot;
    if (slot) {
      this.queue.release(job.options.user);
      if (slot.job === job) slot.job = undefined;
      // A slot is replaced after `jobsPerSlot` computations, or when it kept more than half
      // its memory bound (fragmented heaps do not shrink back).
      const pid = slot.child.pid;
      const rss = pid === undefined ? null : residentMb(pid);
      // A slot that yielded gets its priority back for the next job, or (where raising a
      // priority is not permitted) is replaced.
      let restored = true;
      if (slot.yielding && !slot.dead) {
        restored = pid !== undefined && setThreadsPriority(pid, 0);
        slot.yielding = false;
      }
      if (!slot.dead && (!restored || slot.served >= this.options.jobsPerSlot || (rss !== null && rss > this.options.memoryLimitMb / 2)))
        void this.kill(slot);
    }
    job.slot = undefined;
    job.resolve(end);
    if (!this.closed) queueMicrotask(() => this.dispatch());
  }

  private kill(slot: Slot): Promise<void> {
    slot.retired = true;
    return new Promise((resolve) => {
      if (slot.child.exitCode !== null || slot.child.signalCode !== null) return resolve();
      slot.child.once("exit", () => resolve());
      slot.child.kill("SIGKILL");
    });
  }
}

type SlotMessage =
  | { type: "ready" }
  | { type: "died"; heapExhausted: boolean; message: string }
  | { type: "event"; jobId: number; event: unknown }
  | { type: "finished"; jobId: number; outcome: unknown }
  | { type: "failed"; jobId: number; message: string };

/// Sets the priority of every thread of a process (on Linux a priority belongs to a thread, and
/// the computation runs in the slot's engine thread); false when not permitted or not possible.
function setThreadsPriority(pid: number, nice: number): boolean {
  let tids: number[];
  try {
    tids = readdirSync(`/proc/${pid}/task`).map(Number);
  } catch {
    tids = [pid];
  }
  let ok = true;
  for (const tid of tids) {
    try {
      os.setPriority(tid, nice);
    } catch {
      ok = false;
    }
  }
  return ok;
}

/// A process's resident memory in MB from /proc (Linux); null when it cannot be read.
export function residentMb(pid: number): number | null {
  try {
    const status = readFileSync(`/proc/${pid}/status`, "utf8");
    const match = /^VmRSS:\s+(\d+)\s+kB/m.exec(status);
    return match ? Number(match[1]) / 1024 : null;
  } catch {
    return null;
  }
}

// Resolved at run time from the working directory, not from the bundle: Next bundles route
// handlers into .next/, but the slot's files stay in the source tree.
function computeDirectory(): string {
  return path.join(process.env.RINGSIDE_ROOT ?? process.cwd(), "lib", "compute");
}

export { EngineFullError };
