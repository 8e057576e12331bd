/// Processes for the experiment suites: `npm run worker` processes and extra production
/// servers (with their embedded worker) that a test may kill -9 and restart.
import { spawn, type ChildProcess } from "node:child_process";
import net from "node:net";
import path from "node:path";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { experimentRows, experiments } from "@/db/schema";
import { webServerArgs } from "../helpers/own-server";

const ROOT = path.resolve(__dirname, "../..");

/// Shorter waits than production so the suites finish: a dead worker's job is found within
/// seconds (queue maintenance), and members get a short time limit.
export const PROCESS_ENV = {
  RINGSIDE_QUEUE_MAINTENANCE_SECONDS: "2",
  RINGSIDE_MEMBER_TIME_LIMIT_MS: "4000",
};

export interface Proc {
  readonly child: ChildProcess;
  readonly output: () => string;
}

function start(command: string, args: string[], env: Record<string, string>): Proc {
  let out = "";
  const child = spawn(command, args, { cwd: ROOT, env: { ...process.env, ...PROCESS_ENV, ...env }, stdio: ["ignore", "pipe", "pipe"] });
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  return { child, output: () => out };
}

export function startWorker(label: string, concurrency = 1): Proc {
  return start("node", ["--import", "tsx", "lib/jobs/worker.ts", "--concurrency", String(concurrency), "--label", label], {});
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on("error", reject);
  });
}

/// A second production server (the build npm test made, served by lib/ops/web-server.ts as
/// in production) with its embedded worker.
export async function startServer(port: number): Promise<Proc> {
  const p = start("node", webServerArgs(port), {
    RINGSIDE_EMBEDDED_WORKER: "1",
    RINGSIDE_EMBEDDED_CONCURRENCY: "1",
  });
  await waitFor(
    async () => {
      try {
        return (await fetch(`http://127.0.0.1:${port}/sign-in`)).status < 500;
      } catch {
        return false;
      }
    },
    90_000,
    () => `server on ${port} did not start:\n${p.output()}`,
  );
  return p;
}

export async function stopGently(p: Proc): Promise<void> {
  if (p.child.exitCode !== null || p.child.signalCode !== null) return;
  const exited = new Promise((r) => p.child.once("exit", r));
  p.child.kill("SIGTERM");
  await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
  if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill("SIGKILL");
}

export async function killHard(p: Proc): Promise<void> {
  const exited = new Promise((r) => p.child.once("exit", r));
  p.child.kill("SIGKILL");
  await exited;
}

export async function waitFor(cond: () => Promise<boolean>, timeoutMs: number, why: () => string): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await cond())) {
    if (Date.now() > until) throw new Error(`timed out: ${why()}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export async function rowCount(experimentId: string): Promise<number> {
  const [{ n }] = await db()
    .select({ n: sql<number>`count(*)::int` })
    .from(experimentRows)
    .where(eq(experimentRows.experimentId, experimentId));
  return n;
}

export async function statusOf(experimentId: string): Promise<string> {
  const [e] = await db().select({ s: experiments.status }).from(experiments).where(eq(experiments.id, experimentId));
  return e.s;
}

export async function rowsOf(experimentId: string) {
  return db()
    .select()
    .from(experimentRows)
    .where(and(eq(experimentRows.experimentId, experimentId)))
    .orderBy(experimentRows.memberIndex);
}
