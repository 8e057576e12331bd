/// Issue 13, compute half, against a real server and database of this file's own (so it may
/// kill -9 the server and the postmaster): heavy cells end with kind `limit` naming the
/// memory bound while another user's `1 + 1` answers within 2 s and the server's resident
/// memory stays bounded; a full engine refuses with 429/503 and Retry-After and stores
/// nothing; kill -9 of the server mid-cell leaves the cell `interrupted` with its partial
/// results; a cell its server lost is ended by a cancel; kill -9 of the postmaster mid-run
/// leaves no cell running.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { cells } from "@/db/schema";
import { allEvents, ndjsonEvents } from "../api/ndjson";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { OwnServer, residentMb } from "../helpers/own-server";

// Tight bounds so the heavy cells reach them in seconds. The resident-memory bound is far
// below the heap bound: only the watchdog (which sees typed arrays too) can be what stops them.
const MEMORY_MB = 220;
const ENV = {
  RINGSIDE_ENGINE_WORKERS: "3",
  RINGSIDE_USER_RUNNING: "2",
  RINGSIDE_USER_QUEUED: "2",
  RINGSIDE_ENGINE_QUEUE: "8",
  RINGSIDE_CELL_MEMORY_MB: String(MEMORY_MB),
  RINGSIDE_CELL_HEAP_MB: "1024",
  RINGSIDE_CELL_TIME_LIMIT_MS: "240000",
  RINGSIDE_HEARTBEAT_MS: "500",
  RINGSIDE_ORPHAN_AFTER_MS: "4000",
  RINGSIDE_LARGE_VALUE_BYTES: "20000",
};
/// The web server's resident memory must stay below this while the heavy cells run (it idles
/// around 200–300 MB; before slots were processes one such cell took it past 18 GB).
const SERVER_RSS_BOUND_MB = 700;

// The residue field of GF(32003)[x,y,z]/m^3: its Betti numbers grow exponentially (Golod:
// P(t) = (1+t)^3 / (1 − 10t^2 − 15t^3 − 6t^4); E. Golod, Soviet Math. 1962), so lengths 9
// and 10 (β_9 ≈ 140 000) outgrow any small memory bound (length 8 now fits in about 260 MB,
// so it is no longer a test of the bound). The Koszul complex of 500 variables has C(500, i) terms.
const residue = (length: number) => `S := GF(32003)[x, y, z]\nR := S / S.maximal^3\nresolve(R / R.maximal, length = ${length})`;
const KOSZUL_500 = "T := GF(32003)[x1..x500]\nresolve(T / T.maximal)";
/// Many short resolutions in a row: long-running but small in memory, so it is still running
/// (and within every bound) when the test kills something under it.
const LONG_AND_SMALL = "S := GF(32003)[x, y, z]\nR := S / S.maximal^3\n[resolve(R / R.maximal, length = 7).betti for k in 1..60]";

let own: OwnServer;
const heavy = new TestClient(testAddress(181), "http://unset");
const light = new TestClient(testAddress(182), "http://unset");

async function newSession(client: TestClient, title: string): Promise<string> {
  const r = await client.json("/api/sessions", { title });
  expect(r.status).toBe(201);
  return ((await r.json()) as { id: string }).id;
}

function post(client: TestClient, sessionId: string, source: string, init: RequestInit = {}) {
  return client.request(`/api/sessions/${sessionId}/cells`, {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify({ source }),
    ...init,
  });
}

async function until<T>(what: string, probe: () => Promise<T | undefined | null | false>, ms = 60_000): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    try {
      const v = await probe();
      if (v) return v;
    } catch {
      // the database may be restarting
    }
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/// Earlier tests' cells have ended (so the user's cap and queue are free again).
async function noCellRunning(): Promise<void> {
  await until(
    "every earlier cell to end",
    async () => (await db().select({ id: cells.id }).from(cells).where(eq(cells.status, "running"))).length === 0,
    120_000,
  );
}

async function cellRow(id: string) {
  const [row] = await db().select().from(cells).where(eq(cells.id, id));
  return row;
}

beforeAll(async () => {
  own = await OwnServer.start("compute", ENV);
  process.env.DATABASE_URL = own.databaseUrl;
  await ensureTestGroup();
  for (const [client, who] of [
    [heavy, TEST_ACCOUNTS.member],
    [light, TEST_ACCOUNTS.lead],
  ] as const) {
    (client as { base: string }).base = own.baseUrl;
    expect((await client.signIn(who.email, who.password)).status).toBe(200);
  }
}, 240_000);

afterAll(async () => {
  await closeDb();
  await own?.stop();
});

