/// Cross-site request forgery defence for every state-changing request (POST, PUT, PATCH,
/// DELETE), applied once in proxy.ts for pages and API routes alike. A browser marks where a
/// request comes from with `Sec-Fetch-Site` (Fetch Metadata, W3C) and `Origin` (RFC 6454,
/// sent on every non-GET fetch and form post); a request that carries neither did not come
/// from a page of ours, so it is refused too: scripts and tools send `Origin` themselves.

export const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export type OriginVerdict = { ok: true } | { ok: false; why: string };

/// `allowedOrigins` are full origins such as "https://ringside.example" (from NEXTAUTH_URL);
/// `host` is the request's Host header, which a browser sets and a page cannot change.
export function checkSameOrigin(
  method: string,
  headers: Headers,
  opts: { host: string | null; allowedOrigins: readonly string[] },
): OriginVerdict {
  if (!STATE_CHANGING.has(method.toUpperCase())) return { ok: true };
  const site = headers.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none") {
    return { ok: false, why: `a ${site} request may not change anything here (Sec-Fetch-Site: ${site}).` };
  }
  const origin = headers.get("origin");
  if (origin === null) {
    if (site === "same-origin") return { ok: true };
    return { ok: false, why: "the request carries no Origin header; send the origin of this site." };
  }
  let parsed: URL;
  try {
    parsed = new URL(origin);
  } catch {
    return { ok: false, why: `the Origin header ${JSON.stringify(origin.slice(0, 100))} is not an origin.` };
  }
  if (parsed.origin === "null") return { ok: false, why: "an opaque origin (Origin: null) may not change anything here." };
  const sameHost = opts.host !== null && parsed.host === opts.host.toLowerCase();
  if (sameHost || opts.allowedOrigins.includes(parsed.origin)) return { ok: true };
  return { ok: false, why: `requests from ${parsed.origin} may not change anything here.` };
}

/// The origins named by NEXTAUTH_URL and RINGSIDE_ALLOWED_ORIGINS (comma-separated).
export function configuredOrigins(env: Record<string, string | undefined> = process.env): string[] {
  const out: string[] = [];
  for (const raw of [env.NEXTAUTH_URL, ...(env.RINGSIDE_ALLOWED_ORIGINS ?? "").split(",")]) {
    const v = raw?.trim();
    if (!v) continue;
    try {
      out.push(new URL(v).origin);
    } catch {
      // A malformed entry allows nothing.
    }
  }
  return out;
}
