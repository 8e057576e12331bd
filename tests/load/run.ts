/// npm run load: 50 signed-in users at once against a running Ringside (npm start) on
/// loopback, driven by autocannon. Two phases of RINGSIDE_LOAD_SECONDS (default 20) each
/// with 50 connections: reads (the profile, the session list and a session's cells, in
/// turn) and cells (`1 + 1`, streamed to the end). Prints p50/p95/p99 latency, requests per
/// second and every failure by cause, and writes the same as JSON to tests/artifacts/load.json.
///
/// RINGSIDE_LOAD_URL (default http://127.0.0.1:3000). The 50 accounts
/// load-N@load.ringside.invalid are created on the first run (sign-up answers alike when
/// they exist) and reused afterwards.
import { mkdir, writeFile } from "node:fs/promises";
import path from "node:path";
import autocannon from "autocannon";

const BASE = (process.env.RINGSIDE_LOAD_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const ORIGIN = new URL(BASE).origin;
const USERS = Number(process.env.RINGSIDE_LOAD_USERS ?? 50);
const SECONDS = Number(process.env.RINGSIDE_LOAD_SECONDS ?? 20);
const PASSWORD = "load-tester-syzygy-8842";

interface User {
  email: string;
  cookie: string;
  sessionId: string;
}

function cookiesOf(response: Response, jar: Map<string, string>): void {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const eq = pair!.indexOf("=");
    jar.set(pair!.slice(0, eq).trim(), pair!.slice(eq + 1).trim());
  }
}

async function prepare(i: number): Promise<User> {
  const email = `load-${i}@load.ringside.invalid`;
  const jar = new Map<string, string>();
  const headers = () => ({ Origin: ORIGIN, Cookie: [...jar].map(([k, v]) => `${k}=${v}`).join("; ") });
  const signup = await fetch(`${BASE}/api/auth/signup`, {
    method: "POST",
    headers: { ...headers(), "Content-Type": "application/json" },
    body: JSON.stringify({ email, name: `Load tester ${i}`, password: PASSWORD }),
  });
  if (signup.status !== 201) throw new Error(`sign-up of ${email} answered ${signup.status}: ${await signup.text()}`);
  const csrfAnswer = await fetch(`${BASE}/api/auth/csrf`, { headers: headers() });
  cookiesOf(csrfAnswer, jar);
  const { csrfToken } = (await csrfAnswer.json()) as { csrfToken: string };
  const signIn = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { ...headers(), "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, email, password: PASSWORD, json: "true" }).toString(),
    redirect: "manual",
  });
  cookiesOf(signIn, jar);
  if (signIn.status !== 200 || ![...jar.keys()].some((k) => k.endsWith("session-token"))) {
    throw new Error(`sign-in of ${email} answered ${signIn.status}`);
  }
  const created = await fetch(`${BASE}/api/sessions`, {
    method: "POST",
    headers: { ...headers(), "Content-Type": "application/json" },
    body: JSON.stringify({ title: "load test" }),
  });
  if (created.status !== 201) throw new Error(`creating a session for ${email} answered ${created.status}`);
  const { id } = (await created.json()) as { id: string };
  return { email, cookie: headers().Cookie, sessionId: id };
}

