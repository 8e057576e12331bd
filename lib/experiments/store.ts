/// Experiments in PostgreSQL: creating, reading progress and rows (paged, sorted, filtered on
/// the server), changing status, and writing one member's row — each row in one transaction,
/// keyed by (experiment, member) with ON CONFLICT DO NOTHING so no row is ever doubled.
import { and, asc, desc, eq, inArray, sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { experimentRows, experiments } from "@/db/schema";
import type { Progress } from "@/lib/wire/experiments";

export type ExperimentRow = typeof experiments.$inferSelect;
export type StoredRow = typeof experimentRows.$inferSelect;
export type ExperimentStatus = ExperimentRow["status"];
export type RowStatus = StoredRow["status"];

export interface NewExperiment {
  sessionId: string;
  createdBy: string | null;
  title: string;
  program: string;
  familyDefinition: string;
  family: unknown;
  labels: string[];
  probeText: string;
  probe: unknown;
  engineVersion: string;
  limits: { timeLimitMs: number; heapLimitMb: number };
  sourceCellId?: string | null;
  uploadId?: string | null;
  rerunOf?: string | null;
}

export async function insertExperiment(e: NewExperiment): Promise<ExperimentRow> {
  const [row] = await db()
    .insert(experiments)
    .values({
      ...e,
      total: e.labels.length,
      status: e.labels.length === 0 ? "done" : "queued",
      finishedAt: e.labels.length === 0 ? new Date() : null,
    })
    .returning();
  return row;
}

export async function getExperiment(id: string): Promise<ExperimentRow | undefined> {
  if (!/^[0-9a-f-]{36}$/i.test(id)) return undefined;
  const [row] = await db().select().from(experiments).where(eq(experiments.id, id));
  return row;
}

/// Only the status and size (what a worker checks before each member).
export async function experimentState(id: string): Promise<{ status: ExperimentStatus; total: number } | undefined> {
  const [row] = await db().select({ status: experiments.status, total: experiments.total }).from(experiments).where(eq(experiments.id, id));
  return row;
}

/// The experiments of some sessions, newest first, without the bulky family and probe JSON.
export async function listExperiments(sessionIds: readonly string[]) {
  if (sessionIds.length === 0) return [];
  return db()
    .select({
      id: experiments.id,
      sessionId: experiments.sessionId,
      title: experiments.title,
      status: experiments.status,
      familyDefinition: experiments.familyDefinition,
      probeText: experiments.probeText,
      total: experiments.total,
      createdAt: experiments.createdAt,
      finishedAt: experiments.finishedAt,
      /// the cell the experiment was made from (the console links a cell to its experiments)
      sourceCellId: experiments.sourceCellId,
      done: sql<number>`(SELECT count(*)::int FROM experiment_rows r WHERE r.experiment_id = ${experiments.id})`,
      failures: sql<number>`(SELECT count(*)::int FROM experiment_rows r WHERE r.experiment_id = ${experiments.id} AND r.status <> 'ok')`,
    })
    .from(experiments)
    .where(inArray(experiments.sessionId, [...sessionIds]))
    .orderBy(desc(experiments.createdAt));
}

export type { Progress };

export async function progressOf(e: ExperimentRow): Promise<Progress> {
  const rows = await db()
    .select({ status: experimentRows.status, n: sql<number>`count(*)::int` })
    .from(experimentRows)
    .where(eq(experimentRows.experimentId, e.id))
    .groupBy(experimentRows.status);
  const byStatus: Record<RowStatus, number> = { ok: 0, error: 0, limit: 0, cancelled: 0 };
  for (const r of rows) byStatus[r.status] = r.n;
  const done = byStatus.ok + byStatus.error + byStatus.limit + byStatus.cancelled;
  // the rate over the last minute of rows (or since the first row when younger)
  const [w] = await db()
    .select({
      recent: sql<number>`count(*) FILTER (WHERE ${experimentRows.finishedAt} > now() - interval '60 seconds')::int`,
      first: sql<Date | null>`min(${experimentRows.finishedAt})`,
    })
    .from(experimentRows)
    .where(eq(experimentRows.experimentId, e.id));
  let rate: number | null = null;
  if (w && w.recent > 0 && e.startedAt) {
    const since = Math.min(60, Math.max(1, (Date.now() - new Date(e.startedAt).getTime()) / 1000));
    rate = w.recent / since;
  }
  const active = e.status === "queued" || e.status === "running";
  const etaSeconds = active && rate ? Math.round((e.total - done) / rate) : null;
  return { status: e.status, done, total: e.total, failures: done - byStatus.ok - byStatus.cancelled, byStatus, rate, etaSeconds };
}

export interface RowQuery {
  offset: number;
  limit: number;
  /// "index", "status", "seconds", "label", "worker" or a probe column
  sort: string;
  order: "asc" | "desc";
  status?: RowStatus[];
  /// probe column filters: column op value (op: eq ne lt le gt ge); numbers compare numerically
  where?: { column: string; op: "eq" | "ne" | "lt" | "le" | "gt" | "ge"; value: string }[];
}

const SQL_OP = { eq: "=", ne: "<>", lt: "<", le: "<=", gt: ">", ge: ">=" } as const;

/// A probe column's value for sorting/filtering: Int (and Bool as 0/1) numerically, else its text.
function numericCell(column: string): SQL {
  return sql`CASE WHEN ${experimentRows.fields} -> ${column} ->> 'type' = 'Int' THEN (${experimentRows.fields} -> ${column} ->> 'value')::numeric END`;
}
function textCell(column: string): SQL {
  return sql`(${experimentRows.fields} -> ${column} ->> 'text')`;
}

export async function readRows(e: ExperimentRow, q: RowQuery): Promise<{ rows: StoredRow[]; matched: number }> {
  const conditions: SQL[] = [eq(experimentRows.experimentId, e.id)];
  if (q.status && q.status.length > 0) conditions.push(inArray(experimentRows.status, q.status));
  for (const w of q.where ?? []) {
    const op = sql.raw(SQL_OP[w.op]);
    if (/^-?\d+$/.test(w.value)) conditions.push(sql`${numericCell(w.column)} ${op} ${w.value}::numeric`);
    else conditions.push(sql`${textCell(w.column)} ${op} ${w.value}`);
  }
  const dir = q.order === "desc" ? desc : asc;
  const fixed: Record<string, SQL> = {
    index: sql`${experimentRows.memberIndex}`,
    status: sql`${experimentRows.status}::text`,
    seconds: sql`${experimentRows.durationMs}`,
    worker: sql`${experimentRows.worker}`,
    label: sql`(${experiments.labels} ->> ${experimentRows.memberIndex})`,
  };
  const order =
    q.sort in fixed
      ? [dir(fixed[q.sort]), asc(experimentRows.memberIndex)]
      : [
          q.order === "desc" ? sql`${numericCell(q.sort)} DESC NULLS LAST` : sql`${numericCell(q.sort)} ASC NULLS LAST`,
          q.order === "desc" ? sql`${textCell(q.sort)} DESC NULLS LAST` : sql`${textCell(q.sort)} ASC NULLS LAST`,
          asc(experimentRows.memberIndex),
        ];
  const where = and(...conditions);
  const rows = await db()
    .select({ row: experimentRows })
    .from(experimentRows)
    .innerJoin(experiments, eq(experiments.id, experimentRows.experimentId))
    .where(where)
    .orderBy(...order)
    .limit(q.limit)
    .offset(q.offset);
  const [{ n }] = await db()
    .select({ n: sql<number>`count(*)::int` })
    .from(experimentRows)
    .where(where);
  return { rows: rows.map((r) => r.row), matched: n };
}

/// Every row in member order (for export and "run again" comparisons).
export async function allRows(experimentId: string): Promise<StoredRow[]> {
  return db().select().from(experimentRows).where(eq(experimentRows.experimentId, experimentId)).orderBy(asc(experimentRows.memberIndex));
}

export async function missingIndexes(e: ExperimentRow): Promise<number[]> {
  const rows = await db().select({ i: experimentRows.memberIndex }).from(experimentRows).where(eq(experimentRows.experimentId, e.id));
  const have = new Set(rows.map((r) => r.i));
  const out: number[] = [];
  for (let i = 0; i < e.total; i++) if (!have.has(i)) out.push(i);
  return out;
}

export async function hasRow(experimentId: string, index: number): Promise<boolean> {
  const [r] = await db()
    .select({ i: experimentRows.memberIndex })
    .from(experimentRows)
    .where(and(eq(experimentRows.experimentId, experimentId), eq(experimentRows.memberIndex, index)));
  return r !== undefined;
}

export interface RowWrite {
  experimentId: string;
  index: number;
  status: RowStatus;
  fields: [string, unknown][];
  message: string | null;
  durationMs: number;
  worker: string;
}

/// Writes one member's row in one transaction: the experiment row is locked first (so the
/// last two rows of a sweep cannot both miss that the sweep is complete), the row is inserted
/// unless it exists, and the experiment's status, start and finish are brought up to date.
/// Returns whether this call inserted the row.
export async function writeRow(r: RowWrite): Promise<boolean> {
  return db().transaction(async (tx) => {
    const [e] = await tx.select().from(experiments).where(eq(experiments.id, r.experimentId)).for("update");
    if (!e) return false;
    const inserted = await tx
      .insert(experimentRows)
      .values({
        experimentId: r.experimentId,
        memberIndex: r.index,
        status: r.status,
        fields: Object.fromEntries(r.fields),
        message: r.message,
        durationMs: Math.max(0, Math.round(r.durationMs)),
        worker: r.worker,
      })
      .onConflictDoNothing()
      .returning({ i: experimentRows.memberIndex });
    const [{ n }] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(experimentRows)
      .where(eq(experimentRows.experimentId, r.experimentId));
    const complete = n >= e.total;
    await tx
      .update(experiments)
      .set({
        status: complete && e.status !== "cancelled" ? "done" : e.status === "queued" ? "running" : e.status,
        startedAt: e.startedAt ?? new Date(),
        ...(complete && !e.finishedAt ? { finishedAt: new Date() } : {}),
        ...(e.columns === null && r.status === "ok" ? { columns: r.fields.map(([k]) => k) } : {}),
      })
      .where(eq(experiments.id, r.experimentId));
    return inserted.length > 0;
  });
}

/// Moves an experiment to a new status when the move is allowed; returns the updated row or
/// null (the caller reports a conflict). Cancelling also writes a `cancelled` row for every
/// member without a row, so the table is complete and no later result can slip in.
export async function changeStatus(id: string, to: "paused" | "running" | "cancelled"): Promise<ExperimentRow | null> {
  const from: Record<typeof to, ExperimentStatus[]> = {
    paused: ["queued", "running"],
    running: ["paused"],
    cancelled: ["queued", "running", "paused"],
  };
  return db().transaction(async (tx) => {
    const [e] = await tx.select().from(experiments).where(eq(experiments.id, id)).for("update");
    if (!e || !from[to].includes(e.status)) return null;
    if (to === "cancelled") {
      await tx.execute(sql`
        INSERT INTO experiment_rows (experiment_id, member_index, status, fields, message, duration_ms, worker)
        SELECT ${id}, i, 'cancelled', '{}'::jsonb, 'cancelled before it ran', 0, 'none'
        FROM generate_series(0, ${e.total} - 1) AS i
        ON CONFLICT DO NOTHING`);
    }
    const [row] = await tx
      .update(experiments)
      .set({ status: to, ...(to === "cancelled" ? { finishedAt: new Date() } : {}) })
      .where(eq(experiments.id, id))
      .returning();
    return row;
  });
}

/// Experiments that still need work (for a worker that starts: re-queue what is missing).
export async function activeExperiments(): Promise<ExperimentRow[]> {
  return db()
    .select()
    .from(experiments)
    .where(inArray(experiments.status, ["queued", "running"]));
}
