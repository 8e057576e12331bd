import NextAuth from "next-auth";
import { NextRequest } from "next/server";
import { recordAuditEvent } from "@/lib/auth/audit-log";
import { hashQueueFull } from "@/lib/auth/hash-slots";
import { busy, refusedForHashQueue } from "@/lib/auth/hash-refusal";
import { authOptions, normalizeEmail } from "@/lib/auth/options";
import { checkSignInRate } from "@/lib/auth/rate-limit";
import { readText } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { errorResponse, jsonError } from "@/lib/http/errors";
import { formatLimit, limitDetails } from "@/lib/limits";
import { textProblem } from "@/lib/http/json-guard";

type Context = { params: Promise<{ nextauth: string[] }> };

const handler = NextAuth(authOptions) as (req: Request, context: Context) => Promise<Response>;

export const GET = handler;

/// The fields of a credentials body, read exactly as next-auth reads them
/// (next-auth/next/utils getBody: JSON when the type mentions application/json, else
/// URL-encoded form), so the rate limit sees the same address next-auth will check.
/// null when next-auth would find no credentials in it at all.
function credentialFields(contentType: string, text: string): Record<string, unknown> | null {
  if (contentType.includes("application/json")) {
    try {
      const value: unknown = JSON.parse(text);
      return value !== null && typeof value === "object" && !Array.isArray(value) ? (value as Record<string, unknown>) : null;
    } catch {
      return null;
    }
  }
  if (contentType.includes("application/x-www-form-urlencoded")) return Object.fromEntries(new URLSearchParams(text));
  return null;
}

/// Every sign-in attempt, whatever its encoding, passes the rate limiter first, so a
/// blocked account or address gets a clear 429 before any password is checked; a body
/// next-auth could not read is refused here with 400/415 rather than reaching it.
export async function POST(req: Request, context: Context): Promise<Response> {
  const { nextauth } = await context.params;
  if (nextauth[0] !== "callback" || nextauth[1] !== "credentials") return handler(req, context);
  try {
    const contentType = req.headers.get("content-type") ?? "";
    const text = await readText(req, { limit: "authBodyBytes" });
    const fields = credentialFields(contentType, text);
    if (fields === null) {
      return contentType.includes("json") || contentType.includes("form-urlencoded")
        ? jsonError(400, "invalid_body", "Send the credentials as a JSON object or a URL-encoded form.")
        : jsonError(415, "unsupported_media_type", "Send the credentials as JSON or as a URL-encoded form.");
    }
    if (typeof fields.email !== "string" || typeof fields.password !== "string") {
      return jsonError(400, "invalid_body", "The fields email and password must be strings.");
    }
    for (const field of ["email", "password"] as const) {
      const why = textProblem(fields[field] as string);
      if (why) return jsonError(400, "invalid_body", `Invalid field ${field}: ${why}.`);
    }
    const email = normalizeEmail(fields.email);
    const address = clientAddress(req.headers);
    const decision = await checkSignInRate(email, address);
    if (decision.limited) {
      await recordAuditEvent({ event: "signin_rate_limited", email, address, details: { scope: decision.scope } });
      const minutes = Math.ceil(decision.retryAfterSeconds / 60);
      const who = decision.scope === "account" ? "this account" : "your address";
      const message =
        `Too many failed sign-in attempts for ${who}. Try again in ${minutes} minutes ` +
        `(limit ${decision.limit} = ${formatLimit(decision.limit)} within ${formatLimit("signInWindowMs")}).`;
      // next-auth's client reads `url` from the JSON answer; point it at the sign-in page.
      const url = new URL("/sign-in?error=rate_limited", req.url).toString();
      return Response.json(
        { error: { code: "rate_limited", message, details: limitDetails(decision.limit) }, url },
        { status: 429, headers: { "Retry-After": String(decision.retryAfterSeconds) } },
      );
    }
    if (hashQueueFull()) return busy(req);
    // The body has been read: hand next-auth an identical request with the same bytes.
    const replay = new NextRequest(req.url, { method: "POST", headers: req.headers, body: text });
    const answer = await handler(replay, context);
    // The queue may have filled after the check above (many requests pass it at once):
    // next-auth then reports the authorize error as a failed sign-in; it is a refusal.
    return (await refusedForHashQueue(answer)) ? busy(req) : answer;
  } catch (error) {
    return errorResponse(error);
  }
}
