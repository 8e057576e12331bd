/// Pruning the detail folder (RINGSIDE_DETAIL_DIR, default `.data/details`): the whole JSON of
/// every value stored as a summary (lib/compute/large-values.ts). A detail file is named by
/// its content, so one file may back values in several places (the same value computed in
/// two sessions, a named object imported into another session); it is deleted when the last
/// stored value that carries its marker goes — a session deleted, a named object deleted or
/// bound again, a cell's stored partial results replaced by its outcome — and never while it
/// may belong to a cell still running (a running cell's values are not stored yet).
/// Only cells (`result`) and named objects (`value`) carry markers: only a cell's job makes
/// summaries, and experiment members are computed whole.
import { readdir, stat, unlink } from "node:fs/promises";
import { sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { detailDirectory, detailOf, detailPath } from "@/lib/compute/large-values";

/// Every marker's id anywhere inside a jsonb column (PostgreSQL's SQL/JSON path, lax mode:
/// nodes without a `detail` are skipped; DISTINCT removes the repeats `.**` may give).
const DETAIL_IDS = "lax $.**.detail.id";

type Queryable = { execute: ReturnType<typeof db>["execute"] };

/// The detail ids carried by one stored value (or a cell's whole result), read in place.
export function detailIdsIn(json: unknown, into: Set<string> = new Set()): Set<string> {
  const stack: unknown[] = [json];
  while (stack.length > 0) {
    const node = stack.pop();
    if (node === null || typeof node !== "object") continue;
    const marker = Array.isArray(node) ? null : detailOf(node);
    if (marker) into.add(marker.id);
    for (const child of Array.isArray(node) ? node : Object.values(node))
      if (child !== null && typeof child === "object") stack.push(child);
  }
  return into;
}

async function idsWhere(database: Queryable, cellsWhere: SQL | null, objectsWhere: SQL | null): Promise<string[]> {
  const parts: SQL[] = [];
  if (cellsWhere)
    parts.push(sql`SELECT jsonb_path_query(result, ${DETAIL_IDS}) #>> '{}' AS id FROM cells WHERE result IS NOT NULL AND ${cellsWhere}`);
  if (objectsWhere) parts.push(sql`SELECT jsonb_path_query(value, ${DETAIL_IDS}) #>> '{}' AS id FROM named_objects WHERE ${objectsWhere}`);
  const rows = await database.execute<{ id: string | null }>(sql`SELECT DISTINCT id FROM (${sql.join(parts, sql` UNION ALL `)}) found`);
  return rows.map((r) => r.id).filter((id): id is string => typeof id === "string" && detailPath(id) !== null);
}

/// For each of `ids`, the sessions whose stored cells or named objects carry its marker (one
/// pass over the stored values for all of them).
export async function sessionsHoldingDetails(ids: readonly string[], database: Queryable = db()): Promise<Map<string, string[]>> {
  const held = new Map<string, string[]>();
  if (ids.length === 0) return held;
  const list = sql`ARRAY[${sql.join(
    ids.map((id) => sql`${id}`),
    sql`, `,
  )}]::text[]`;
  const rows = await database.execute<{ id: string; session_id: string }>(sql`
    SELECT DISTINCT id, session_id FROM (
      SELECT jsonb_path_query(result, ${DETAIL_IDS}) #>> '{}' AS id, session_id FROM cells WHERE result IS NOT NULL
      UNION ALL
      SELECT jsonb_path_query(value, ${DETAIL_IDS}) #>> '{}' AS id, session_id FROM named_objects
    ) found WHERE id = ANY(${list})`);
  for (const r of rows) held.set(r.id, [...(held.get(r.id) ?? []), r.session_id]);
  return held;
}

/// A copy of `json` without the markers of details outside `keep` (the summaries stay).
export function withoutDetailsOutside<T>(json: T, keep: ReadonlySet<string>): T {
  const walk = (node: unknown): unknown => {
    if (node === null || typeof node !== "object") return node;
    if (Array.isArray(node)) return node.map(walk);
    const marker = detailOf(node);
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(node)) if (!(k === "detail" && marker && !keep.has(marker.id))) out[k] = walk(v);
    return out;
  };
  return walk(json) as T;
}

/// The detail ids a session's cells and named objects carry (taken before the session goes).
export function detailIdsOfSession(sessionId: string, database: Queryable = db()): Promise<string[]> {
  return idsWhere(database, sql`session_id = ${sessionId}`, sql`session_id = ${sessionId}`);
}

/// The detail ids a cell's stored result carries (its partial results, before its outcome replaces them).
export function detailIdsOfCell(cellId: string, database: Queryable = db()): Promise<string[]> {
  return idsWhere(database, sql`id = ${cellId}`, null);
}

