/// A small HTTP client for the production server that test.sh starts: keeps cookies, sets a
/// chosen client address (X-Forwarded-For) so each test file has its own rate-limit bucket,
/// and signs in through next-auth's credentials endpoint as a browser would.
import { testEnv } from "./env";

export class TestClient {
  private readonly cookies = new Map<string, string>();

  constructor(
    readonly address: string,
    readonly base: string = testEnv("RINGSIDE_TEST_BASE_URL"),
  ) {}

  async request(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    headers.set("X-Forwarded-For", this.address);
    // As a browser does on every fetch that changes something: the server refuses
    // state-changing requests without a same-origin Origin (lib/http/same-origin.ts).
    if (!headers.has("Origin")) headers.set("Origin", new URL(this.base).origin);
    if (this.cookies.size > 0) headers.set("Cookie", [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; "));
    const response = await fetch(new URL(path, this.base), { ...init, headers, redirect: "manual" });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair!.indexOf("=");
      const name = pair!.slice(0, eq).trim();
      const value = pair!.slice(eq + 1).trim();
      if (value === "" || /max-age=0/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return response;
  }

  json(path: string, body: unknown, method = "POST"): Promise<Response> {
    return this.request(path, { method, headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
  }

  /// Posts the credentials form; the answer is next-auth's (200 on success, 401 on a wrong
  /// password) or the rate limiter's 429.
  async signIn(email: string, password: string): Promise<Response> {
    const csrf = (await (await this.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const form = new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: "true", callbackUrl: this.base });
    return this.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: form.toString(),
    });
  }

  /// The same sign-in with a JSON body (next-auth reads JSON as readily as a form).
  async signInJson(email: string, password: string): Promise<Response> {
    const csrf = (await (await this.request("/api/auth/csrf")).json()) as { csrfToken: string };
    return this.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ csrfToken: csrf.csrfToken, email, password, json: "true", callbackUrl: this.base }),
    });
  }

  /// Signs out through next-auth (which ends every session of the account).
  async signOut(): Promise<Response> {
    const csrf = (await (await this.request("/api/auth/csrf")).json()) as { csrfToken: string };
    return this.request("/api/auth/signout", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, json: "true" }).toString(),
    });
  }

  /// Another client holding the same cookies, as someone who copied the session cookie would.
  copy(address = this.address): TestClient {
    const other = new TestClient(address, this.base);
    for (const [k, v] of this.cookies) other.cookies.set(k, v);
    return other;
  }

  hasSession(): boolean {
    return [...this.cookies.keys()].some((k) => k.endsWith("next-auth.session-token"));
  }
}

/// A distinct documentation-range address per caller (RFC 5737), so rate-limit buckets of
/// different test files never meet.
export function testAddress(n: number): string {
  return `198.51.100.${n}`;
}
