// Sweep throughput: 1000 small members (the dimension of a random linear ideal) run as an
// experiment by 1 and then 2 `npm run worker` processes (concurrency 1 each); members per
// second from the experiment's creation to its last row. Needs DATABASE_URL (a database with
// the migrations applied); prints why it skipped otherwise.
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { experimentRows, experiments, sessions, users } from "@/db/schema";
import { closeExperimentPool } from "@/lib/experiments/compute-adapter";
import { stopBoss } from "@/lib/experiments/queue";
import { createFromProgram } from "@/lib/experiments/service";

const ROOT = path.resolve(__dirname, "../..");
const MEMBERS = 1000;

function worker(label: string): Promise<ChildProcess> {
  return new Promise((resolve, reject) => {
    const child = spawn("node", ["--import", "tsx", "lib/jobs/worker.ts", "--concurrency", "1", "--label", label], {
      cwd: ROOT,
      stdio: ["ignore", "pipe", "inherit"],
    });
    child.stdout!.on("data", (d: Buffer) => {
      if (d.toString().includes("takes members")) resolve(child);
    });
    child.on("exit", (code) => reject(new Error(`worker ${label} exited (${code})`)));
  });
}

async function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  child.removeAllListeners("exit");
  const exited = new Promise((r) => child.once("exit", r));
  child.kill("SIGTERM");
  await exited;
}

export async function sweepThroughput(): Promise<string[]> {
  if (!process.env.DATABASE_URL)
    return ["sweep throughput: skipped (set DATABASE_URL to a migrated database, e.g. the one npm start uses)"];
  const [u] = await db()
    .insert(users)
    .values({ email: `bench-${Date.now()}@bench.invalid`, displayName: "Bench", passwordHash: "x" })
    .returning();
  const [s] = await db().insert(sessions).values({ title: "sweep throughput", ownerId: u.id }).returning();
  const lines: string[] = [];
  try {
    for (const n of [1, 2]) {
      const procs = await Promise.all(Array.from({ length: n }, (_, i) => worker(`bench${i + 1}`)));
      const t0 = performance.now();
      const e = await createFromProgram({
        sessionId: s.id,
        userId: u.id,
        source: `S := GF(32003)[x, y, z]\nsweep(random_ideals(S, count = ${MEMBERS}, gens = 2, degree = 1, seed = ${n}), I -> {d: I.dim})`,
      });
      for (;;) {
        const [row] = await db().select({ status: experiments.status }).from(experiments).where(eq(experiments.id, e.id));
        if (row.status === "done") break;
        await new Promise((r) => setTimeout(r, 200));
      }
      const seconds = (performance.now() - t0) / 1000;
      const [{ n: rows }] = await db()
        .select({ n: sql<number>`count(*)::int` })
        .from(experimentRows)
        .where(eq(experimentRows.experimentId, e.id));
      lines.push(`| ${n} worker${n > 1 ? "s" : ""} | ${MEMBERS} | ${rows} | ${seconds.toFixed(1)} | ${(MEMBERS / seconds).toFixed(1)} |`);
      for (const p of procs) await stop(p);
    }
  } finally {
    await db().delete(sessions).where(eq(sessions.id, s.id));
    await db().delete(users).where(eq(users.id, u.id));
    await stopBoss();
    await closeExperimentPool();
    await closeDb();
  }
  return ["| workers | members | rows | seconds | members/s |", "|---|---|---|---|---|", ...lines];
}
