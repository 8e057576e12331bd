/// Input history across all of a user's sessions: the cell sources they ran themselves or
/// that were run in sessions they own, each distinct source once (its latest run), newest
/// first, optionally only those containing `query`.
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/types";
import { containsPattern } from "./store";

export interface HistoryEntry {
  source: string;
  sessionId: string;
  sessionTitle: string;
  ranAt: string;
}

export async function searchHistory(user: CurrentUser, query: string | undefined, limit = 100): Promise<HistoryEntry[]> {
  const q = query?.trim() ? containsPattern(query.trim()) : null;
  const rows = await db().execute<{ source: string; session_id: string; session_title: string; created_at: string }>(sql`
    SELECT DISTINCT ON (btrim(c.source)) btrim(c.source) AS source, c.session_id, s.title AS session_title, c.created_at
    FROM cells c JOIN sessions s ON s.id = c.session_id
    WHERE (c.created_by = ${user.id} OR s.owner_id = ${user.id})
      AND (${q}::text IS NULL OR c.source ILIKE ${q})
    ORDER BY btrim(c.source), c.created_at DESC`);
  return rows
    .map((r) => ({ source: r.source, sessionId: r.session_id, sessionTitle: r.session_title, ranAt: new Date(r.created_at).toISOString() }))
    .sort((a, b) => (a.ranAt < b.ranAt ? 1 : a.ranAt > b.ranAt ? -1 : 0))
    .slice(0, limit);
}