describe("no user can take the server down", () => {
  it("two residue-field resolutions and a 500-variable resolution end with kind limit naming the memory bound, while another user's 1 + 1 answers within 2 s", async () => {
    let maxRss = residentMb(own.serverPid);
    const sampler = setInterval(() => {
      try {
        maxRss = Math.max(maxRss, residentMb(own.serverPid));
      } catch {
        // sampled at exit
      }
    }, 100);
    try {
      const sources = [residue(9), residue(10), KOSZUL_500];
      const sessions = await Promise.all(sources.map((_, i) => newSession(heavy, `heavy ${i}`)));
      const accepted: string[] = [];
      const runs = sources.map(async (source, i) => {
        const events: Record<string, unknown>[] = [];
        for await (const e of ndjsonEvents(await post(heavy, sessions[i]!, source))) {
          if (e.event === "accepted") accepted.push(e.cellId as string);
          events.push(e);
        }
        return events;
      });
      // Once the heavy cells are in (two computing, one waiting: the user's cap is 2)…
      await until("the heavy cells to be accepted", async () => accepted.length === 3);
      await until("a heavy cell to be computing", async () => {
        const rows = await db()
          .select()
          .from(cells)
          .where(
            sql`${cells.id} IN (${sql.join(
              accepted.map((id) => sql`${id}::uuid`),
              sql`, `,
            )})`,
          );
        return rows.some((r) => r.status === "running");
      });
      // …another user's cell is served by the slot kept free, at once.
      const lightSession = await newSession(light, "light");
      const t0 = Date.now();
      const quick = await allEvents(await post(light, lightSession, "1 + 1"));
      const elapsed = Date.now() - t0;
      expect(quick.find((e) => e.event === "result")?.value).toMatchObject({ type: "Int", value: "2" });
      expect(elapsed).toBeLessThan(2000);
      // It finished while the heavy ones were still computing.
      const stillRunning = await db()
        .select()
        .from(cells)
        .where(
          sql`${cells.id} IN (${sql.join(
            accepted.map((id) => sql`${id}::uuid`),
            sql`, `,
          )}) AND ${cells.status} = 'running'`,
        );
      expect(stillRunning.length).toBeGreaterThan(0);

      const ends = await Promise.all(runs);
      for (const events of ends) {
        const error = events.find((e) => e.event === "error")?.error as { kind: string; message: string } | undefined;
        expect(error?.kind).toBe("limit");
        expect(error?.message).toMatch(new RegExp(`memory limit of ${MEMORY_MB} MB`));
        expect(events.at(-1)).toMatchObject({ event: "done", status: "error" });
      }
      // The work done is stored: the residue-field cells read "stopped after homological
      // degree N" with the Betti columns computed so far (Golod's series, see below: 1, 3, 13).
      for (const id of accepted) {
        const row = (await cellRow(id))!;
        expect(row.status).toBe("error");
        const result = row.result as {
          stopped?: string;
          statements: { value: { type: string; entries?: number[][]; complete?: boolean } }[];
        };
        expect(result.stopped).toMatch(/^stopped (after homological degree \d+|in statement \d+ of \d+): memory limit of/);
        if (row.source.includes("S.maximal^3") && /after homological degree/.test(result.stopped!)) {
          const partial = result.statements.at(-1)!.value;
          expect(partial).toMatchObject({ type: "BettiTable", complete: false });
          const total = (i: number) => partial.entries!.filter((e) => e[0] === i).reduce((s, e) => s + e[2]!, 0);
          expect([total(0), total(1)]).toEqual([1, 3]);
        }
      }
      const listed = (await (await heavy.request(`/api/sessions/${sessions[0]}/cells`)).json()) as { cells: { stopped: string | null }[] };
      expect(listed.cells[0]!.stopped).toMatch(/^stopped/);
    } finally {
      clearInterval(sampler);
    }
    console.log(`[robust-compute] web server resident memory peaked at ${Math.round(maxRss)} MB (bound ${SERVER_RSS_BOUND_MB} MB)`);
    expect(maxRss).toBeLessThan(SERVER_RSS_BOUND_MB);
    // The server is still serving.
    const again = await allEvents(await post(light, await newSession(light, "after"), "2 + 2"));
    expect(again.find((e) => e.event === "result")?.value).toMatchObject({ type: "Int", value: "4" });
  });

  it("refuses a cell beyond the user's queue with 429, Retry-After and kind limit, and stores nothing", async () => {
    await noCellRunning();
    const session = await newSession(heavy, "queue");
    const controllers = Array.from({ length: 4 }, () => new AbortController());
    // Two computing (the cap) and two waiting (the queue bound): a fifth is refused.
    const responses = [];
    for (const c of controllers) {
      const r = await post(heavy, session, residue(9), { signal: c.signal });
      expect(r.status).toBe(200);
      responses.push(r);
    }
    const before = await db().select().from(cells).where(eq(cells.sessionId, session));
    const refused = await post(heavy, session, "1 + 1");
    expect([429, 503]).toContain(refused.status);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = (await refused.json()) as { error: { code: string; message: string; details: { kind: string; limit: string } } };
    expect(body.error.details).toEqual({ kind: "limit", limit: "userQueued" });
    expect(body.error.message).toMatch(/userQueued = 2/);
    const after = await db().select().from(cells).where(eq(cells.sessionId, session));
    expect(after.length).toBe(before.length);
    expect(after.some((c) => c.source === "1 + 1")).toBe(false);
    // Another user is not refused.
    const other = await allEvents(await post(light, await newSession(light, "not refused"), "3 + 4"));
    expect(other.find((e) => e.event === "result")?.value).toMatchObject({ type: "Int", value: "7" });
    // Dropping the connections cancels them; every cell ends, none stays running.
    controllers.forEach((c) => c.abort());
    await until("the queued cells to end", async () => {
      const rows = await db().select().from(cells).where(eq(cells.sessionId, session));
      return rows.length === 4 && rows.every((r) => r.status !== "running");
    });
  });
});

