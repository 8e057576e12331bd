"use client";
/// The session's documents through SWR: the session list, the open session, its cells
/// and its named objects, with their errors as messages.
import useSWR from "swr";
import { ApiError, fetchJson, keys } from "./api/client";
import type { Cell, NamedObject, SessionDetail, SessionSummary } from "./api/types";

const messageOf = (e: unknown): string | null =>
  e === undefined || e === null ? null : e instanceof ApiError ? e.message : "The server could not be reached.";

/// Everything the console reads about `sessionId` (null: no session open).
export function useSessionData(sessionId: string | null) {
  const sessions = useSWR<{ sessions: SessionSummary[] }>(keys.sessions, fetchJson);
  const session = useSWR<{ session: SessionDetail }>(sessionId ? keys.session(sessionId) : null, fetchJson);
  const cells = useSWR<{ cells: Cell[] }>(sessionId ? keys.cells(sessionId) : null, fetchJson);
  const objects = useSWR<{ objects: NamedObject[] }>(sessionId ? keys.objects(sessionId) : null, fetchJson);
  return {
    sessions: sessions.data?.sessions,
    sessionsError: messageOf(sessions.error),
    session: session.data?.session,
    sessionError: messageOf(session.error),
    cells: cells.data?.cells,
    cellsError: messageOf(cells.error),
    objects: objects.data?.objects,
    refreshSessions: () => sessions.mutate(),
    refreshCells: () => cells.mutate(),
    refreshObjects: () => objects.mutate(),
  };
}
