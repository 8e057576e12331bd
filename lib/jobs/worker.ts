/// `npm run worker -- [--concurrency N]`: a process that runs experiment members from the
/// queue in PostgreSQL (DATABASE_URL); start any number, on any machine that reaches the
/// database. Concurrency defaults to the number of cores − 1 (at least 1). Ctrl-C or SIGTERM
/// stops it: a member it was running goes back to the queue.
import os from "node:os";
import { closeDb } from "@/db/client";
import { startMemberWorker } from "./member-worker";

const USAGE = "usage: npm run worker -- [--concurrency N] [--label NAME]";

function parse(argv: string[]): { concurrency: number; label: string } | string {
  let concurrency = Math.max(1, os.availableParallelism() - 1);
  let label = "worker";
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const value = a.includes("=") ? a.slice(a.indexOf("=") + 1) : argv[++i];
    if (a.startsWith("--concurrency")) {
      const n = Number(value);
      if (!Number.isInteger(n) || n < 1 || n > 256) return `--concurrency needs a whole number from 1 to 256, got ${value}`;
      concurrency = n;
    } else if (a.startsWith("--label")) {
      if (!value || !/^[\w.-]{1,40}$/.test(value)) return `--label needs a short name (letters, digits, . _ -), got ${value}`;
      label = value;
    } else return `unknown argument ${a}`;
  }
  return { concurrency, label };
}

async function main() {
  const args = parse(process.argv.slice(2));
  if (typeof args === "string") {
    console.error(`worker: ${args}\n${USAGE}`);
    process.exit(2);
  }
  if (!process.env.DATABASE_URL) {
    console.error("worker: DATABASE_URL is not set (the PostgreSQL database the server uses)");
    process.exit(2);
  }
  const worker = await startMemberWorker({ ...args, log: (line) => console.log(`[worker] ${line}`) });
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] stopping after ${worker.finished()} member(s)`);
    await worker.stop();
    await closeDb();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((error) => {
  console.error("[worker] failed:", error instanceof Error ? error.message : error);
  process.exit(1);
});
