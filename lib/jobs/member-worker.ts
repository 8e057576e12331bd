/// The loop that runs experiment members: takes one pg-boss job at a time per slot, skips
/// members that already have a row or whose experiment is paused, cancelled or done, runs the
/// probe under the members' limits (lib/experiments/compute-adapter) and writes the row.
/// Used by `npm run worker` (lib/jobs/worker.ts) and by the web server's embedded worker.
import os from "node:os";
import type PgBoss from "pg-boss";
import { boss, MEMBER_QUEUE, stopBoss, type MemberJobData } from "@/lib/experiments/queue";
import { closeExperimentPool, experimentPool, runMember } from "@/lib/experiments/compute-adapter";
import { activeExperiments, experimentState, getExperiment, hasRow, writeRow } from "@/lib/experiments/store";
import { requeue } from "@/lib/experiments/service";

export interface WorkerOptions {
  concurrency: number;
  /// names this worker in each row it writes: host:pid:label
  label: string;
  log?: (line: string) => void;
}

export interface RunningWorker {
  readonly id: string;
  /// members finished by this process
  readonly finished: () => number;
  stop(): Promise<void>;
}

/// The immutable part of an experiment (family, probe, limits), read once per process.
type Recipe = { probe: unknown; members: unknown[]; limits: { timeLimitMs: number; heapLimitMb: number } };
const recipes = new Map<string, Promise<Recipe | null>>();

function recipe(experimentId: string): Promise<Recipe | null> {
  let r = recipes.get(experimentId);
  if (!r) {
    r = getExperiment(experimentId).then((e) =>
      e ? { probe: e.probe, members: (e.family as { members: unknown[] }).members, limits: e.limits as Recipe["limits"] } : null,
    );
    r.catch(() => recipes.delete(experimentId));
    recipes.set(experimentId, r);
    if (recipes.size > 50) recipes.delete(recipes.keys().next().value!);
  }
  return r;
}

export async function startMemberWorker(opts: WorkerOptions): Promise<RunningWorker> {
  const id = `${os.hostname()}:${process.pid}:${opts.label}`;
  const log = opts.log ?? (() => {});
  experimentPool("members", opts.concurrency);
  const b: PgBoss = await boss();
  let finished = 0;
  const stopping = new AbortController();

  // Members that lost their job (a crash between storing an experiment and queuing it, or a
  // worker killed mid-member) are queued again; a duplicate of a job still running only
  // repeats work, never a row.
  for (const e of await activeExperiments()) {
    const n = await requeue(e);
    if (n > 0) log(`requeued ${n} member(s) of experiment ${e.id}`);
  }

  // One member, from its job to its row. Throws only when the member must go back to the
  // queue (this worker is stopping, or the database failed).
  const runJob = async ({ experimentId, index }: MemberJobData): Promise<void> => {
    const e = await experimentState(experimentId);
    if (!e || (e.status !== "queued" && e.status !== "running")) return;
    if (!Number.isInteger(index) || index < 0 || index >= e.total) return;
    if (await hasRow(experimentId, index)) return;
    const r = await recipe(experimentId);
    if (!r) return;
    const out = await runMember(r.probe, r.members[index], r.limits, stopping.signal);
    // stopped because this worker is shutting down: leave the member to another worker
    if (out.status === "cancelled" && stopping.signal.aborted) throw new Error("worker stopping");
    const wrote = await writeRow({
      experimentId,
      index,
      status: out.status,
      fields: out.fields,
      message: out.message,
      durationMs: out.ms,
      worker: id,
    });
    if (wrote) finished++;
  };

  // Each slot fetches one job, runs it, completes it and fetches the next at once; it waits
  // half a second only when the queue is empty. (pg-boss's work() waits its polling interval
  // after every job, which would cap a slot at two members per second.)
  const slot = async (): Promise<void> => {
    while (!stopping.signal.aborted) {
      let jobs: PgBoss.Job<MemberJobData>[] = [];
      try {
        jobs = await b.fetch<MemberJobData>(MEMBER_QUEUE, { batchSize: 1 });
      } catch (error) {
        log(`fetch failed: ${error instanceof Error ? error.message : error}`);
      }
      if (jobs.length === 0) {
        await new Promise((r) => setTimeout(r, 500));
        continue;
      }
      for (const job of jobs) {
        try {
          await runJob(job.data);
          await b.complete(MEMBER_QUEUE, job.id);
        } catch (error) {
          if (!stopping.signal.aborted)
            log(
              `member ${job.data.index} of ${job.data.experimentId} goes back to the queue: ${error instanceof Error ? error.message : error}`,
            );
          await b.fail(MEMBER_QUEUE, job.id, { message: String(error) }).catch(() => {});
        }
      }
    }
  };

  const slots = Array.from({ length: opts.concurrency }, () => slot());
  log(`worker ${id} takes members with concurrency ${opts.concurrency}`);

  return {
    id,
    finished: () => finished,
    async stop() {
      stopping.abort();
      await Promise.all(slots);
      await stopBoss();
      await closeExperimentPool();
    },
  };
}
