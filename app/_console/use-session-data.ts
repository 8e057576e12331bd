"use client";
/// The session's documents through SWR: the session list, the open session, its cells
/// and its named objects, with their errors as messages. A read-only link's token is part
/// of every key, so the holder's requests carry it; a signed-out visitor has no session list.
import useSWR from "swr";
import { keys } from "./api/client";
import { ApiError, fetchJson } from "@/app/_client/fetch";
import type { Cell } from "@/lib/wire/reading";
import type { NamedObject, SessionDetail, SessionSummary } from "@/lib/wire/reading";

const loadProblemOf = (e: unknown): string | null =>
  e === undefined || e === null ? null : e instanceof ApiError ? e.message : "The server could not be reached.";

/// Everything the console reads about `sessionId` (null: no session open).
export function useSessionData(sessionId: string | null, link: string | null, signedIn: boolean) {
  const sessions = useSWR<{ sessions: SessionSummary[] }>(signedIn ? keys.sessions : null, fetchJson);
  const session = useSWR<{ session: SessionDetail }>(sessionId ? keys.session(sessionId, link) : null, fetchJson);
  const cells = useSWR<{ cells: Cell[] }>(sessionId ? keys.cells(sessionId, link) : null, fetchJson);
  const objects = useSWR<{ objects: NamedObject[] }>(sessionId ? keys.objects(sessionId, link) : null, fetchJson);
  return {
    sessions: sessions.data?.sessions,
    sessionsError: loadProblemOf(sessions.error),
    session: session.data?.session,
    sessionError: loadProblemOf(session.error),
    sessionStatus: session.error instanceof ApiError ? session.error.status : null,
    cells: cells.data?.cells,
    cellsError: loadProblemOf(cells.error),
    objects: objects.data?.objects,
    refreshSessions: () => sessions.mutate(),
    refreshSession: () => session.mutate(),
    refreshCells: () => cells.mutate(),
    refreshObjects: () => objects.mutate(),
  };
}