/// Of `ids` (every id when null), those some stored cell or named object still carries (any session).
async function stillReferenced(ids: string[] | null): Promise<Set<string>> {
  const list =
    ids === null
      ? null
      : sql`ARRAY[${sql.join(
          ids.map((id) => sql`${id}`),
          sql`, `,
        )}]::text[]`;
  const rows = await db().execute<{ id: string }>(sql`
    SELECT DISTINCT id FROM (
      SELECT jsonb_path_query(result, ${DETAIL_IDS}) #>> '{}' AS id FROM cells WHERE result IS NOT NULL
      UNION ALL
      SELECT jsonb_path_query(value, ${DETAIL_IDS}) #>> '{}' AS id FROM named_objects
    ) found ${list === null ? sql`` : sql`WHERE id = ANY(${list})`}`);
  return new Set(rows.map((r) => r.id));
}

/// When the oldest running cell started (null: none runs). A detail file touched since then
/// may be one of its values, about to be stored (large-values.ts touches a file it finds
/// already written), so it is kept.
async function oldestRunningStart(): Promise<Date | null> {
  const [row] = await db().execute<{ started: string | Date | null }>(
    sql`SELECT min(coalesce(started_at, created_at)) AS started FROM cells WHERE status = 'running'`,
  );
  return row?.started ? new Date(row.started) : null;
}

/// A file written within this long is kept whatever the database says: an engine slot may
/// write a value's detail before its cell's row is stored as running.
const FRESH_MS = 10_000;

/// A half-written detail (`<id>.json.<pid>.tmp`, left by a slot killed mid-write) this old is
/// certainly abandoned.
const ABANDONED_TMP_MS = 3600_000;

/// Deletes the files among `orphans` that no running cell may be about to store (see above).
async function deleteUnlessInFlight(orphans: string[], now: Date): Promise<string[]> {
  if (orphans.length === 0) return [];
  const running = await oldestRunningStart();
  const deleted: string[] = [];
  for (const id of orphans) {
    const file = detailPath(id)!;
    const info = await stat(file).catch(() => null);
    if (!info) continue;
    const touched = info.mtime.getTime();
    if (now.getTime() - touched < FRESH_MS || (running !== null && touched >= running.getTime() - 1000)) continue;
    await unlink(file).catch((error: NodeJS.ErrnoException) => {
      if (error.code !== "ENOENT") throw error;
    });
    deleted.push(id);
  }
  return deleted;
}

/// Deletes the detail files among `candidates` that no stored value carries any more and no
/// running cell may be about to store; returns the ids deleted. A failure is logged, never
/// thrown: the delete or the cell that asked has already succeeded, and a leftover file
/// harms nothing but disk space (the sweep at the next start takes it).
export async function pruneDetails(candidates: Iterable<string>, now: Date = new Date()): Promise<string[]> {
  const ids = [...new Set(candidates)].filter((id) => detailPath(id) !== null);
  if (ids.length === 0) return [];
  try {
    const kept = await stillReferenced(ids);
    return await deleteUnlessInFlight(
      ids.filter((id) => !kept.has(id)),
      now,
    );
  } catch (error) {
    console.error("[ringside] pruning value details failed:", (error as Error).message);
    return [];
  }
}

/// The whole folder against the whole database (run when a server starts): deletes every
/// detail file no stored value holds — the leftovers of values that were never stored (a
/// statement's partial value, a cell whose save failed, a server killed mid-cell) — under
/// the same in-flight rules, and half-written files abandoned for an hour. Returns the count
/// deleted. The folder must belong to this database alone (DEVELOPERS.md).
export async function sweepDetails(now: Date = new Date()): Promise<number> {
  let names: string[];
  try {
    names = await readdir(detailDirectory());
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return 0;
    throw error;
  }
  let deleted = 0;
  for (const name of names.filter((n) => n.endsWith(".tmp"))) {
    const file = `${detailDirectory()}/${name}`;
    const info = await stat(file).catch(() => null);
    if (
      info?.isFile() &&
      now.getTime() - info.mtime.getTime() > ABANDONED_TMP_MS &&
      (await unlink(file).then(
        () => true,
        () => false,
      ))
    )
      deleted++;
  }
  const ids = names
    .filter((n) => n.endsWith(".json"))
    .map((n) => n.slice(0, -".json".length))
    .filter((id) => detailPath(id) !== null);
  if (ids.length === 0) return deleted;
  const kept = await stillReferenced(null);
  return (
    deleted +
    (
      await deleteUnlessInFlight(
        ids.filter((id) => !kept.has(id)),
        now,
      )
    ).length
  );
}
