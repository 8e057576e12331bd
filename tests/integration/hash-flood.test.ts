/// Password hashing with bounded concurrency (issue 13, item 5), against a server of this
/// file's own with the production bcrypt cost and a small hash queue (so a flood fills it in
/// a moment, and the shared test server's other suites are never refused): many wrong-password
/// sign-ins from many client addresses, JSON and form alike, get 503 with Retry-After and kind
/// `limit` naming `hashQueue` once the queue is full (or 429 from the rate limit), never a
/// 500 and never a sign-in; while the flood runs, another user's API call and `1 + 1` cell
/// still answer; when it ends, signing in works again.
import { and, count, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { allEvents } from "../api/ndjson";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { OwnServer } from "../helpers/own-server";

const HASH_QUEUE = 4;
const ENV = {
  // bcrypt's production cost: one check takes a good fraction of a second, as in production
  RINGSIDE_BCRYPT_COST: "12",
  RINGSIDE_HASH_CONCURRENCY: "1",
  RINGSIDE_HASH_QUEUE: String(HASH_QUEUE),
  RINGSIDE_ENGINE_WORKERS: "2",
};
/// Attackers, each keeping one sign-in in flight at all times: far more than one running
/// hash and HASH_QUEUE waiting.
const ATTACKERS = 24;
/// A generous bound for each of the other user's requests (the evidence says 2 s; the
/// machine is shared, so this only catches starvation, not slowness).
const ANSWER_BOUND_MS = 15_000;

let own: OwnServer;
const other = new TestClient(testAddress(220), "http://unset");

interface Answer {
  status: number;
  at: number;
  encoding: "json" | "form";
  retryAfter: string | null;
  error?: { code?: string; message?: string; details?: unknown };
  /// next-auth's `url` (a failed sign-in points at the sign-in page with its error code)
  url?: string;
}

let attempts = 0;
/// One wrong-password sign-in for an account that does not exist (the decoy hash costs as
/// much as a real one) from an address of its own (2001:db8::/32, RFC 3849), so neither
/// rate-limit bucket fills before the hash queue does.
async function attack(): Promise<Answer> {
  const k = ++attempts;
  const client = new TestClient(`2001:db8::${k.toString(16)}`, own.baseUrl);
  const email = `flood-${process.pid}-${k}@example.test`;
  const encoding = k % 2 === 0 ? "json" : "form";
  const r = encoding === "json" ? await client.signInJson(email, `wrong-guess-${k}`) : await client.signIn(email, `wrong-guess-${k}`);
  const body = (await r.json().catch(() => null)) as { error?: Answer["error"]; url?: string } | null;
  return { status: r.status, at: Date.now(), encoding, retryAfter: r.headers.get("retry-after"), error: body?.error, url: body?.url };
}

function within<T>(what: string, promise: Promise<T>): Promise<T> {
  return Promise.race([
    promise,
    new Promise<T>((_, reject) =>
      setTimeout(() => reject(new Error(`${what} did not answer within ${ANSWER_BOUND_MS} ms`)), ANSWER_BOUND_MS),
    ),
  ]);
}

async function until(what: string, probe: () => boolean | Promise<boolean>, ms = 90_000): Promise<void> {
  const deadline = Date.now() + ms;
  while (!(await probe())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  own = await OwnServer.start("hash-flood", ENV);
  process.env.DATABASE_URL = own.databaseUrl;
  await ensureTestGroup();
  (other as { base: string }).base = own.baseUrl;
  expect((await other.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
}, 240_000);

afterAll(async () => {
  await closeDb();
  await own?.stop();
});

describe("a flood of wrong passwords", () => {
  it("is refused with 503 and Retry-After once the hash queue is full, while another user's requests still answer", async () => {
    const answers: Answer[] = [];
    const failures: unknown[] = [];
    let flooding = true;
    const attackers = Array.from({ length: ATTACKERS }, async () => {
      while (flooding) {
        try {
          answers.push(await attack());
        } catch (error) {
          failures.push(error);
          return;
        }
      }
    });
    try {
      // (a) the queue fills: refusals arrive, in both encodings
      await until("the first 503 of each encoding", () =>
        (["json", "form"] as const).every((enc) => answers.some((a) => a.status === 503 && a.encoding === enc)),
      );

      // (b) meanwhile another, signed-in user works: an API read, a new session, a cell
      const probeStart = Date.now();
      const list = await within("GET /api/sessions", other.request("/api/sessions"));
      expect(list.status).toBe(200);
      const created = await within("POST /api/sessions", other.json("/api/sessions", { title: "during the flood" }));
      expect(created.status).toBe(201);
      const { id } = (await created.json()) as { id: string };
      const events = await within(
        "the 1 + 1 cell",
        other
          .request(`/api/sessions/${id}/cells`, {
            method: "POST",
            headers: { "Content-Type": "application/json" },
            body: JSON.stringify({ source: "1 + 1" }),
          })
          .then(allEvents),
      );
      expect(events.find((e) => e.event === "result")?.value).toMatchObject({ type: "Int", value: "2" });
      const probeEnd = Date.now();

      // The flood was still being refused after the other user's requests were answered:
      // they were served while the queue was full, not after it drained.
      await until("a 503 after the other user's requests", () => answers.some((a) => a.status === 503 && a.at > probeEnd));
      expect(answers.some((a) => a.status === 503 && a.at < probeStart)).toBe(true);
    } finally {
      flooding = false;
      await Promise.all(attackers);
    }

    expect(failures).toEqual([]);
    const statuses = new Set(answers.map((a) => a.status));
    // 401: checked and wrong; 503: the hash queue was full; 429: the rate limit. Nothing else —
    // no 500, and no flood attempt ever signed in.
    for (const s of statuses) expect([401, 429, 503]).toContain(s);
    const checked = answers.filter((a) => a.status === 401);
    expect(checked.length).toBeGreaterThan(0);
    // Every 401 is a password that was checked and found wrong — not a check the full queue
    // refused after the route let the request in (next-auth would report that as a failed
    // sign-in with another error code; the route must answer it 503 instead): next-auth says
    // CredentialsSignin, and the audit log holds exactly one failure per 401.
    for (const a of checked) expect(new URL(a.url ?? "", own.baseUrl).searchParams.get("error")).toBe("CredentialsSignin");
    const [logged] = await db()
      .select({ n: count() })
      .from(auditLog)
      .where(and(eq(auditLog.event, "signin_failure"), like(auditLog.email, `flood-${process.pid}-%`)));
    expect(logged?.n).toBe(checked.length);
    for (const a of answers.filter((x) => x.status === 503)) {
      expect(Number(a.retryAfter)).toBeGreaterThan(0);
      expect(a.error?.code).toBe("busy");
      expect(a.error?.details).toEqual({ kind: "limit", limit: "hashQueue", value: HASH_QUEUE });
      expect(a.error?.message).toContain(`limit hashQueue = ${HASH_QUEUE}`);
    }
    for (const a of answers.filter((x) => x.status === 429)) expect(Number(a.retryAfter)).toBeGreaterThan(0);

    // Once the flood is over the queue drains and a real sign-in succeeds again.
    const again = new TestClient(testAddress(221), own.baseUrl);
    let status = 0;
    await until("a sign-in to succeed after the flood", async () => {
      status = (await again.signIn(TEST_ACCOUNTS.lead.email, TEST_ACCOUNTS.lead.password)).status;
      return status !== 503;
    });
    expect(status).toBe(200);
  }, 300_000);
});
