/// Calls to the sessions API (app/api/README.md): a JSON fetcher for SWR that turns the
/// API's `{error: {code, message}}` answers into thrown ApiErrors, and the mutations.
import type { NamedObject } from "@/lib/wire/reading";

/// An error answer of the API, with its HTTP status and the server's message.
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "ApiError";
  }
}

/// The error carried by a non-2xx response (the API's JSON shape, or the status text).
export async function errorOf(res: Response): Promise<ApiError> {
  let code = `http_${res.status}`;
  let message = res.statusText || `The server answered ${res.status}.`;
  try {
    const body = (await res.json()) as { error?: { code?: string; message?: string } };
    if (body.error?.message) message = body.error.message;
    if (body.error?.code) code = body.error.code;
  } catch {
    // Not JSON (a proxy page, an empty body): keep the status text.
  }
  return new ApiError(res.status, code, message);
}

/// The words to show for a failed call: the server's message, or the error's own.
export const messageOf = (e: unknown): string => (e instanceof Error ? e.message : String(e));

/// Adds a read-only link's token to an API address: every call made for a link holder
/// carries it (`?link=`), or the server cannot tell the holder from a stranger.
export function withLink(url: string, link: string | null): string {
  if (!link) return url;
  return `${url}${url.includes("?") ? "&" : "?"}link=${encodeURIComponent(link)}`;
}

export async function send<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, {
    ...init,
    headers: { accept: "application/json", ...(init?.body ? { "content-type": "application/json" } : {}) },
  });
  if (!res.ok) throw await errorOf(res);
  return (await res.json()) as T;
}

/// The SWR fetcher: GET a JSON document.
export const fetchJson = <T>(url: string): Promise<T> => send<T>(url);

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

/// Creates a session.
export const createSession = (title: string) =>
  send<{ id: string; title: string }>(keys.sessions, { method: "POST", body: JSON.stringify({ title }) });

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
