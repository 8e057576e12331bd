/// Experiments as the API and the CLI see them: create (from a program such as a cell's text,
/// or from an uploaded family and a probe), pause, resume, cancel, run again. Route handlers
/// call these after deciding access; the database is reached through store.ts only.
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { cells, uploads } from "@/db/schema";
import { ExperimentError } from "./errors";
import { ENGINE_VERSION } from "@/lib/sessions/engine-version";
import { currentRingOf, listObjects } from "@/lib/sessions/store";
import type { ExperimentRequest } from "@/lib/sessions/run-cell";
import { memberLimits, planSweep } from "./compute-adapter";
import { enqueueMembers } from "./queue";
import { changeStatus, getExperiment, insertExperiment, missingIndexes, type ExperimentRow } from "./store";

/// A member job comes back to the queue when its worker is silent this long past the limit.
export const expireSecondsFor = (timeLimitMs: number): number => Math.ceil(timeLimitMs / 1000) + 30;

export interface CreateFromProgram {
  sessionId: string;
  userId: string | null;
  source: string;
  title?: string;
  cellId?: string | null;
}

/// Evaluates `source` over the session's named objects up to its first `sweep(F, probe)` and
/// stores that sweep as an experiment, one queued job per member.
export async function createFromProgram(input: CreateFromProgram): Promise<ExperimentRow> {
  let source = input.source;
  if (input.cellId) {
    const [cell] = await db()
      .select()
      .from(cells)
      .where(and(eq(cells.id, input.cellId), eq(cells.sessionId, input.sessionId)));
    if (!cell) throw new ExperimentError(404, "not_found", "The cell does not exist in this session.");
    source = cell.source;
  }
  if (!source.trim())
    throw new ExperimentError(400, "invalid_body", "Give the program (source) or a cell (cellId) whose text has a sweep(family, probe).");
  const bindings = (await listObjects(input.sessionId)).map((o) => ({ name: o.name, value: o.value }));
  const currentRing = await currentRingOf(input.sessionId);
  const plan = await planSweep(source, bindings, currentRing);
  if (plan.kind === "plan-error") {
    throw new ExperimentError(422, "no_experiment", `The program does not give a sweep to run: ${plan.error.message}`);
  }
  return start({
    sessionId: input.sessionId,
    createdBy: input.userId,
    title: input.title ?? titleFrom(plan.family as { definition?: string }),
    program: source,
    family: plan.family,
    labels: plan.labels,
    probe: plan.probe,
    sourceCellId: input.cellId ?? null,
  });
}

/// A cell's request (lib/sessions/run-cell.ts ExperimentRequest): the id the cell's
/// Experiment value already carries (chosen in the engine slot), the cell and its text, and
/// what the slot planned — the family and probe as §9 JSON and the members' labels.
export type CreateFromCell = ExperimentRequest;

/// A cell's sweep that went to the background (lib/sessions/run-cell.ts): the slot already
/// evaluated the cell up to the sweep and handed back its family and probe, so nothing is
/// evaluated again; the experiment is stored under the id the cell's value carries and its
/// members are queued, exactly as POST /api/experiments does after planning.
export async function createFromCell(input: CreateFromCell): Promise<ExperimentRow> {
  return start({
    id: input.id,
    sessionId: input.sessionId,
    createdBy: input.userId,
    title: titleFrom(input.family as { definition?: string }),
    program: input.source,
    family: input.family,
    labels: input.labels,
    probe: input.probe,
    sourceCellId: input.cellId,
  });
}

export interface CreateFromUpload {
  sessionId: string;
  userId: string | null;
  uploadId: string;
  /// the probe, a function of one member, e.g. "I -> {depth: (S / I).depth}"
  probe: string;
  /// the name the probe uses for the upload's ring (default S)
  ringName?: string;
  title?: string;
}

