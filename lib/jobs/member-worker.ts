/// The loop that runs experiment members: takes one pg-boss job at a time per slot, skips
/// members that already have a row or whose experiment is paused, cancelled or done, runs the
/// probe under the members' limits (lib/experiments/compute-adapter) and writes the row.
/// Used by `npm run worker` (lib/jobs/worker.ts) and by the web server's embedded worker.
import os from "node:os";
import type PgBoss from "pg-boss";
import { boss, MEMBER_QUEUE, stopBoss, type MemberJobData } from "@/lib/experiments/queue";
import { closeExperimentPool, experimentPool, runMember } from "@/lib/experiments/compute-adapter";
import { activeExperiments, getExperiment, hasRow, writeRow, type ExperimentRow } from "@/lib/experiments/store";
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

/// The immutable part of an experiment (family and probe), kept per process.
const recipes = new Map<string, { probe: unknown; members: unknown[] }>();

function recipe(e: ExperimentRow) {
  let r = recipes.get(e.id);
  if (!r) {
    r = { probe: e.probe, members: (e.family as { members: unknown[] }).members };
    recipes.set(e.id, r);
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

  const handle = async (jobs: PgBoss.Job<MemberJobData>[]) => {
    for (const job of jobs) {
      const { experimentId, index } = job.data;
      const e = await getExperiment(experimentId);
      if (!e || (e.status !== "queued" && e.status !== "running")) continue;
      if (!Number.isInteger(index) || index < 0 || index >= e.total) continue;
      if (await hasRow(experimentId, index)) continue;
      const r = recipe(e);
      const limits = e.limits as { timeLimitMs: number; heapLimitMb: number };
      const out = await runMember(r.probe, r.members[index], limits, stopping.signal);
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
    }
  };

  for (let i = 0; i < opts.concurrency; i++) {
    await b.work<MemberJobData>(MEMBER_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, handle);
  }
  log(`worker ${id} takes members with concurrency ${opts.concurrency}`);

  return {
    id,
    finished: () => finished,
    async stop() {
      stopping.abort();
      await b.offWork(MEMBER_QUEUE).catch(() => {});
      await stopBoss();
      await closeExperimentPool();
    },
  };
}
