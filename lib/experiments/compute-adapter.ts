/// The one place experiments reach the compute layer: engine slots of lib/compute — child
/// processes whose whole memory is bounded (heap limit and resident-memory watchdog), with the
/// cells' time and memory limits — running the experiment job module instead of the cell job.
/// Experiment work has slots of its own (per process) so a long sweep never takes the slots
/// that interactive cells queue for; the fair queue inside serves experiments' owners round robin.
import os from "node:os";
import path from "node:path";
import { engineSettings, SlotPool, type JobEnd } from "@/lib/compute";
import { formatLimit, limitValue, type LimitName } from "@/lib/limits";
import type { Binding } from "@/lib/notation/evaluate";
import type { ExperimentJob, MemberOutcome, PlanOutcome, UploadOutcome } from "./experiment-job";

export interface MemberLimits {
  timeLimitMs: number;
  heapLimitMb: number;
}

const MEMBER_TIME_ENV = "RINGSIDE_MEMBER_TIME_LIMIT_MS";

/// A member gets the cells' limits unless its own time limit (`memberTimeMs`,
/// RINGSIDE_MEMBER_TIME_LIMIT_MS) is set.
export function memberLimits(): MemberLimits {
  const cell = engineSettings();
  const own = process.env[MEMBER_TIME_ENV] ? limitValue("memberTimeMs") : undefined;
  return { timeLimitMs: own ?? cell.timeLimitMs, heapLimitMb: cell.heapLimitMb };
}

/// The message of a job stopped by a limit, naming the row of lib/limits.ts that bounded
/// its time (the slot pool only knows the cells' names).
function limitMessage(end: Extract<JobEnd, { status: "limit" }>, timeLimit: LimitName, timeLimitMs: number): string {
  return end.limit === "time" ? `time limit of ${formatLimit(timeLimit, timeLimitMs)} reached (${timeLimit})` : end.message;
}

type Role = "members" | "requests";
const holder = globalThis as typeof globalThis & { __ringsideExperimentPools?: Map<Role, SlotPool> };

/// Engine slots for experiment work, two pools per process: "members" (sized by the
/// worker's concurrency, fixed by the first caller) and "requests" (reading uploads and
/// planning sweeps for the API, so a long member never delays a request).
export function experimentPool(role: Role = "members", size?: number): SlotPool {
  const pools = (holder.__ringsideExperimentPools ??= new Map());
  let pool = pools.get(role);
  if (!pool) {
    const root = process.env.RINGSIDE_ROOT ?? process.cwd();
    const s = engineSettings();
    const slots = size ?? (role === "requests" ? 1 : Math.max(1, os.availableParallelism() - 1));
    pool = new SlotPool({
      entry: path.join(root, "lib", "experiments", "experiment-job.ts"),
      slots,
      userRunning: slots,
      userQueued: role === "requests" ? 16 : 256,
      engineQueue: role === "requests" ? 16 : 256,
      heapLimitMb: memberLimits().heapLimitMb,
      memoryLimitMb: s.memoryLimitMb,
      graceMs: s.graceMs,
      jobsPerSlot: s.jobsPerSlot,
    });
    pools.set(role, pool);
  }
  return pool;
}

export async function closeExperimentPool(): Promise<void> {
  const pools = holder.__ringsideExperimentPools;
  holder.__ringsideExperimentPools = undefined;
  await Promise.all([...(pools?.values() ?? [])].map((p) => p.close()));
}

/// Runs one member under the limits; a time or memory limit, a crash of the engine thread or
/// a stop each become the row's status, never an exception.
export async function runMember(probe: unknown, member: unknown, limits: MemberLimits, signal?: AbortSignal): Promise<MemberOutcome> {
  const job: ExperimentJob = { kind: "member", probe, member };
  const t0 = performance.now();
  const handle = experimentPool("members").submit(job, { user: "experiment-members", timeLimitMs: limits.timeLimitMs });
  const onAbort = () => handle.cancel();
  signal?.addEventListener("abort", onAbort, { once: true });
  let end: JobEnd;
  try {
    end = await handle.done;
  } finally {
    signal?.removeEventListener("abort", onAbort);
  }
  const ms = Math.round(performance.now() - t0);
  switch (end.status) {
    case "finished":
      return end.outcome as MemberOutcome;
    case "limit":
      return { kind: "member", status: "limit", fields: [], message: end.message, ms };
    case "cancelled":
      return { kind: "member", status: "cancelled", fields: [], message: "stopped", ms };
    case "crashed":
      return { kind: "member", status: "error", fields: [], message: `the engine stopped: ${end.message}`, ms };
  }
}

/// Evaluates a program up to its first sweep and returns the family and probe (§9 JSON).
export async function planSweep(
  source: string,
  bindings: Binding[],
  currentRing: string | null,
  timeLimitMs = limitValue("planTimeMs"),
): Promise<PlanOutcome> {
  const job: ExperimentJob = { kind: "plan", source, bindings, currentRing };
  const end = await experimentPool("requests").submit(job, { user: "experiment-requests", timeLimitMs }).done;
  if (end.status === "finished") return end.outcome as PlanOutcome;
  const message =
    end.status === "limit"
      ? limitMessage(end, "planTimeMs", timeLimitMs)
      : end.status === "crashed"
        ? `the engine stopped: ${end.message}`
        : "stopped";
  return { kind: "plan-error", error: { kind: end.status === "limit" ? "limit" : "runtime", message } };
}

/// Reads an uploaded family in an engine thread (the notation's checker and evaluator).
export async function readUpload(ring: string, text: string, timeLimitMs = limitValue("uploadReadMs")): Promise<UploadOutcome> {
  const job: ExperimentJob = { kind: "upload", ring, text };
  const end = await experimentPool("requests").submit(job, { user: "experiment-requests", timeLimitMs }).done;
  if (end.status === "finished") return end.outcome as UploadOutcome;
  const message =
    end.status === "limit"
      ? limitMessage(end, "uploadReadMs", timeLimitMs)
      : end.status === "crashed"
        ? `the engine stopped: ${end.message}`
        : "stopped";
  return { kind: "upload-error", problems: [{ line: 0, message: `the upload could not be read: ${message}` }] };
}
