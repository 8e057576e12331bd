/// The client's address as the rate limiter and audit log see it.
///
/// Only the process that owns the socket knows who connected, so the web server
/// (lib/ops/web-server.ts) resolves the address once per request and passes it in the
/// CLIENT_ADDRESS_HEADER, overwriting whatever the client sent under that name:
/// the socket's peer, unless that peer is a trusted proxy (RINGSIDE_TRUSTED_PROXIES, a
/// comma-separated list of addresses and CIDR blocks), in which case the X-Forwarded-For
/// hops are read from the right, skipping trusted proxies, and the first untrusted hop is
/// the client (the rule RFC 7239 §7.4 describes for chains of proxies). A spoofed
/// X-Forwarded-For from an untrusted peer changes nothing.
import { BlockList, isIP } from "node:net";

export const CLIENT_ADDRESS_HEADER = "x-ringside-client-address";

// Set by web-server.ts in its own process (Next runs the routes in that process). Without
// it (`next dev`, a bare `next start`) nobody overwrote the header, so it is not believed.
const SERVER_RESOLVES = Symbol.for("ringside.serverResolvesClientAddress");

export function markClientAddressResolved(): void {
  (globalThis as Record<symbol, unknown>)[SERVER_RESOLVES] = true;
}

function serverResolves(): boolean {
  return (globalThis as Record<symbol, unknown>)[SERVER_RESOLVES] === true;
}

type HeaderSource = Headers | Record<string, string | string[] | undefined>;

function header(headers: HeaderSource, name: string): string | undefined {
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const v = headers[name];
  return Array.isArray(v) ? v[0] : v;
}

/// Reads the address that the web server resolved. Under `next dev` (no web-server.ts)
/// Next fills X-Forwarded-For from the socket when the client sent none; that is the best
/// a development server can do. In production without web-server.ts the answer is
/// "unknown": the address is never taken from a header the client controls.
export function clientAddress(headers: HeaderSource): string {
  const resolved = serverResolves() ? header(headers, CLIENT_ADDRESS_HEADER)?.trim() : undefined;
  if (resolved) return resolved.slice(0, 100);
  if (process.env.NODE_ENV === "development") {
    const forwarded = header(headers, "x-forwarded-for")?.split(",")[0]?.trim();
    if (forwarded) return forwarded.slice(0, 100);
  }
  return "unknown";
}

/// "::ffff:127.0.0.1" (an IPv4 peer on a dual-stack socket) → "127.0.0.1".
export function normalizeAddress(address: string): string {
  const a = address.trim();
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(a);
  return mapped ? mapped[1]! : a.toLowerCase();
}

/// Parses RINGSIDE_TRUSTED_PROXIES ("127.0.0.1, 10.0.0.0/8, ::1"); throws on an entry that
/// is neither an address nor a CIDR block, so a typo cannot silently trust nothing or all.
export function parseTrustedProxies(spec: string | undefined): BlockList {
  const list = new BlockList();
  for (const raw of (spec ?? "").split(",")) {
    const entry = raw.trim();
    if (!entry) continue;
    const [addr, bits, extra] = entry.split("/");
    const family = isIP(addr ?? "");
    if (family === 0 || extra !== undefined)
      throw new Error(`RINGSIDE_TRUSTED_PROXIES: ${JSON.stringify(entry)} is not an address or CIDR block`);
    const type = family === 4 ? "ipv4" : "ipv6";
    if (bits === undefined) {
      list.addAddress(addr!, type);
    } else {
      const prefix = Number(bits);
      if (!Number.isInteger(prefix) || prefix < 0 || prefix > (family === 4 ? 32 : 128)) {
        throw new Error(`RINGSIDE_TRUSTED_PROXIES: ${JSON.stringify(entry)} has a bad prefix length`);
      }
      list.addSubnet(addr!, prefix, type);
    }
  }
  return list;
}

function isTrusted(list: BlockList, address: string): boolean {
  const family = isIP(address);
  return family !== 0 && list.check(address, family === 4 ? "ipv4" : "ipv6");
}

/// The client address for a request whose socket peer is `peer` and which carried
/// `forwardedFor` (the X-Forwarded-For header, possibly repeated).
export function resolveClientAddress(peer: string | undefined, forwardedFor: string | string[] | undefined, trusted: BlockList): string {
  let current = normalizeAddress(peer ?? "unknown");
  const hops = (Array.isArray(forwardedFor) ? forwardedFor.join(",") : (forwardedFor ?? ""))
    .split(",")
    .map((h) => normalizeAddress(h))
    .filter((h) => h !== "");
  while (isTrusted(trusted, current) && hops.length > 0) {
    const next = hops.pop()!;
    if (isIP(next) === 0) break; // a malformed hop: stay with the last proxy we trust to have spoken
    current = next;
  }
  return current.slice(0, 100);
}