describe("the web server never holds a whole large value", () => {
  it("stores a Complex above largeValueBytes as its Betti table with a detail marker, fetched on request and restored for later cells", async () => {
    await noCellRunning();
    const session = await newSession(heavy, "large value");
    // The Koszul complex on 8 variables: its differentials take about 80 KB as JSON, the ranks
    // are C(8, i) (common practice).
    const events = await allEvents(await post(heavy, session, "S := GF(32003)[a, b, c, d, e, f, g, h]\nC := resolve(S / S.maximal)"));
    expect(events.at(-1)).toMatchObject({ event: "done", status: "done" });
    const listed = (await (await heavy.request(`/api/sessions/${session}/cells`)).json()) as {
      cells: { results: { value: { type: string; ranks: number[]; maps: unknown; detail?: { id: string; bytes: number } } }[] }[];
    };
    const summary = listed.cells[0]!.results[1]!.value;
    expect(summary.type).toBe("Complex");
    expect(summary.ranks).toEqual([1, 8, 28, 56, 70, 56, 28, 8, 1]);
    expect(summary.maps).toBeNull();
    expect(summary.detail!.bytes).toBeGreaterThan(20000);
    const detail = await heavy.request(`/api/sessions/${session}/details/${summary.detail!.id}`);
    expect(detail.status).toBe(200);
    const whole = (await detail.json()) as { type: string; maps: unknown[] };
    expect(whole.type).toBe("Complex");
    expect(whole.maps).toHaveLength(8);
    // Only readers of the session, and only details the session holds.
    expect((await light.request(`/api/sessions/${session}/details/${summary.detail!.id}`)).status).toBe(404);
    const other = await newSession(heavy, "holds nothing");
    expect((await heavy.request(`/api/sessions/${other}/details/${summary.detail!.id}`)).status).toBe(404);
    // A later cell uses C whole: d1 ∘ d2 = 0, a 1 × 28 zero matrix.
    const later = await allEvents(await post(heavy, session, "C.map(1) * C.map(2)"));
    const product = later.find((e) => e.event === "result")?.value as { type: string; rows: string[][] };
    expect(product.type).toBe("Matrix");
    expect(product.rows).toEqual([Array(28).fill("0")]);
  });
});

