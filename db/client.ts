/// The one PostgreSQL connection pool of a process, created on first use from DATABASE_URL.
import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

export type Database = PostgresJsDatabase<typeof schema>;

type Pool = { sql: postgres.Sql; db: Database };

// Kept on globalThis so module reloads (dev server, test workers) reuse one pool.
const holder = globalThis as typeof globalThis & { __ringsidePool?: Pool };

export function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: start Ringside with `npm start` (or `npm test`).");
  return url;
}

function pool(): Pool {
  if (!holder.__ringsidePool) {
    const sql = postgres(databaseUrl(), { max: 10, onnotice: () => {} });
    holder.__ringsidePool = { sql, db: drizzle(sql, { schema }) };
  }
  return holder.__ringsidePool;
}

export function db(): Database {
  return pool().db;
}

/// Ends the pool (scripts and tests call this so the process can exit).
export async function closeDb(): Promise<void> {
  const p = holder.__ringsidePool;
  holder.__ringsidePool = undefined;
  if (p) await p.sql.end({ timeout: 5 });
}
