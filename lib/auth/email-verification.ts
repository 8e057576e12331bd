/// Confirming a new account's e-mail address through a mailed link. Until confirmed, an
/// account can sign in and work in its own sessions, but cannot accept team invitations,
/// and shares made to its address wait (lib/sharing/shares.ts) until it is confirmed, so
/// nobody can claim another person's address to receive what was meant for them.
import { createHash, randomBytes } from "node:crypto";
import { and, eq, isNull, lt } from "drizzle-orm";
import { db } from "@/db/client";
import { emailVerifications, shares, users } from "@/db/schema";
import { limitValue } from "@/lib/limits";
import type { Executor } from "./audit";

/// How long a confirmation link works: the limit `emailVerificationMs` of lib/limits.ts.
export const VERIFICATION_LIFETIME_MS = limitValue("emailVerificationMs");
const TOKEN_SHAPE = /^[A-Za-z0-9_-]{43}$/;

function digest(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/// A fresh token for the user (32 random bytes, base64url); only its SHA-256 is stored.
export async function issueVerificationToken(exec: Executor, userId: string): Promise<string> {
  const token = randomBytes(32).toString("base64url");
  await exec
    .insert(emailVerifications)
    .values({ tokenHash: digest(token), userId, expiresAt: new Date(Date.now() + VERIFICATION_LIFETIME_MS) });
  return token;
}

export function verificationLink(base: string, token: string): string {
  return `${base}/verify-email?token=${encodeURIComponent(token)}`;
}

export type VerificationOutcome = { ok: true; email: string } | { ok: false; why: "unknown" | "expired" };

/// Confirms the address the token was mailed to. Using a link twice is harmless: the
/// second use finds the token gone and reports it as unknown.
export async function confirmEmail(token: string): Promise<VerificationOutcome> {
  if (!TOKEN_SHAPE.test(token)) return { ok: false, why: "unknown" };
  const hash = digest(token);
  return db().transaction(async (tx) => {
    const [row] = await tx.delete(emailVerifications).where(eq(emailVerifications.tokenHash, hash)).returning();
    if (!row) return { ok: false as const, why: "unknown" as const };
    if (row.expiresAt <= new Date()) return { ok: false as const, why: "expired" as const };
    const [user] = await tx
      .update(users)
      .set({ emailVerifiedAt: new Date() })
      .where(and(eq(users.id, row.userId), isNull(users.emailVerifiedAt)))
      .returning({ email: users.email });
    await tx.delete(emailVerifications).where(lt(emailVerifications.expiresAt, new Date()));
    if (user) {
      // Shares made to this address while it had no confirmed account now reach the user.
      await tx.update(shares).set({ userId: row.userId, email: null }).where(eq(shares.email, user.email));
      return { ok: true as const, email: user.email };
    }
    const [already] = await tx.select({ email: users.email }).from(users).where(eq(users.id, row.userId));
    return already ? { ok: true as const, email: already.email } : { ok: false as const, why: "unknown" as const };
  });
}