describe("no cell stays running", () => {
  it("kill -9 of the server mid-cell: after the restart the cell is interrupted with its partial results", async () => {
    await noCellRunning();
    const session = await newSession(heavy, "killed server");
    const response = await post(heavy, session, residue(9));
    let cellId = "";
    const reader = ndjsonEvents(response);
    for await (const e of reader) {
      if (e.event === "accepted") cellId = e.cellId as string;
      if (e.event === "partial" && e.statement === 2) {
        const value = e.value as { entries: number[][] };
        if (value.entries.some((x) => x[0]! >= 2)) break;
      }
    }
    // The heartbeat has stored the Betti columns streamed so far.
    await until("the heartbeat to store partial results", async () => {
      const row = await cellRow(cellId);
      const degree = /^homological degree (\d+)/.exec((row?.result as { progress?: string } | null)?.progress ?? "");
      return row?.status === "running" && degree !== null && Number(degree[1]) >= 2;
    });
    const slots = execFileSync("bash", ["-c", `pgrep -P ${own.serverPid} || true`], { encoding: "utf8" })
      .split("\n")
      .filter(Boolean)
      .map(Number);
    expect(slots.length).toBeGreaterThan(0);
    await own.killServer();
    expect((await cellRow(cellId))!.status).toBe("running");
    // The server's engine slots do not outlive it.
    await until("the slot processes to exit", async () => slots.every((pid) => !processAlive(pid)), 10_000);

    await own.startServer();
    const row = await until(
      "the cell to be marked",
      async () => {
        const r = await cellRow(cellId);
        return r?.status !== "running" ? r : undefined;
      },
      10_000,
    );
    expect(row!.status).toBe("interrupted");
    const result = row!.result as { stopped: string; statements: { value: { type: string; complete?: boolean; entries?: number[][] } }[] };
    expect(result.stopped).toMatch(/^stopped after homological degree \d+: the server running this cell stopped/);
    // The finished statements (the rings) and the partial Betti table are kept.
    expect(result.statements.map((s) => s.value.type)).toEqual(["Ring", "Ring", "BettiTable"]);
    expect(result.statements[2]!.value.complete).toBe(false);
    // The columns kept are the true ones: Golod's series (1+t)^3 / (1 − 10t^2 − 15t^3 − 6t^4)
    // = 1 + 3t + 13t^2 + 46t^3 + … (E. Golod, Soviet Math. 1962; β^S(S/m^3) = 1, 10, 15, 6 from
    // J. Eagon, D. Northcott, Proc. Roy. Soc. A 1962; expanded with SymPy).
    const entries = result.statements[2]!.value.entries!;
    const total = (i: number) => entries.filter((e) => e[0] === i).reduce((s, e) => s + e[2]!, 0);
    expect([total(0), total(1), total(2)]).toEqual([1, 3, 13]);
    const listed = (await (await heavy.request(`/api/sessions/${session}/cells`)).json()) as {
      cells: { status: string; stopped: string }[];
    };
    expect(listed.cells[0]).toMatchObject({ status: "interrupted" });
    expect(listed.cells[0]!.stopped).toMatch(/^stopped after homological degree/);
  });

  it("a running cell its server no longer runs is ended by a cancel", async () => {
    const session = await newSession(heavy, "orphan");
    const done = await allEvents(await post(heavy, session, "1 + 1"));
    const cellId = done.find((e) => e.event === "accepted")!.cellId as string;
    const serverId = (await cellRow(cellId))!.serverId!;
    expect(serverId).toMatch(/\/\d+\//);
    // A cell this very server lost (as after a save that kept failing): fresh heartbeat, not tracked.
    const [orphan] = await db()
      .insert(cells)
      .values({
        sessionId: session,
        position: 1,
        source: "2 + 2",
        status: "running",
        startedAt: new Date(),
        serverId,
        heartbeatAt: new Date(),
      })
      .returning();
    const cancel = await heavy.request(`/api/sessions/${session}/cells/${orphan!.id}/cancel`, { method: "POST" });
    expect(cancel.status).toBe(200);
    const row = (await cellRow(orphan!.id))!;
    expect(row.status).toBe("cancelled");
    expect((row.result as { stopped: string }).stopped).toMatch(/cancelled after the server running it had stopped/);
  });

  it("kill -9 of the postmaster mid-run: once PostgreSQL is back, no cell stays running", async () => {
    await noCellRunning();
    const session = await newSession(heavy, "killed database");
    const response = await post(heavy, session, LONG_AND_SMALL);
    const events: Record<string, unknown>[] = [];
    let cellId = "";
    const reading = (async () => {
      for await (const e of ndjsonEvents(response)) {
        events.push(e);
        if (e.event === "accepted") cellId = e.cellId as string;
      }
    })();
    await until("the cell to compute", async () => events.some((e) => e.event === "progress"));
    await until("the running cell to be stored", async () => (cellId ? await cellRow(cellId) : undefined));
    own.killPostmaster();
    await new Promise((r) => setTimeout(r, 1500));
    await own.restartPostgres();
    await reading;
    expect(events.at(-1)).toMatchObject({ event: "done" });
    const running = await until(
      "no cell to be running",
      async () => {
        const rows = await db().select({ id: cells.id }).from(cells).where(eq(cells.status, "running"));
        return rows.length === 0 ? rows : undefined;
      },
      60_000,
    );
    expect(running).toEqual([]);
    const row = (await cellRow(cellId))!;
    // Whichever way it ended — its save retried once PostgreSQL was back ("done"), marked
    // after the retries ran out ("error"), or swept as orphaned ("interrupted") — it ended.
    expect(["done", "error", "interrupted"]).toContain(row.status);
    // The server is still serving.
    const again = await allEvents(await post(light, await newSession(light, "after the database restart"), "5 + 5"));
    expect(again.find((e) => e.event === "result")?.value).toMatchObject({ type: "Int", value: "10" });
  });
});

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
