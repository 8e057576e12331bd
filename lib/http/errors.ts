/// JSON errors for route handlers: every failure answers `{ error: { code, message } }`.
import { NextResponse } from "next/server";
import { formatLimit, limitDetails, limitValue, type LimitName } from "../limits";

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

export function jsonError(
  status: number,
  code: string,
  message: string,
  details?: unknown,
  headers?: Record<string, string>,
): NextResponse {
  const error = details === undefined ? { code, message } : { code, message, details };
  return NextResponse.json({ error }, { status, headers });
}

/// A refusal because a request met a limit of lib/limits.ts: the message says which and how
/// much — `message` has no final period; "The body is too large" becomes "The body is too
/// large (limit authBodyBytes = 8 KiB)." — and `details` is `{kind: "limit", limit, value}`.
export function limitError(
  status: number,
  code: string,
  name: LimitName,
  message: string,
  headers?: Record<string, string>,
  value = limitValue(name),
): HttpError {
  return new HttpError(status, code, `${message} (limit ${name} = ${formatLimit(name, value)}).`, limitDetails(name, value), headers);
}

export const unauthorized = () => new HttpError(401, "unauthorized", "Sign in to use this endpoint.");
export const forbidden = (why = "Your role does not allow this.") => new HttpError(403, "forbidden", why);
export const notFound = (what = "The resource") => new HttpError(404, "not_found", `${what} does not exist.`);

/// Turns a thrown HttpError into its JSON response; anything else becomes a 500 whose body
/// reveals nothing about the failure (the server log has it).
export function errorResponse(error: unknown): NextResponse {
  if (error instanceof HttpError) return jsonError(error.status, error.code, error.message, error.details, error.headers);
  console.error("[ringside] unhandled error in a route:", error);
  return jsonError(500, "internal", "Something went wrong on the server.");
}

/// Wraps a route handler so that thrown HttpErrors (from requireUser, readJson, …) become
/// JSON responses.
export function route<C>(handler: (req: Request, context: C) => Promise<Response>): (req: Request, context: C) => Promise<Response> {
  return async (req, context) => {
    try {
      return await handler(req, context);
    } catch (error) {
      return errorResponse(error);
    }
  };
}
