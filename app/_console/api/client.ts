/// Calls of the console to the sessions API (app/api/README.md): the SWR keys of the
/// documents it reads, and the mutations. The fetch helpers every page shares are in
/// app/_client/fetch.ts.
import { ApiError, send, withLink } from "@/app/_client/fetch";
import type { NamedObject } from "@/lib/wire/reading";

/// SWR keys of the documents the console reads; `link` is the page's read-only link
/// token (null when the visitor came without one).
export const keys = {
  sessions: "/api/sessions",
  session: (id: string, link: string | null = null) => withLink(`/api/sessions/${id}`, link),
  cells: (id: string, link: string | null = null) => withLink(`/api/sessions/${id}/cells`, link),
  objects: (id: string, link: string | null = null) => withLink(`/api/sessions/${id}/objects`, link),
  sharedObjects: "/api/objects",
  teams: "/api/teams",
  sessionShares: (id: string) => `/api/sessions/${id}/shares`,
  objectShares: (objectId: string) => `/api/objects/${objectId}/shares`,
} as const;

/// Creates a session; without a title the server names it by its first definition.
export const createSession = (title?: string) =>
  send<{ id: string; title: string }>(keys.sessions, { method: "POST", body: JSON.stringify(title === undefined ? {} : { title }) });

/// Asks the server to stop a running cell; false when it had already finished (409).
export async function cancelCell(sessionId: string, cellId: string): Promise<boolean> {
  try {
    await send(`/api/sessions/${sessionId}/cells/${cellId}/cancel`, { method: "POST" });
    return true;
  } catch (e) {
    if (e instanceof ApiError && e.status === 409) return false;
    throw e;
  }
}

/// Renames a named object.
export const renameObject = (sessionId: string, objectId: string, name: string) =>
  send<{ object: NamedObject }>(`/api/sessions/${sessionId}/objects/${objectId}`, {
    method: "PATCH",
    body: JSON.stringify({ name }),
  });

/// Deletes a named object.
export const deleteObject = (sessionId: string, objectId: string) =>
  send<{ deleted: true }>(`/api/sessions/${sessionId}/objects/${objectId}`, { method: "DELETE" });

/// The transcript export formats of GET /api/sessions/:id/export.
export type ExportFormat = "latex" | "markdown" | "json";

/// The transcript export address in `format`, carrying the link token when there is one.
export const exportUrl = (sessionId: string, format: ExportFormat, link: string | null = null) =>
  withLink(`/api/sessions/${sessionId}/export?format=${format}`, link);

/// The address of the whole value behind a summary (its `detail.id`), with the link token.
export const detailUrl = (sessionId: string, detailId: string, link: string | null = null) =>
  withLink(`/api/sessions/${sessionId}/details/${detailId}`, link);
