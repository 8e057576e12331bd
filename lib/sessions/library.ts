/// The library: every named object a user may reach, across sessions — the objects of
/// every session they can read (their own, shared with them, their team's) and the
/// objects shared with them one by one — searchable by name, type and content.
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/types";
import { containsPattern, listSessions } from "./store";

export interface LibraryEntry {
  id: string;
  name: string;
  type: string;
  summary: string;
  source: string;
  sessionId: string;
  sessionTitle: string;
  /// who defined it
  definedByName: string;
  mine: boolean;
  /// how the user reaches it: their session, a session shared with them, or a share of the object itself
  via: "own session" | "shared session" | "shared object";
  updatedAt: string;
}

export interface LibraryQuery {
  /// matched against name, type, the value's text and the defining source
  text?: string;
  /// an exact type name, e.g. "Ideal" or "Resolution"
  type?: string;
  limit?: number;
}

export async function searchLibrary(user: CurrentUser, query: LibraryQuery = {}): Promise<LibraryEntry[]> {
  const readable = await listSessions(user);
  const sessionIds = readable.map((s) => s.id);
  const ownIds = new Set(readable.filter((s) => s.access === "owner").map((s) => s.id));
  const q = query.text?.trim() ? containsPattern(query.text.trim()) : null;
  const type = query.type?.trim() || null;
  const limit = Math.min(Math.max(query.limit ?? 200, 1), 500);
  const idList =
    sessionIds.length > 0
      ? sql.join(
          sessionIds.map((id) => sql`${id}::uuid`),
          sql`, `,
        )
      : sql`NULL::uuid`;
  const rows = await db().execute<{
    id: string;
    name: string;
    type: string;
    text: string | null;
    source: string;
    session_id: string;
    session_title: string;
    defined_by: string;
    defined_by_name: string;
    via_object_share: boolean;
    updated_at: string;
  }>(sql`
    SELECT o.id, o.name, o.type, o.value->>'text' AS text, o.source, o.session_id, s.title AS session_title,
      o.owner_id AS defined_by, u.display_name AS defined_by_name,
      NOT (o.session_id IN (${idList})) AS via_object_share, o.updated_at
    FROM named_objects o
    JOIN sessions s ON s.id = o.session_id
    JOIN users u ON u.id = o.owner_id
    WHERE (o.session_id IN (${idList})
        OR EXISTS (SELECT 1 FROM shares sh LEFT JOIN memberships m ON m.team_id = sh.team_id AND m.user_id = ${user.id}
                   WHERE sh.object_id = o.id AND (sh.user_id = ${user.id} OR m.user_id IS NOT NULL)))
      AND (${q}::text IS NULL OR o.name ILIKE ${q} OR o.type ILIKE ${q} OR o.value->>'text' ILIKE ${q} OR o.source ILIKE ${q})
      AND (${type}::text IS NULL OR lower(o.type) = lower(${type}))
    ORDER BY o.updated_at DESC
    LIMIT ${limit}`);
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    type: r.type,
    summary: (r.text ?? "").replace(/\s+/g, " ").trim().slice(0, 120),
    source: r.source,
    sessionId: r.session_id,
    sessionTitle: r.session_title,
    definedByName: r.defined_by_name,
    mine: r.defined_by === user.id,
    via: r.via_object_share ? "shared object" : ownIds.has(r.session_id) ? "own session" : "shared session",
    updatedAt: new Date(r.updated_at).toISOString(),
  }));
}
