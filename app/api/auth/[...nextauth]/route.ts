import NextAuth from "next-auth";
import { recordAuditEvent } from "@/lib/auth/audit-log";
import { authOptions, normalizeEmail } from "@/lib/auth/options";
import { checkSignInRate } from "@/lib/auth/rate-limit";
import { clientAddress } from "@/lib/http/client-address";

type Context = { params: Promise<{ nextauth: string[] }> };

const handler = NextAuth(authOptions) as (req: Request, context: Context) => Promise<Response>;

export const GET = handler;

/// Sign-in attempts pass the rate limiter first, so a blocked account or address gets a
/// clear 429 before any password is checked.
export async function POST(req: Request, context: Context): Promise<Response> {
  const { nextauth } = await context.params;
  if (nextauth[0] === "callback" && nextauth[1] === "credentials") {
    const form = await req.clone().formData().catch(() => null);
    const email = normalizeEmail(String(form?.get("email") ?? ""));
    const address = clientAddress(req.headers);
    const decision = await checkSignInRate(email, address);
    if (decision.limited) {
      await recordAuditEvent({ event: "signin_rate_limited", email, address, details: { scope: decision.scope } });
      const minutes = Math.ceil(decision.retryAfterSeconds / 60);
      const who = decision.scope === "account" ? "this account" : "your address";
      const message = `Too many failed sign-in attempts for ${who}. Try again in ${minutes} minutes.`;
      // next-auth's client reads `url` from the JSON answer; point it at the sign-in page.
      const url = new URL("/sign-in?error=rate_limited", req.url).toString();
      return Response.json(
        { error: { code: "rate_limited", message }, url },
        { status: 429, headers: { "Retry-After": String(decision.retryAfterSeconds) } },
      );
    }
  }
  return handler(req, context);
}
