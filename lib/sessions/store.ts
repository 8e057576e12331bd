/// Queries for sessions, cells and named objects. Access checks happen before these are
/// called (lib/auth/access); every write that spans rows is one transaction.
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { cells, namedObjects, sessions, users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/types";
import type { SessionSummary } from "@/lib/wire/sessions";
import { detailIdsIn, detailIdsOfCell, pruneDetails } from "./details";

export type CellRow = typeof cells.$inferSelect;
export type ObjectRow = typeof namedObjects.$inferSelect;

/// What a finished (or stopped) cell stores.
export interface CellOutcome {
  status: "done" | "error" | "cancelled";
  results: unknown[];
  /// where a cancel or a limit stopped the cell ("stopped after homological degree 6: …"), else null
  stopped: string | null;
  error: unknown | null;
  durationMs: number;
  engineVersion: string;
  objects: { name: string; type: string; value: unknown; source: string }[];
  /// the binding that is the current ring after this cell (the next cell starts there)
  currentRing: string | null;
}

/// The title of a session created without one, until its first definition names it.
export const PLACEHOLDER_TITLE = "New session";

/// Creates a session; without a title it is called PLACEHOLDER_TITLE until its first
/// definition is stored (finishCell), which makes a title worth reading in the list.
export async function createSession(user: CurrentUser, title?: string) {
  const [row] = await db()
    .insert(sessions)
    .values({ title: title ?? PLACEHOLDER_TITLE, autoTitle: title === undefined, ownerId: user.id })
    .returning();
  return row!;
}

/// A session's title made from a definition's source: its first line, at most 80 characters.
export function titleFromDefinition(source: string): string {
  const line =
    source
      .split("\n")
      .map((l) => l.trim())
      .find((l) => l !== "") ?? "";
  const flat = line.replace(/\s+/g, " ");
  return flat.length <= 80 ? flat : flat.slice(0, 79) + "…";
}

/// A LIKE pattern matching `text` anywhere, with LIKE's own wildcards taken literally.
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => "\\" + c)}%`;
}

/// Sessions the user owns, or reaches through a share (to them or a team of theirs), or
/// through a team-visible session of a team they belong to; newest activity first. With
/// `query`, only those whose title, a cell's source or a named object's name or value
/// contains it (case-insensitive); `match` then says where (the first matching line of a
/// cell, or an object's name), or null when the title matched.
export async function listSessions(user: CurrentUser, query?: string): Promise<SessionSummary[]> {
  const q = query?.trim() ? containsPattern(query.trim()) : null;
  const rows = await db().execute<{
    id: string;
    title: string;
    owner_name: string;
    owner_id: string;
    updated_at: string;
    share_role: "viewer" | "editor" | null;
    team_role: "lead" | "member" | "guest" | null;
    title_match: boolean | null;
    cell_match: string | null;
    object_match: string | null;
  }>(sql`
    SELECT * FROM (
    SELECT s.id, s.title, u.display_name AS owner_name, s.owner_id, s.updated_at,
      ${q}::text IS NOT NULL AND s.title ILIKE ${q} AS title_match,
      (SELECT c.source FROM cells c WHERE ${q}::text IS NOT NULL AND c.session_id = s.id AND c.source ILIKE ${q}
        ORDER BY c.position LIMIT 1) AS cell_match,
      (SELECT o.name FROM named_objects o WHERE ${q}::text IS NOT NULL AND o.session_id = s.id
          AND (o.name ILIKE ${q} OR o.value->>'text' ILIKE ${q})
        ORDER BY o.name LIMIT 1) AS object_match,
      (SELECT CASE WHEN bool_or(sh.role = 'editor' AND COALESCE(m2.role, 'member') <> 'guest') THEN 'editor' ELSE 'viewer' END
         FROM shares sh LEFT JOIN memberships m2 ON m2.team_id = sh.team_id AND m2.user_id = ${user.id}
        WHERE sh.session_id = s.id AND (sh.user_id = ${user.id} OR m2.user_id IS NOT NULL)
        HAVING count(*) > 0) AS share_role,
      (SELECT m.role FROM memberships m
        WHERE m.team_id = s.team_id AND m.user_id = ${user.id} AND s.visibility <> 'private') AS team_role
    FROM sessions s JOIN users u ON u.id = s.owner_id
    ) found
    WHERE ${q}::text IS NULL OR title_match OR cell_match IS NOT NULL OR object_match IS NOT NULL
    ORDER BY updated_at DESC
  `);
  const needle = query?.trim().toLowerCase() ?? "";
  return rows
    .map((r) => {
      const viaTeam = r.team_role === null ? null : r.team_role === "guest" ? "viewer" : "editor";
      const access =
        r.owner_id === user.id ? "owner" : r.share_role === "editor" || viaTeam === "editor" ? "editor" : (r.share_role ?? viaTeam);
      const match = r.title_match
        ? null
        : r.cell_match !== null
          ? (r.cell_match.split("\n").find((l) => l.toLowerCase().includes(needle)) ?? r.cell_match).trim()
          : r.object_match;
      return {
        id: r.id,
        title: r.title,
        ownerName: r.owner_name,
        access,
        updatedAt: new Date(r.updated_at).toISOString(),
        ...(q !== null ? { match } : {}),
      };
    })
    .filter((s): s is typeof s & { access: "owner" | "editor" | "viewer" } => s.access !== null);
}

export async function ownerName(ownerId: string): Promise<string> {
  const [row] = await db().select({ name: users.displayName }).from(users).where(eq(users.id, ownerId));
  return row?.name ?? "";
}

/// A cell with the display name of who ran it (null when that account is gone).
export type CellWithAuthor = CellRow & { authorName: string | null };

export async function listCells(sessionId: string): Promise<CellWithAuthor[]> {
  const rows = await db()
    .select({ cell: cells, authorName: users.displayName })
    .from(cells)
    .leftJoin(users, eq(users.id, cells.createdBy))
    .where(eq(cells.sessionId, sessionId))
    .orderBy(asc(cells.position));
  return rows.map((r) => ({ ...r.cell, authorName: r.authorName }));
}

export async function getCell(sessionId: string, cellId: string): Promise<CellRow | undefined> {
  const [row] = await db()
    .select()
    .from(cells)
    .where(and(eq(cells.sessionId, sessionId), eq(cells.id, cellId)));
  return row;
}

/// The current ring left by the session's latest finished cell (null: none yet).
export async function currentRingOf(sessionId: string): Promise<string | null> {
  const [row] = await db()
    .select({ result: cells.result })
    .from(cells)
    .where(and(eq(cells.sessionId, sessionId), sql`${cells.result} ? 'currentRing'`))
    .orderBy(desc(cells.position))
    .limit(1);
  const ring = (row?.result as { currentRing?: unknown } | undefined)?.currentRing;
  return typeof ring === "string" ? ring : null;
}

export async function listObjects(sessionId: string): Promise<ObjectRow[]> {
  return db().select().from(namedObjects).where(eq(namedObjects.sessionId, sessionId)).orderBy(asc(namedObjects.name));
}

/// Stores a new running cell at the next position. The session row is locked so two cells
/// started at once get distinct positions.
export async function startCell(sessionId: string, user: CurrentUser, source: string, serverId: string): Promise<CellRow> {
  return db().transaction(async (tx) => {
    await tx.execute(sql`SELECT 1 FROM sessions WHERE id = ${sessionId} FOR UPDATE`);
    const [last] = await tx
      .select({ position: cells.position })
      .from(cells)
      .where(eq(cells.sessionId, sessionId))
      .orderBy(desc(cells.position))
      .limit(1);
    const [row] = await tx
      .insert(cells)
      .values({
        sessionId,
        position: (last?.position ?? -1) + 1,
        source,
        status: "running",
        createdBy: user.id,
        startedAt: new Date(),
        serverId,
        heartbeatAt: new Date(),
      })
      .returning();
    await tx.update(sessions).set({ updatedAt: new Date() }).where(eq(sessions.id, sessionId));
    return row!;
  });
}

/// Writes a cell's final state and the named objects it bound, in one transaction.
/// A name bound again replaces the earlier object (notation.md §2); earlier cells keep
/// their results.
export async function finishCell(cell: CellRow, user: CurrentUser, outcome: CellOutcome): Promise<ObjectRow[]> {
  // Large values this write replaces (the partial results the heartbeat stored, the objects
  // bound again): their detail files go once nothing else holds them (details.ts).
  const replaced = new Set<string>();
  const saved = await db().transaction(async (tx) => {
    for (const id of await detailIdsOfCell(cell.id, tx)) replaced.add(id);
    const names = outcome.objects.map((o) => o.name);
    if (names.length > 0) {
      const earlier = await tx
        .select({ value: namedObjects.value })
        .from(namedObjects)
        .where(and(eq(namedObjects.sessionId, cell.sessionId), inArray(namedObjects.name, names)));
      for (const o of earlier) detailIdsIn(o.value, replaced);
    }
    await tx
      .update(cells)
      .set({
        status: outcome.status,
        result: { statements: outcome.results, currentRing: outcome.currentRing, ...(outcome.stopped ? { stopped: outcome.stopped } : {}) },
        error: outcome.error,
        finishedAt: new Date(),
        durationMs: Math.max(0, Math.round(outcome.durationMs)),
        engineVersion: outcome.engineVersion,
      })
      .where(eq(cells.id, cell.id));
    const stored: ObjectRow[] = [];
    for (const o of outcome.objects) {
      const [row] = await tx
        .insert(namedObjects)
        .values({
          sessionId: cell.sessionId,
          ownerId: user.id,
          name: o.name,
          type: o.type,
          value: o.value,
          source: o.source,
          sourceCellId: cell.id,
        })
        .onConflictDoUpdate({
          target: [namedObjects.sessionId, namedObjects.name],
          // A name bound again by a cell is that cell's object now, no longer an imported
          // copy, and defined by whoever ran the cell.
          set: {
            type: o.type,
            value: o.value,
            source: o.source,
            sourceCellId: cell.id,
            origin: null,
            ownerId: user.id,
            updatedAt: new Date(),
          },
        })
        .returning();
      stored.push(row!);
    }
    await tx.update(sessions).set({ updatedAt: new Date() }).where(eq(sessions.id, cell.sessionId));
    const first = outcome.objects.find((o) => o.source.trim() !== "");
    if (first) {
      // Only a placeholder title is replaced, and only once.
      await tx
        .update(sessions)
        .set({ title: titleFromDefinition(first.source), autoTitle: false })
        .where(and(eq(sessions.id, cell.sessionId), eq(sessions.autoTitle, true)));
    }
    return stored;
  });
  if (replaced.size > 0) await pruneDetails(replaced);
  return saved;
}

export async function renameObject(sessionId: string, objectId: string, name: string): Promise<ObjectRow | undefined> {
  const [row] = await db()
    .update(namedObjects)
    .set({ name, updatedAt: new Date() })
    .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.id, objectId)))
    .returning();
  return row;
}

/// Deletes a named object, then its large value's detail file when nothing else holds it.
export async function deleteObject(sessionId: string, objectId: string): Promise<boolean> {
  const rows = await db()
    .delete(namedObjects)
    .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.id, objectId)))
    .returning({ id: namedObjects.id, value: namedObjects.value });
  if (rows.length > 0) await pruneDetails(detailIdsIn(rows[0]!.value));
  return rows.length > 0;
}

/// Marks a cell whose outcome could not be stored (the database kept failing): a smaller
/// write than finishCell, tried last.
export async function markUnsaved(cellId: string, message: string): Promise<void> {
  await db().execute(sql`
    UPDATE cells SET status = 'error', finished_at = now(),
      error = ${JSON.stringify({ type: "Error", kind: "runtime", message, span: { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } } })}::jsonb
    WHERE id = ${cellId}::uuid AND status = 'running'`);
}

/// Ends a running cell no server will finish (an orphan), keeping what its heartbeat stored.
export async function endOrphan(cellId: string, status: "cancelled" | "interrupted", stopped: string): Promise<boolean> {
  const rows = await db().execute(sql`
    UPDATE cells SET status = ${status}, finished_at = now(),
      result = jsonb_set(COALESCE(result, '{}'::jsonb), '{stopped}',
        to_jsonb('stopped' || COALESCE(' after ' || (result->>'progress'), '') || ': ' || ${stopped}::text))
    WHERE id = ${cellId}::uuid AND status = 'running' RETURNING id`);
  return rows.length > 0;
}

/// Whether one of the session's cells or named objects holds a value whose detail is `detailId`
/// (so a reader of the session may fetch it).
export async function sessionHoldsDetail(sessionId: string, detailId: string): Promise<boolean> {
  const needle = `%"id": "${detailId}"%`;
  const rows = await db().execute(sql`
    SELECT 1 FROM cells WHERE session_id = ${sessionId} AND result::text LIKE ${needle}
    UNION ALL
    SELECT 1 FROM named_objects WHERE session_id = ${sessionId} AND value::text LIKE ${needle}
    LIMIT 1`);
  return rows.length > 0;
}
