/// Sign-in rate limiting, counted in PostgreSQL so every web server shares the counts.
/// An account is blocked after ACCOUNT_FAILURES failed attempts since its last success
/// within the window; an address after ADDRESS_FAILURES failures within the window. The
/// three figures are rows of lib/limits.ts (`signInWindowMs`, `signInAccountFailures`,
/// `signInAddressFailures`).
import { and, count, eq, gt, lt, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { limitValue, type LimitName } from "@/lib/limits";

/// Whole seconds, at least one (PostgreSQL's interval and Retry-After both take seconds).
export const RATE_WINDOW_SECONDS = Math.max(1, Math.ceil(limitValue("signInWindowMs") / 1000));
export const ACCOUNT_FAILURES = Math.max(1, Math.floor(limitValue("signInAccountFailures")));
export const ADDRESS_FAILURES = Math.max(1, Math.floor(limitValue("signInAddressFailures")));

export type RateDecision =
  | { limited: false }
  | {
      limited: true;
      scope: "account" | "address";
      /// the row of lib/limits.ts that refused
      limit: Extract<LimitName, "signInAccountFailures" | "signInAddressFailures">;
      retryAfterSeconds: number;
    };

const windowStart = sql`now() - make_interval(secs => ${RATE_WINDOW_SECONDS})`;

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
  const retryAfterSeconds = RATE_WINDOW_SECONDS;
  if ((account?.n ?? 0) >= ACCOUNT_FAILURES) return { limited: true, scope: "account", limit: "signInAccountFailures", retryAfterSeconds };
  const [byAddress] = await database
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.address, address), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, windowStart)));
  if ((byAddress?.n ?? 0) >= ADDRESS_FAILURES)
    return { limited: true, scope: "address", limit: "signInAddressFailures", retryAfterSeconds };
  return { limited: false };
}

export async function recordSignInAttempt(email: string, address: string, succeeded: boolean): Promise<void> {
  const database = db();
  await database.insert(signInAttempts).values({ email, address, succeeded });
  // Rows older than a day can no longer affect a decision.
  await database.delete(signInAttempts).where(lt(signInAttempts.at, sql`now() - interval '1 day'`));
}
