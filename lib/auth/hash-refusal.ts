/// The credentials route's answer when the password-hash queue is full, and how it recognises
/// next-auth's answer for a sign-in whose check the full queue refused (authorize throws
/// HASH_QUEUE_FULL_ERROR, which next-auth reports as a failed sign-in with that error code).
import { limitError } from "@/lib/http/errors";
import { HASH_QUEUE_FULL_MESSAGE, HASH_RETRY_AFTER_SECONDS } from "./hash-slots";
import { HASH_QUEUE_FULL_ERROR } from "./options";

/// 503 with Retry-After and kind `limit` naming `hashQueue`: too many passwords are waiting
/// to be checked (lib/auth/hash-slots.ts).
/// Like the rate limit's 429 it carries `url`, which next-auth's client reads from every answer.
export function busy(req: Request): Response {
  const refusal = limitError(503, "busy", "hashQueue", HASH_QUEUE_FULL_MESSAGE);
  const url = new URL("/sign-in?error=busy", req.url).toString();
  return Response.json(
    { error: { code: refusal.code, message: refusal.message, details: refusal.details }, url },
    { status: 503, headers: { "Retry-After": String(HASH_RETRY_AFTER_SECONDS) } },
  );
}

/// Whether next-auth's answer is the failed sign-in it gives when authorize threw
/// HASH_QUEUE_FULL_ERROR: its error URL (the Location, or `url` in a JSON answer) says so.
export async function refusedForHashQueue(answer: Response): Promise<boolean> {
  if (answer.status < 300 || answer.status === 304) return false;
  let target = answer.headers.get("location");
  if (!target && (answer.headers.get("content-type") ?? "").includes("application/json")) {
    const body = (await answer
      .clone()
      .json()
      .catch(() => null)) as { url?: unknown } | null;
    target = typeof body?.url === "string" ? body.url : null;
  }
  if (!target) return false;
  try {
    return new URL(target, "http://localhost").searchParams.get("error") === HASH_QUEUE_FULL_ERROR;
  } catch {
    return false;
  }
}
