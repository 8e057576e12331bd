/// Experiments as durable jobs, with the real database and real processes: two
/// `npm run worker` processes and a production server (its embedded worker) share one
/// 200-member sweep; kill -9 of a worker and of the server lose no row and double none;
/// time-limit and error members; "run again" gives the same rows.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { closeExperimentPool } from "@/lib/experiments/compute-adapter";
import { stopBoss } from "@/lib/experiments/queue";
import { act, createFromProgram, runAgain } from "@/lib/experiments/service";
import { getExperiment, progressOf } from "@/lib/experiments/store";
import { katsuraIdealText, OUTLASTING_KATSURA } from "../bench/families";
import { testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/fixtures";
import {
  freePort,
  killHard,
  PROCESS_ENV,
  rowCount,
  rowsOf,
  startServer,
  startWorker,
  statusOf,
  stopGently,
  waitFor,
  type Proc,
} from "./helpers";

// experiments created here carry the short member limit the spawned processes also use
process.env.RINGSIDE_MEMBER_TIME_LIMIT_MS = PROCESS_ENV.RINGSIDE_MEMBER_TIME_LIMIT_MS;

let sessionId = "";
let userId = "";
const procs: Proc[] = [];

beforeAll(async () => {
  testEnv("DATABASE_URL");
  const [u] = await db()
    .insert(users)
    .values({ email: uniqueEmail("durable"), displayName: "Durable Tester", passwordHash: "x" })
    .returning();
  const [s] = await db().insert(sessions).values({ title: "durable experiments", ownerId: u.id }).returning();
  userId = u.id;
  sessionId = s.id;
});

afterAll(async () => {
  for (const p of procs) await stopGently(p);
  await stopBoss();
  await closeExperimentPool();
  await closeDb();
});

const fields = (r: { fields: unknown }) => r.fields as Record<string, { text: string }>;

describe("a 200-member sweep shared by two workers and a server", () => {
  let server: Proc;
  let port = 0;
  let w2: Proc;

  it("every member exactly once, also after kill -9 of one worker mid-run", async () => {
    port = await freePort();
    server = await startServer(port);
    procs.push(server);
    // three dense quadrics in four variables: a complete intersection for these seeds, so the
    // Koszul complex resolves S/I and the Betti numbers are C(3, i) = 1, 3, 3, 1
    // (Eisenbud, Commutative Algebra, Cor. 17.5); each row is checked against that.
    const e = await createFromProgram({
      sessionId,
      userId,
      source:
        "S := GF(32003)[x, y, z, w]\nF := random_ideals(S, count = 200, gens = 3, degree = 2, seed = 21)\nsweep(F, I -> {b: resolve(S / I).betti.totals, ci: (S / I).is_ci})",
    });
    expect(e.total).toBe(200);
    const w1 = startWorker("w1");
    w2 = startWorker("w2");
    procs.push(w1, w2);
    await waitFor(
      async () => (await rowsOf(e.id)).some((r) => r.worker.endsWith(":w1")) && (await rowCount(e.id)) >= 40,
      120_000,
      () => `w1 never wrote a row:\n${w1.output()}`,
    );
    // progress is readable mid-run: done/total, failures, a rate and an ETA
    const mid = await progressOf((await getExperiment(e.id))!);
    expect(mid.total).toBe(200);
    expect(mid.done).toBeGreaterThanOrEqual(40);
    expect(mid.done).toBeLessThan(200);
    expect(mid.failures).toBe(0);
    expect(mid.rate).toBeGreaterThan(0);
    expect(mid.etaSeconds).not.toBeNull();
    await killHard(w1);
    const atKill = await rowCount(e.id);
    expect(atKill).toBeLessThan(200);
    await waitFor(
      async () => (await statusOf(e.id)) === "done",
      180_000,
      () => `not done, ${atKill} rows at the kill`,
    );
    const rows = await rowsOf(e.id);
    expect(rows).toHaveLength(200);
    expect(new Set(rows.map((r) => r.memberIndex)).size).toBe(200);
    expect(rows.map((r) => r.memberIndex)).toEqual(Array.from({ length: 200 }, (_, i) => i));
    const workers = new Set(rows.map((r) => r.worker.split(":").pop()));
    expect(workers).toContain("w1");
    expect(workers).toContain("w2");
    expect(workers).toContain("server");
    for (const r of rows) {
      expect(r.status).toBe("ok");
      expect(fields(r).b.text).toBe("[1, 3, 3, 1]");
      expect(fields(r).ci.text).toBe("true");
    }
  }, 400_000);

  it("a member past the time limit and a member that errors give those statuses; the sweep completes", async () => {
    // katsura-13 over GF(32003) takes our engine minutes, far past the 4 s member limit
    // (OUTLASTING_KATSURA); Katsura's family: common practice. 1/0 is a division by zero.
    const N = OUTLASTING_KATSURA;
    const katsura = katsuraIdealText(N);
    const e = await createFromProgram({
      sessionId,
      userId,
      source: `K := GF(32003)[u0..u${N}]\nG := ${katsura}\nsweep(family([<u0>, <u0, u1>, <u0, u1, u2>]), I -> {n: if I.gens.length == 2 then G.groebner.length else 6 / (I.gens.length - 1)})`,
    });
    await waitFor(
      async () => (await statusOf(e.id)) === "done",
      120_000,
      () => "the sweep with a slow member did not finish",
    );
    const rows = await rowsOf(e.id);
    expect(rows.map((r) => r.status)).toEqual(["error", "limit", "ok"]);
    expect(rows[0].message).toMatch(/division by zero/);
    expect(rows[1].message).toMatch(/limit/);
    expect(fields(rows[2]).n.text).toBe("3");
  }, 200_000);

  it("run again reproduces every row (timings aside)", async () => {
    const source =
      "S := Q[a, b, c]\nsweep(monomial_ideals(S, degree = 2, max_gens = 2, up_to_symmetry = true), I -> {betti: resolve(S / I).betti.totals, e: I.degree})";
    const first = await createFromProgram({ sessionId, userId, source });
    await waitFor(
      async () => (await statusOf(first.id)) === "done",
      60_000,
      () => "first run not done",
    );
    const again = await runAgain((await getExperiment(first.id))!, userId);
    expect(again.rerunOf).toBe(first.id);
    expect(again.familyDefinition).toBe(first.familyDefinition);
    await waitFor(
      async () => (await statusOf(again.id)) === "done",
      60_000,
      () => "second run not done",
    );
    const strip = (rs: Awaited<ReturnType<typeof rowsOf>>) => rs.map((r) => ({ i: r.memberIndex, s: r.status, f: r.fields }));
    expect(strip(await rowsOf(again.id))).toEqual(strip(await rowsOf(first.id)));
    expect(await rowCount(first.id)).toBe(6);
  }, 150_000);

  it("pause keeps finished rows and stops new ones; resume finishes; cancel marks the rest", async () => {
    const e = await createFromProgram({
      sessionId,
      userId,
      source:
        "S := GF(32003)[x, y, z, w]\nsweep(random_ideals(S, count = 60, gens = 3, degree = 2, seed = 5), I -> {b: resolve(S / I).betti.totals})",
    });
    await waitFor(
      async () => (await rowCount(e.id)) >= 3,
      60_000,
      () => "no rows",
    );
    await act(e.id, "pause");
    await new Promise((r) => setTimeout(r, 2000)); // members already running may finish
    const paused = await rowCount(e.id);
    await new Promise((r) => setTimeout(r, 3000));
    expect(await rowCount(e.id)).toBe(paused);
    expect(await statusOf(e.id)).toBe("paused");
    await act(e.id, "resume");
    await waitFor(
      async () => (await statusOf(e.id)) === "done",
      120_000,
      () => "not done after resume",
    );
    expect(await rowCount(e.id)).toBe(60);

    const c = await createFromProgram({
      sessionId,
      userId,
      source:
        "S := GF(32003)[x, y, z, w]\nsweep(random_ideals(S, count = 80, gens = 3, degree = 2, seed = 6), I -> {b: resolve(S / I).betti.totals})",
    });
    await waitFor(
      async () => (await rowCount(c.id)) >= 2,
      60_000,
      () => "no rows",
    );
    await act(c.id, "cancel");
    await new Promise((r) => setTimeout(r, 3000));
    const rows = await rowsOf(c.id);
    expect(rows).toHaveLength(80);
    expect(rows.filter((r) => r.status === "cancelled").length).toBeGreaterThan(0);
    expect(await statusOf(c.id)).toBe("cancelled");
  }, 300_000);

  it("kill -9 of the server mid-sweep, restart: it resumes and earlier rows are unchanged", async () => {
    await stopGently(w2); // the server alone works now
    const e = await createFromProgram({
      sessionId,
      userId,
      source:
        "S := GF(32003)[x, y, z, w]\nsweep(random_ideals(S, count = 100, gens = 3, degree = 2, seed = 77), I -> {b: resolve(S / I).betti.totals})",
    });
    await waitFor(
      async () => (await rowCount(e.id)) >= 10,
      120_000,
      () => `the server wrote no rows:\n${server.output()}`,
    );
    await killHard(server);
    const before = await rowsOf(e.id);
    expect(before.length).toBeLessThan(100);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await rowCount(e.id)).toBe(before.length); // nobody is working on it
    server = await startServer(port);
    procs.push(server);
    await waitFor(
      async () => (await statusOf(e.id)) === "done",
      180_000,
      () => `not resumed:\n${server.output()}`,
    );
    const after = await rowsOf(e.id);
    expect(after).toHaveLength(100);
    const byIndex = new Map(after.map((r) => [r.memberIndex, r]));
    for (const r of before) expect(byIndex.get(r.memberIndex)).toEqual(r);
  }, 400_000);
});
