/// The web server's own worker (`npm start` needs nothing else): one member at a time by
/// default (RINGSIDE_EMBEDDED_WORKER=0 turns it off, RINGSIDE_EMBEDDED_CONCURRENCY sets it).
/// Started from instrumentation.ts when the Node.js server starts; retried while the database
/// is not reachable yet.
import { startMemberWorker } from "./member-worker";

const holder = globalThis as typeof globalThis & { __ringsideEmbeddedWorker?: boolean };

export function startEmbeddedWorker(): void {
  if (holder.__ringsideEmbeddedWorker || process.env.RINGSIDE_EMBEDDED_WORKER === "0" || !process.env.DATABASE_URL) return;
  holder.__ringsideEmbeddedWorker = true;
  const n = Number(process.env.RINGSIDE_EMBEDDED_CONCURRENCY ?? 1);
  const concurrency = Number.isInteger(n) && n >= 1 && n <= 64 ? n : 1;
  const attempt = (delayMs: number) => {
    startMemberWorker({ concurrency, label: "server", log: (line) => console.log(`[ringside] ${line}`) }).catch((error) => {
      console.error("[ringside] embedded worker could not start:", error instanceof Error ? error.message : error);
      setTimeout(() => attempt(Math.min(60_000, delayMs * 2)), delayMs).unref();
    });
  };
  attempt(2000);
}
