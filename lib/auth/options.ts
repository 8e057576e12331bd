/// next-auth configuration: Credentials provider, JWT sessions, our own pages.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { clientAddress } from "@/lib/http/client-address";
import { limitValue } from "@/lib/limits";
import { recordAudit } from "./audit";
import { decoyHash, verifyPassword } from "./password";
import { isHashQueueFull } from "./hash-slots";
import { recordSignInAttempt } from "./rate-limit";

/// How long a sign-in lasts: the limit `signInSessionMs` of lib/limits.ts.
export const SESSION_MAX_AGE_SECONDS = Math.ceil(limitValue("signInSessionMs") / 1000);

/// The error next-auth reports (in its error URL) when the password could not be checked
/// because the hash queue was full; the credentials route turns it into a 503.
export const HASH_QUEUE_FULL_ERROR = "hash_queue_full";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/sign-in", signOut: "/sign-out", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "Email and password",
      credentials: { email: { label: "Email", type: "email" }, password: { label: "Password", type: "password" } },
      // The rate limit and the shape of the body are checked before this runs
      // (app/api/auth/[...nextauth]/route.ts).
      async authorize(credentials, req) {
        const email = normalizeEmail(typeof credentials?.email === "string" ? credentials.email : "");
        const password = typeof credentials?.password === "string" ? credentials.password : "";
        const address = clientAddress(req.headers ?? {});
        const [user] = email ? await db().select().from(users).where(eq(users.email, email)) : [];
        let ok: boolean;
        try {
          ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
        } catch (error) {
          // The queue filled between the route's check and this point (a flood): nothing was
          // checked, so no attempt is recorded; the route answers 503 (next-auth puts the
          // message in its error URL).
          if (isHashQueueFull(error)) throw new Error(HASH_QUEUE_FULL_ERROR);
          throw error;
        }
        const succeeded = ok && user !== undefined;
        await recordSignInAttempt(email, address, succeeded);
        await recordAudit(db(), {
          event: succeeded ? "signin_success" : "signin_failure",
          userId: user?.id ?? null,
          email,
          address,
          details: succeeded ? {} : { reason: user ? "wrong_password" : "unknown_account" },
        });
        if (!succeeded) return null;
        return { id: user.id, email: user.email, name: user.displayName, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      // At sign-in, remember which session version the token belongs to.
      if (user && "sessionVersion" in user) token.sv = (user as { sessionVersion: number }).sessionVersion;
      return token;
    },
    session({ session, token }) {
      if (token.sub) session.user = { ...session.user, id: token.sub, sv: typeof token.sv === "number" ? token.sv : 0 };
      return session;
    },
    // Only destinations on this site, compared as parsed URLs (a string prefix check lets
    // "/\t/evil.example" through, which a browser reads as //evil.example).
    redirect({ url, baseUrl }) {
      try {
        const target = new URL(url, baseUrl);
        return target.origin === new URL(baseUrl).origin ? target.toString() : baseUrl;
      } catch {
        return baseUrl;
      }
    },
  },
  events: {
    /// Signing out revokes every token issued to the user so far, not just this cookie:
    /// a copied token stops working too (lib/auth/current-user.ts compares the version).
    async signOut({ token }) {
      if (!token?.sub) return;
      const sv = typeof token.sv === "number" ? token.sv : 0;
      await db()
        .update(users)
        .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
        .where(and(eq(users.id, token.sub), eq(users.sessionVersion, sv)));
      await recordAudit(db(), { event: "signout", userId: token.sub });
    },
  },
};

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}
