/// The experiments' queue on pg-boss (PostgreSQL): one job per member, data
/// {experimentId, index}. Delivery is at least once; exactly-once rows come from the
/// experiment_rows primary key (store.ts), so a job may safely be sent twice.
import PgBoss from "pg-boss";
import { databaseUrl } from "@/db/client";

export const MEMBER_QUEUE = "experiment-member";

export interface MemberJobData {
  experimentId: string;
  index: number;
}

function secondsFromEnv(name: string, fallback: number): number {
  const v = Number(process.env[name]);
  return Number.isFinite(v) && v > 0 ? v : fallback;
}

const holder = globalThis as typeof globalThis & { __ringsideBoss?: Promise<PgBoss> };

/// The process's pg-boss instance, started (and its schema `pgboss` created) on first use.
/// RINGSIDE_QUEUE_MAINTENANCE_SECONDS (default 30): how often jobs of a worker that died are
/// found (an active job past its expiry goes back to the queue).
export function boss(): Promise<PgBoss> {
  if (!holder.__ringsideBoss) {
    holder.__ringsideBoss = (async () => {
      const b = new PgBoss({
        connectionString: databaseUrl(),
        schema: "pgboss",
        max: 4,
        application_name: "ringside-experiments",
        maintenanceIntervalSeconds: secondsFromEnv("RINGSIDE_QUEUE_MAINTENANCE_SECONDS", 30),
        monitorStateIntervalSeconds: 60,
      });
      b.on("error", (error) => console.error("[ringside] queue:", error instanceof Error ? error.message : error));
      await b.start();
      // policy short: at most one waiting job per (experiment, member) key
      await b.createQueue(MEMBER_QUEUE, { name: MEMBER_QUEUE, policy: "short", retryLimit: 20, retryDelay: 1 });
      return b;
    })();
    holder.__ringsideBoss.catch(() => {
      holder.__ringsideBoss = undefined;
    });
  }
  return holder.__ringsideBoss;
}

export async function stopBoss(): Promise<void> {
  const b = holder.__ringsideBoss;
  holder.__ringsideBoss = undefined;
  if (b) await (await b).stop({ graceful: false, wait: true, timeout: 5000 }).catch(() => {});
}

/// Queues the given members (duplicates of a waiting job are dropped by the queue). A job
/// whose worker died comes back after expireSeconds (the member time limit plus a margin).
export async function enqueueMembers(experimentId: string, indexes: readonly number[], expireSeconds: number): Promise<void> {
  const b = await boss();
  for (let i = 0; i < indexes.length; i += 500) {
    await b.insert(
      indexes.slice(i, i + 500).map((index) => ({
        name: MEMBER_QUEUE,
        data: { experimentId, index } satisfies MemberJobData,
        singletonKey: `${experimentId}:${index}`,
        expireInSeconds: expireSeconds,
        retryLimit: 20,
        retryDelay: 1,
      })),
    );
  }
}
