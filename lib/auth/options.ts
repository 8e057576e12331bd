/// next-auth configuration: Credentials provider, JWT sessions, our own pages.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { clientAddress } from "@/lib/http/client-address";
import { recordAudit } from "./audit";
import { decoyHash, verifyPassword } from "./password";
import { recordSignInAttempt } from "./rate-limit";

export const SESSION_MAX_AGE_SECONDS = 7 * 24 * 60 * 60;

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/sign-in", signOut: "/sign-out", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "Email and password",
      credentials: { email: { label: "Email", type: "email" }, password: { label: "Password", type: "password" } },
      // The rate limit is checked before this runs (app/api/auth/[...nextauth]/route.ts).
      async authorize(credentials, req) {
        const email = normalizeEmail(credentials?.email ?? "");
        const password = credentials?.password ?? "";
        const address = clientAddress(req.headers ?? {});
        const [user] = email ? await db().select().from(users).where(eq(users.email, email)) : [];
        const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
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
        return { id: user.id, email: user.email, name: user.displayName };
      },
    }),
  ],
  callbacks: {
    session({ session, token }) {
      if (token.sub) session.user = { ...session.user, id: token.sub };
      return session;
    },
  },
};

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}
