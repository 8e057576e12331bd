/// Calling the JSON API from any page (app/api/README.md): one error shape for every page
/// (`{error: {code, message}}` becomes a thrown ApiError with the server's message), the
/// SWR fetcher, and the read-only link's token on an address. Client code only: imports
/// nothing but the browser's fetch.
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

/// Calls the API and returns its JSON: GET without a body, POST with one unless `method` says.
export function api<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  return send<T>(path, {
    method: init.method ?? (init.body === undefined ? "GET" : "POST"),
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
}