/// Prepares the users a few at a time: sign-up and sign-in hash passwords with bcrypt,
/// which the server runs two at a time on purpose (lib/auth/hash-slots.ts).
async function prepareAll(): Promise<User[]> {
  const users: User[] = [];
  for (let i = 0; i < USERS; i += 5) {
    users.push(...(await Promise.all(Array.from({ length: Math.min(5, USERS - i) }, (_, k) => prepare(i + k + 1)))));
  }
  return users;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

interface PhaseReport {
  phase: string;
  requests: number;
  perSecond: number;
  latencyMs: { p50: number; p95: number; p99: number; max: number };
  failures: Record<string, number>;
}

async function phase(
  name: string,
  users: User[],
  make: (u: User, n: number) => { method: "GET" | "POST"; path: string; body?: string },
): Promise<PhaseReport> {
  let n = 0;
  const latencies: number[] = [];
  const failures: Record<string, number> = {};
  const fail = (why: string) => (failures[why] = (failures[why] ?? 0) + 1);
  // Without a callback autocannon returns its tracker (an EventEmitter) made thenable.
  const instance = autocannon({
    url: BASE,
    connections: users.length,
    duration: SECONDS,
    timeout: 60,
    requests: [
      {
        setupRequest: (req: autocannon.Request) => {
          const k = n++;
          const user = users[k % users.length]!;
          const r = make(user, Math.floor(k / users.length));
          return {
            ...req,
            method: r.method,
            path: r.path,
            body: r.body,
            headers: { Cookie: user.cookie, Origin: ORIGIN, ...(r.body ? { "Content-Type": "application/json" } : {}) },
          };
        },
        onResponse: (status: number, body: string) => {
          if (status >= 400) {
            // name the refusal: a documented limit says which (details.kind = "limit")
            let why = `HTTP ${status}`;
            try {
              const e = (JSON.parse(body) as { error?: { code?: string; details?: { kind?: string; limit?: string } } }).error;
              if (e?.details?.kind === "limit") why += ` (kind limit: ${e.details.limit})`;
              else if (e?.code) why += ` (${e.code})`;
            } catch {
              // not JSON: the status alone
            }
            fail(why);
          } else if (body.includes('"event":"error"')) {
            // a cell that ended with an Error: name its kind and message
            const line = body.split("\n").find((l) => l.includes('"event":"error"'));
            try {
              const e = (JSON.parse(line!) as { error: { kind: string; message: string } }).error;
              fail(`cell error ${e.kind}: ${e.message.slice(0, 80)}`);
            } catch {
              fail("cell error (unreadable)");
            }
          }
        },
      },
    ],
  }) as unknown as autocannon.Instance & Promise<autocannon.Result>;
  instance.on("response", (_client: unknown, _status: number, _bytes: number, ms: number) => latencies.push(ms));
  const result = await instance;
  if (result.errors > 0) failures["connection errors"] = result.errors;
  if (result.timeouts > 0) failures["timeouts"] = result.timeouts;
  latencies.sort((a, b) => a - b);
  const round = (x: number) => Math.round(x * 10) / 10;
  return {
    phase: name,
    requests: latencies.length,
    perSecond: round(latencies.length / SECONDS),
    latencyMs: {
      p50: round(percentile(latencies, 50)),
      p95: round(percentile(latencies, 95)),
      p99: round(percentile(latencies, 99)),
      max: round(latencies.at(-1) ?? NaN),
    },
    failures,
  };
}

async function main(): Promise<void> {
  console.error(`[load] preparing ${USERS} signed-in users against ${BASE}`);
  const users = await prepareAll();
  console.error(`[load] reads: ${USERS} connections for ${SECONDS} s`);
  const reads = await phase("reads (profile, session list, cells)", users, (u, round) => {
    const paths = ["/api/me", "/api/sessions", `/api/sessions/${u.sessionId}/cells`];
    return { method: "GET", path: paths[round % paths.length]! };
  });
  console.error(`[load] cells: ${USERS} connections for ${SECONDS} s`);
  const cells = await phase("cells (1 + 1, streamed to the end)", users, (u) => ({
    method: "POST",
    path: `/api/sessions/${u.sessionId}/cells`,
    body: JSON.stringify({ source: "1 + 1" }),
  }));
  const report = { base: BASE, users: USERS, secondsPerPhase: SECONDS, at: new Date().toISOString(), phases: [reads, cells] };
  const out = path.join(__dirname, "..", "artifacts", "load.json");
  await mkdir(path.dirname(out), { recursive: true });
  await writeFile(out, JSON.stringify(report, null, 2));
  console.log("| phase | requests | per second | p50 ms | p95 ms | p99 ms | failures |");
  console.log("|---|---|---|---|---|---|---|");
  for (const p of report.phases) {
    const f =
      Object.entries(p.failures)
        .map(([k, v]) => `${v} × ${k}`)
        .join("; ") || "none";
    console.log(`| ${p.phase} | ${p.requests} | ${p.perSecond} | ${p.latencyMs.p50} | ${p.latencyMs.p95} | ${p.latencyMs.p99} | ${f} |`);
  }
  console.error(`[load] written to ${path.relative(process.cwd(), out)}`);
}

main().catch((error: Error) => {
  console.error(`[load] failed: ${error.message}`);
  process.exit(1);
});
