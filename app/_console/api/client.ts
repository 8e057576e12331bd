/// Calls to the sessions API (app/api/README.md): a JSON fetcher for SWR that turns the
/// API's `{error: {code, message}}` answers into thrown ApiErrors, and the mutations.
import type { NamedObject } from "./types";

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

async function send<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, {
    ...init,
    headers: { accept: "application/json", ...(init?.body ? { "content-type": "application/json" } : {}) },
  });
  if (!res.ok) throw await errorOf(res);
  return (await res.json()) as T;
}

/// The SWR fetcher: GET a JSON document.
export const fetchJson = <T>(url: string): Promise<T> => send<T>(url);

/// SWR keys of the documents the console reads.
export const keys = {
  sessions: "/api/sessions",
  session: (id: string) => `/api/sessions/${id}`,
  cells: (id: string) => `/api/sessions/${id}/cells`,
  objects: (id: string) => `/api/sessions/${id}/objects`,
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

/// The transcript export address (the route arrives in a later issue).
export const exportUrl = (sessionId: string) => `/api/sessions/${sessionId}/export?format=markdown`;
