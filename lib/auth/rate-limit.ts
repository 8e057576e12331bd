/// Sign-in rate limiting, counted in PostgreSQL so every web server shares the counts.
/// An account is blocked after ACCOUNT_FAILURES failed attempts since its last success
/// within the window; an address after ADDRESS_FAILURES failures within the window.
import { and, count, eq, gt, lt, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { signInAttempts } from "@/db/schema";

export const RATE_WINDOW_MINUTES = 15;
export const ACCOUNT_FAILURES = 5;
export const ADDRESS_FAILURES = 20;

export type RateDecision = { limited: false } | { limited: true; scope: "account" | "address"; retryAfterSeconds: number };

const windowStart = sql`now() - make_interval(mins => ${RATE_WINDOW_MINUTES})`;

export async function checkSignInRate(email: string, address: string): Promise<RateDecision> {
  const database = db();
  const [lastSuccess] = await database
    .select({ at: sql<Date | null>`max(${signInAttempts.at})` })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, true), gt(signInAttempts.at, windowStart)));
  const since = lastSuccess?.at ? sql`${new Date(lastSuccess.at).toISOString()}::timestamptz` : windowStart;
  const [account] = await database
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)));
  const retryAfterSeconds = RATE_WINDOW_MINUTES * 60;
  if ((account?.n ?? 0) >= ACCOUNT_FAILURES) return { limited: true, scope: "account", retryAfterSeconds };
  const [byAddress] = await database
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.address, address), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, windowStart)));
  if ((byAddress?.n ?? 0) >= ADDRESS_FAILURES) return { limited: true, scope: "address", retryAfterSeconds };
  return { limited: false };
}

export async function recordSignInAttempt(email: string, address: string, succeeded: boolean): Promise<void> {
  const database = db();
  await database.insert(signInAttempts).values({ email, address, succeeded });
  // Rows older than a day can no longer affect a decision.
  await database.delete(signInAttempts).where(lt(signInAttempts.at, sql`now() - interval '1 day'`));
}
