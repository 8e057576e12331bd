/// Sign-in protection (issue 13, item 5) against the real server: the rate limit holds for
/// JSON bodies as well as forms, keyed by the normalised address; the client address comes
/// from the socket, so a spoofed X-Forwarded-For from an untrusted peer changes nothing;
/// signing out revokes the token, also a copy of it.
import http from "node:http";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { ACCOUNT_FAILURES, ADDRESS_FAILURES } from "@/lib/auth/rate-limit";
import { testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

afterAll(() => closeDb());

const PASSWORD = "bounded-hashing-8217";

async function newAccount(): Promise<string> {
  const email = uniqueEmail("guard");
  expect((await new TestClient(testAddress(90)).json("/api/auth/signup", { email, name: "Guard Tester", password: PASSWORD })).status).toBe(
    201,
  );
  return email;
}

describe("the sign-in rate limit covers every encoding", () => {
  it(`blocks JSON sign-ins after ${ACCOUNT_FAILURES} failures, keyed by the trimmed, lower-cased address`, async () => {
    const email = await newAccount();
    for (let i = 0; i < ACCOUNT_FAILURES; i++) {
      // A different spelling of the same address each time, from a different client address.
      const spelled = i % 2 === 0 ? `  ${email.toUpperCase()} ` : email;
      expect((await new TestClient(testAddress(91 + i)).signInJson(spelled, "wrong-guess-0")).status).toBe(401);
    }
    const blocked = await new TestClient(testAddress(99)).signInJson(email, PASSWORD);
    expect(blocked.status).toBe(429);
    expect(((await blocked.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    // and the form encoding is blocked for the same account
    expect((await new TestClient(testAddress(99)).signIn(email, PASSWORD)).status).toBe(429);
  });

  it(`blocks form sign-ins after ${ACCOUNT_FAILURES} failures, then JSON too`, async () => {
    const email = await newAccount();
    for (let i = 0; i < ACCOUNT_FAILURES; i++) {
      expect((await new TestClient(testAddress(100 + i)).signIn(` ${email.toUpperCase()}`, "wrong-guess-1")).status).toBe(401);
    }
    expect((await new TestClient(testAddress(106)).signIn(email, PASSWORD)).status).toBe(429);
    expect((await new TestClient(testAddress(106)).signInJson(email, PASSWORD)).status).toBe(429);
  });

  it("refuses a credentials body whose fields are not strings with 400, before any check", async () => {
    const client = new TestClient(testAddress(107));
    const csrf = (await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const r = await client.json("/api/auth/callback/credentials", {
      csrfToken: csrf.csrfToken,
      email: ["a@b.example"],
      password: PASSWORD,
      json: "true",
    });
    expect(r.status).toBe(400);
    const other = await client.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "text/plain" },
      body: "email=x",
    });
    expect(other.status).toBe(415);
  });
});

/// A minimal cookie-keeping client that connects from a chosen loopback address (test.sh
/// trusts only 127.0.0.1 as a proxy, so a client on 127.0.0.x for x > 1 is an ordinary,
/// untrusted peer whose X-Forwarded-For must be ignored).
class PeerClient {
  private readonly cookies = new Map<string, string>();
  constructor(readonly localAddress: string) {}

  request(
    path: string,
    opts: { method?: string; headers?: Record<string, string>; body?: string } = {},
  ): Promise<{ status: number; text: string }> {
    const base = new URL(testEnv("RINGSIDE_TEST_BASE_URL"));
    const headers: Record<string, string> = { Origin: base.origin, ...opts.headers };
    if (this.cookies.size > 0) headers.Cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    if (opts.body !== undefined) headers["Content-Length"] = String(Buffer.byteLength(opts.body));
    return new Promise((resolve, reject) => {
      const req = http.request(
        {
          host: base.hostname,
          port: base.port,
          path,
          method: opts.method ?? "GET",
          headers,
          localAddress: this.localAddress,
          agent: false,
        },
        (res) => {
          for (const line of res.headers["set-cookie"] ?? []) {
            const [pair] = line.split(";");
            const eq = pair!.indexOf("=");
            this.cookies.set(pair!.slice(0, eq).trim(), pair!.slice(eq + 1).trim());
          }
          const chunks: Buffer[] = [];
          res.on("data", (c: Buffer) => chunks.push(c));
          res.on("end", () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString("utf8") }));
        },
      );
      req.on("error", reject);
      if (opts.body !== undefined) req.write(opts.body);
      req.end();
    });
  }

  async signIn(email: string, password: string, spoofed: string): Promise<number> {
    const csrf = JSON.parse((await this.request("/api/auth/csrf", { headers: { "X-Forwarded-For": spoofed } })).text) as {
      csrfToken: string;
    };
    const body = new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: "true" }).toString();
    const r = await this.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded", "X-Forwarded-For": spoofed },
      body,
    });
    return r.status;
  }
}

describe("the client address", () => {
  it("comes from the socket: a spoofed X-Forwarded-For changes neither the count nor the audit log", async () => {
    const peer = new PeerClient("127.0.0.7");
    for (let i = 0; i < ADDRESS_FAILURES; i++) {
      // A fresh invented address and a fresh unknown account each time: only the socket's
      // address can tie these attempts together.
      expect(await peer.signIn(uniqueEmail("spoof"), "wrong-guess-2", `203.0.113.${i + 1}`)).toBe(401);
    }
    const email = await newAccount();
    expect(await peer.signIn(email, PASSWORD, "203.0.113.250")).toBe(429);
    const rows = await db()
      .select({ address: auditLog.address })
      .from(auditLog)
      .where(and(eq(auditLog.event, "signin_failure"), eq(auditLog.address, "127.0.0.7")));
    expect(rows.length).toBe(ADDRESS_FAILURES);
    const spoofed = await db().select({ id: auditLog.id }).from(auditLog).where(eq(auditLog.address, "203.0.113.1"));
    expect(spoofed).toEqual([]);
    // the account itself is not blocked for others
    expect((await new TestClient(testAddress(108)).signIn(email, PASSWORD)).status).toBe(200);
  });
});

describe("signing out", () => {
  it("revokes the token: a copy of the signed-out cookie is refused", async () => {
    const email = await newAccount();
    const client = new TestClient(testAddress(109));
    expect((await client.signIn(email, PASSWORD)).status).toBe(200);
    const stolen = client.copy(testAddress(110));
    expect((await stolen.request("/api/me")).status).toBe(200);

    await client.signOut();
    expect(client.hasSession()).toBe(false);
    expect(stolen.hasSession()).toBe(true);
    expect((await stolen.request("/api/me")).status).toBe(401);
    expect((await stolen.json("/api/sessions", { title: "after sign-out" })).status).toBe(401);

    // signing in again gives a working token
    expect((await client.signIn(email, PASSWORD)).status).toBe(200);
    expect((await client.request("/api/me")).status).toBe(200);
    expect((await stolen.request("/api/me")).status).toBe(401);
  });
});
