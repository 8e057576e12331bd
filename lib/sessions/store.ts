/// Queries for sessions, cells and named objects. Access checks happen before these are
/// called (lib/auth/access); every write that spans rows is one transaction.
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { cells, namedObjects, sessions, users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/types";
import type { SessionSummary } from "@/lib/wire/sessions";

export type CellRow = typeof cells.$inferSelect;
export type ObjectRow = typeof namedObjects.$inferSelect;

/// What a finished (or stopped) cell stores.
export interface CellOutcome {
  status: "done" | "error" | "cancelled";
  results: unknown[];
  error: unknown | null;
  durationMs: number;
  engineVersion: string;
  objects: { name: string; type: string; value: unknown; source: string }[];
  /// the binding that is the current ring after this cell (the next cell starts there)
  currentRing: string | null;
}

export async function createSession(user: CurrentUser, title: string) {
  const [row] = await db().insert(sessions).values({ title, ownerId: user.id }).returning();
  return row!;
}

/// Sessions the user owns, or reaches through a share (to them or a team of theirs), or
/// through a team-visible session of a team they belong to; newest activity first.
export async function listSessions(user: CurrentUser): Promise<SessionSummary[]> {
  const rows = await db().execute<{
    id: string;
    title: string;
    owner_name: string;
    owner_id: string;
    updated_at: string;
    share_role: "viewer" | "editor" | null;
    team_role: "lead" | "member" | "guest" | null;
  }>(sql`
    SELECT s.id, s.title, u.display_name AS owner_name, s.owner_id, s.updated_at,
      (SELECT CASE WHEN bool_or(sh.role = 'editor' AND COALESCE(m2.role, 'member') <> 'guest') THEN 'editor' ELSE 'viewer' END
         FROM shares sh LEFT JOIN memberships m2 ON m2.team_id = sh.team_id AND m2.user_id = ${user.id}
        WHERE sh.session_id = s.id AND (sh.user_id = ${user.id} OR m2.user_id IS NOT NULL)
        HAVING count(*) > 0) AS share_role,
      (SELECT m.role FROM memberships m
        WHERE m.team_id = s.team_id AND m.user_id = ${user.id} AND s.visibility <> 'private') AS team_role
    FROM sessions s JOIN users u ON u.id = s.owner_id
    ORDER BY s.updated_at DESC
  `);
  return rows
    .map((r) => {
      const viaTeam = r.team_role === null ? null : r.team_role === "guest" ? "viewer" : "editor";
      const access =
        r.owner_id === user.id
          ? "owner"
          : r.share_role === "editor" || viaTeam === "editor"
            ? "editor"
            : r.share_role ?? viaTeam;
      return { id: r.id, title: r.title, ownerName: r.owner_name, access, updatedAt: new Date(r.updated_at).toISOString() };
    })
    .filter((s): s is typeof s & { access: "owner" | "editor" | "viewer" } => s.access !== null);
}

export async function ownerName(ownerId: string): Promise<string> {
  const [row] = await db().select({ name: users.displayName }).from(users).where(eq(users.id, ownerId));
  return row?.name ?? "";
}

export async function listCells(sessionId: string): Promise<CellRow[]> {
  return db().select().from(cells).where(eq(cells.sessionId, sessionId)).orderBy(asc(cells.position));
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
export async function startCell(sessionId: string, user: CurrentUser, source: string): Promise<CellRow> {
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
      .values({ sessionId, position: (last?.position ?? -1) + 1, source, status: "running", createdBy: user.id, startedAt: new Date() })
      .returning();
    await tx.update(sessions).set({ updatedAt: new Date() }).where(eq(sessions.id, sessionId));
    return row!;
  });
}

/// Writes a cell's final state and the named objects it bound, in one transaction.
/// A name bound again replaces the earlier object (notation.md §2); earlier cells keep
/// their results.
export async function finishCell(cell: CellRow, user: CurrentUser, outcome: CellOutcome): Promise<ObjectRow[]> {
  return db().transaction(async (tx) => {
    await tx
      .update(cells)
      .set({
        status: outcome.status,
        result: { statements: outcome.results, currentRing: outcome.currentRing },
        error: outcome.error,
        finishedAt: new Date(),
        durationMs: Math.max(0, Math.round(outcome.durationMs)),
        engineVersion: outcome.engineVersion,
      })
      .where(eq(cells.id, cell.id));
    const saved: ObjectRow[] = [];
    for (const o of outcome.objects) {
      const [row] = await tx
        .insert(namedObjects)
        .values({ sessionId: cell.sessionId, ownerId: user.id, name: o.name, type: o.type, value: o.value, source: o.source, sourceCellId: cell.id })
        .onConflictDoUpdate({
          target: [namedObjects.sessionId, namedObjects.name],
          // A name bound again by a cell is that cell's object now, no longer an imported copy.
          set: { type: o.type, value: o.value, source: o.source, sourceCellId: cell.id, origin: null, updatedAt: new Date() },
        })
        .returning();
      saved.push(row!);
    }
    await tx.update(sessions).set({ updatedAt: new Date() }).where(eq(sessions.id, cell.sessionId));
    return saved;
  });
}

export async function renameObject(sessionId: string, objectId: string, name: string): Promise<ObjectRow | undefined> {
  const [row] = await db()
    .update(namedObjects)
    .set({ name, updatedAt: new Date() })
    .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.id, objectId)))
    .returning();
  return row;
}

export async function deleteObject(sessionId: string, objectId: string): Promise<boolean> {
  const rows = await db()
    .delete(namedObjects)
    .where(and(eq(namedObjects.sessionId, sessionId), eq(namedObjects.id, objectId)))
    .returning({ id: namedObjects.id });
  return rows.length > 0;
}

/// Cells left `running` by a server that stopped mid-computation can never finish: mark
/// them so the transcript does not show them as running forever.
export async function abandonStaleCells(olderThanMs: number): Promise<number> {
  const rows = await db().execute(sql`
    UPDATE cells SET status = 'error', finished_at = now(),
      error = ${JSON.stringify({
        type: "Error",
        kind: "runtime",
        message: "the server stopped while this cell was running; run it again",
        span: { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } },
      })}::jsonb
    WHERE status = 'running' AND started_at < now() - (${olderThanMs} || ' milliseconds')::interval
    RETURNING id`);
  return rows.length;
}
