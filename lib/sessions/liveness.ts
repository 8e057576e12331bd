/// No cell stays `running` (issue 13): every running cell carries the id of the server
/// process running it and a heartbeat. Each server refreshes the heartbeat of its own
/// running cells — writing what they streamed so far with it — and marks `interrupted` every
/// running cell whose server is gone: at start (a dead process on this host is known at
/// once) and on every beat (a heartbeat older than `orphanAfterMs`, whichever host).
import os from "node:os";
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { limitValue } from "@/lib/limits";

/// This server process: "host/pid/nonce" (the nonce tells a restarted process that happens to
/// get the same pid from the one that died).
const holder = globalThis as typeof globalThis & { __ringsideLiveness?: Liveness };

interface Tracked {
  /// what the cell streamed so far, as it would be stored; null when unchanged since the last beat
  snapshot: () => unknown | null;
}

interface Liveness {
  serverId: string;
  tracked: Map<string, Tracked>;
  timer?: NodeJS.Timeout;
  beating?: Promise<void>;
}

function liveness(): Liveness {
  return (holder.__ringsideLiveness ??= { serverId: `${os.hostname()}/${process.pid}/${randomUUID().slice(0, 8)}`, tracked: new Map() });
}

export function serverId(): string {
  return liveness().serverId;
}

/// Whether the server that stored `id` is known to be gone without waiting for its heartbeat
/// to age: a process on this host that no longer exists (or is now someone else).
export function serverIsGone(id: string | null): boolean {
  if (id === null) return false;
  const [host, pidText, nonce] = id.split("/");
  if (host !== os.hostname()) return false;
  const pid = Number(pidText);
  if (!Number.isInteger(pid) || pid <= 0) return false;
  if (pid === process.pid) return id !== serverId() && nonce !== undefined;
  try {
    process.kill(pid, 0);
    return false;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "ESRCH";
  }
}

/// Keeps the cell's heartbeat (and its streamed work) fresh until the returned function is called.
export function trackRunningCell(cellId: string, snapshot: Tracked["snapshot"]): () => void {
  const l = liveness();
  l.tracked.set(cellId, { snapshot });
  startHeartbeat();
  return () => l.tracked.delete(cellId);
}

/// Starts the heartbeat and orphan sweep of this process (idempotent); the first sweep runs now.
export function startHeartbeat(): void {
  const l = liveness();
  if (l.timer) return;
  l.timer = setInterval(() => void beat(), limitValue("heartbeatMs"));
  l.timer.unref();
  void beat();
}

async function beat(): Promise<void> {
  const l = liveness();
  if (l.beating) return; // a slow database: one beat at a time
  l.beating = (async () => {
    try {
      const ids = [...l.tracked.keys()];
      if (ids.length > 0) {
        await db().execute(sql`UPDATE cells SET heartbeat_at = now()
          WHERE status = 'running' AND id IN (${sql.join(
            ids.map((id) => sql`${id}::uuid`),
            sql`, `,
          )})`);
        for (const [id, t] of l.tracked) {
          const snap = t.snapshot();
          if (snap !== null)
            await db().execute(sql`UPDATE cells SET result = ${JSON.stringify(snap)}::jsonb WHERE id = ${id}::uuid AND status = 'running'`);
        }
      }
      await markOrphans();
    } catch (error) {
      // The database is away (restarting?): the next beat tries again.
      console.error("[ringside] heartbeat failed:", (error as Error).message);
    } finally {
      l.beating = undefined;
    }
  })();
  return l.beating;
}

const INTERRUPTED_ERROR = {
  type: "Error",
  kind: "runtime",
  message: "the server running this cell stopped before it finished; run it again",
  span: { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } },
};

/// Marks `interrupted` every running cell whose server is gone: one on this host that no
/// longer exists, or any whose heartbeat is older than `orphanAfterMs` (a cell stored before
/// heartbeats existed counts from its start). Keeps the results it had streamed.
export async function markOrphans(): Promise<number> {
  const staleMs = limitValue("orphanAfterMs");
  const running = await db().execute<{ id: string; server_id: string | null }>(sql`
    SELECT id, server_id FROM cells WHERE status = 'running'`);
  const gone = running.filter((r) => serverIsGone(r.server_id)).map((r) => r.id);
  const rows = await db().execute(sql`
    UPDATE cells SET status = 'interrupted', finished_at = now(),
      error = COALESCE(error, ${JSON.stringify(INTERRUPTED_ERROR)}::jsonb),
      result = jsonb_set(COALESCE(result, '{}'::jsonb), '{stopped}',
        to_jsonb('stopped' || COALESCE(' after ' || (result->>'progress'), '') || ': the server running this cell stopped before it finished'::text))
    WHERE status = 'running' AND (
      ${
        gone.length > 0
          ? sql`id IN (${sql.join(
              gone.map((id) => sql`${id}::uuid`),
              sql`, `,
            )}) OR`
          : sql``
      }
      COALESCE(heartbeat_at, started_at, created_at) < now() - (${staleMs} || ' milliseconds')::interval)
    RETURNING id`);
  return rows.length;
}

/// Whether a running cell can no longer be finished by anyone: its server is this one but no
/// longer runs it, or its server is gone, or its heartbeat is too old.
export function isOrphan(cell: { id: string; serverId: string | null; heartbeatAt: Date | null; startedAt: Date | null }): boolean {
  if (cell.serverId === serverId()) return !liveness().tracked.has(cell.id);
  if (serverIsGone(cell.serverId)) return true;
  const last = cell.heartbeatAt ?? cell.startedAt;
  return last === null || Date.now() - last.getTime() > limitValue("orphanAfterMs");
}
