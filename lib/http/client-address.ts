/// The client's address as the rate limiter and audit log see it: the first hop of
/// X-Forwarded-For (Next.js fills it from the socket when the request has none; behind a
/// reverse proxy, the proxy must overwrite it), else X-Real-IP, else "unknown".
export function clientAddress(headers: Headers | Record<string, string | string[] | undefined>): string {
  const get = (name: string): string | undefined => {
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const v = headers[name];
    return Array.isArray(v) ? v[0] : v;
  };
  const forwarded = get("x-forwarded-for")?.split(",")[0]?.trim();
  return (forwarded || get("x-real-ip")?.trim() || "unknown").slice(0, 100);
}