/// A sweep of an uploaded family: the program is `sweep(F, probe)` with F the upload.
export async function createFromUpload(input: CreateFromUpload): Promise<ExperimentRow> {
  const [u] = await db()
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, input.uploadId), eq(uploads.sessionId, input.sessionId)));
  if (!u) throw new ExperimentError(404, "not_found", "The upload does not exist in this session.");
  const family = u.family as { ring: unknown };
  const ringName = input.ringName ?? "S";
  const program = `# ${ringName}: the ring of the upload ${u.name}; uploaded: its ${u.length} ideals\nsweep(uploaded, ${input.probe})`;
  const bindings = [
    { name: ringName, value: family.ring },
    { name: "uploaded", value: u.family },
  ];
  const plan = await planSweep(program, bindings, ringName);
  if (plan.kind === "plan-error")
    throw new ExperimentError(422, "no_experiment", `The probe cannot run over the upload: ${plan.error.message}`);
  return start({
    sessionId: input.sessionId,
    createdBy: input.userId,
    title: input.title ?? `${u.name}: ${input.probe}`,
    program,
    family: plan.family,
    labels: plan.labels,
    probe: plan.probe,
    uploadId: u.id,
  });
}

function titleFrom(family: { definition?: string }): string {
  const d = family.definition ?? "sweep";
  return d.length > 100 ? `${d.slice(0, 99)}…` : d;
}

async function start(e: {
  id?: string;
  sessionId: string;
  createdBy: string | null;
  title: string;
  program: string;
  family: unknown;
  labels: string[];
  probe: unknown;
  sourceCellId?: string | null;
  uploadId?: string | null;
  rerunOf?: string | null;
}): Promise<ExperimentRow> {
  const limits = memberLimits();
  const probe = e.probe as { text?: string };
  const family = e.family as { definition?: string };
  const row = await insertExperiment({
    ...e,
    familyDefinition: family.definition ?? "",
    probeText: probe.text ?? "",
    engineVersion: ENGINE_VERSION,
    limits,
  });
  await enqueueMembers(
    row.id,
    [...(row.labels as string[])].map((_, i) => i),
    expireSecondsFor(limits.timeLimitMs),
  );
  return row;
}

/// "Run again": a new experiment with the same program, family (members and seeds) and probe.
export async function runAgain(e: ExperimentRow, userId: string | null): Promise<ExperimentRow> {
  return start({
    sessionId: e.sessionId,
    createdBy: userId,
    title: e.title,
    program: e.program,
    family: e.family,
    labels: e.labels as string[],
    probe: e.probe,
    sourceCellId: e.sourceCellId,
    uploadId: e.uploadId,
    rerunOf: e.id,
  });
}

export type Action = "pause" | "resume" | "cancel";

/// Pause keeps the finished rows and lets running members finish; their queued jobs are
/// dropped by the workers. Resume queues every member without a row again. Cancel writes a
/// `cancelled` row for every member without one.
export async function act(id: string, action: Action): Promise<ExperimentRow> {
  const to = action === "pause" ? "paused" : action === "resume" ? "running" : "cancelled";
  const row = await changeStatus(id, to);
  if (!row) {
    const e = await getExperiment(id);
    throw new ExperimentError(409, "conflict", `Cannot ${action} an experiment that is ${e?.status ?? "missing"}.`);
  }
  if (action === "resume") await requeue(row);
  return row;
}

/// Cancelling a cell cancels the background experiments its run created (the cells route hands
/// this to lib/sessions/run-cell.ts; the cancel route calls it for a cell whose server is gone):
/// each of `ids` that was made from that cell and is still queued, running or paused is
/// cancelled exactly as POST /api/experiments/:id/cancel does; one already done or cancelled,
/// or made from another cell, is left alone. Answers the ids it cancelled.
export async function cancelFromCell(cellId: string, ids: readonly string[]): Promise<string[]> {
  const cancelled: string[] = [];
  for (const id of new Set(ids)) {
    const e = await getExperiment(id);
    if (!e || e.sourceCellId !== cellId) continue;
    if (await changeStatus(id, "cancelled")) cancelled.push(id);
  }
  return cancelled;
}

/// Queues every member of `e` that has no row (duplicates of waiting jobs are dropped).
export async function requeue(e: ExperimentRow): Promise<number> {
  const missing = await missingIndexes(e);
  const limits = e.limits as { timeLimitMs: number };
  if (missing.length > 0) await enqueueMembers(e.id, missing, expireSecondsFor(limits.timeLimitMs));
  return missing.length;
}
