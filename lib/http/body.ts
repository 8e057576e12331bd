/// Reads a JSON request body with a size limit and validates it with a zod schema. Every
/// bound here is a row of lib/limits.ts, named in the refusal (kind `limit`).
import type { z } from "zod";
import { limitDetails, limitValue, type LimitName } from "../limits";
import { HttpError, limitError } from "./errors";
import { nestingProblem, valueProblem } from "./json-guard";

/// The size bound of a body: a row of lib/limits.ts, plus `slackBytes` for the JSON around a
/// field whose own bound is that row (a cell's source is bounded by `cellSourceBytes`, its
/// body by that and a little more).
export interface BodyBound {
  limit?: LimitName;
  slackBytes?: number;
}

/// Throws HttpError 413 (body too large), 415 (not JSON), 400 (malformed JSON, nesting
/// deeper than `jsonNesting`, a NUL or lone surrogate in any string, a number JSON cannot
/// carry exactly — lib/http/json-guard.ts — or a body that fails the schema; `details`
/// lists each failing field path and why).
export async function readJson<S extends z.ZodType>(req: Request, schema: S, bound: BodyBound = {}): Promise<z.infer<S>> {
  const type = req.headers.get("content-type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    throw new HttpError(415, "unsupported_media_type", "Send the body as JSON (Content-Type: application/json).");
  }
  const text = await readText(req, bound);
  const deep = nestingProblem(text, limitValue("jsonNesting"));
  if (deep) throw new HttpError(400, "too_deep", deep, limitDetails("jsonNesting"));
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    const where = error instanceof SyntaxError ? error.message : "unknown position";
    throw new HttpError(400, "malformed_json", `The body is not valid JSON: ${where}.`);
  }
  const bad = valueProblem(value);
  if (bad) throw new HttpError(400, "invalid_body", `Invalid field ${bad.path}: ${bad.message}.`, [bad]);
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    const details = parsed.error.issues.map((i) => ({ path: i.path.join(".") || "(body)", message: i.message }));
    const first = details[0]!;
    throw new HttpError(400, "invalid_body", `Invalid field ${first.path}: ${first.message}`, details);
  }
  return parsed.data;
}

/// The body as text within its bound (413 beyond, as readJson).
export function readText(req: Request, bound: BodyBound = {}): Promise<string> {
  const name = bound.limit ?? "requestBodyBytes";
  return readLimited(req, name, limitValue(name) + (bound.slackBytes ?? 0));
}

async function readLimited(req: Request, name: LimitName, maxBytes: number): Promise<string> {
  // The connection is closed after a 413 either way: `Connection: close` keeps keep-alive
  // clients from reusing it.
  const tooLarge = () => limitError(413, "body_too_large", name, "The body is too large", { Connection: "close" });
  const declared = Number(req.headers.get("content-length"));
  // Bodies up to `bodyDrainBytes` are read to the end before a 413 is sent. A server that
  // answers and closes while the client is still sending makes the client's write fail
  // (EPIPE or ECONNRESET) before it can read the answer, so the client sees "fetch failed"
  // instead of 413 (common practice: servers drain modest bodies before refusing them).
  // Beyond it the connection is closed early: a client sending megabytes to a JSON route
  // gets no courtesy.
  const drainLimit = Math.max(limitValue("bodyDrainBytes"), maxBytes);
  if (Number.isFinite(declared) && declared > maxBytes) {
    if (declared <= drainLimit) await drain(req, drainLimit);
    throw tooLarge();
  }
  if (!req.body) return "";
  // Counted while streaming: Content-Length may be absent (chunked) or wrong.
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let chunk: ReadableStreamReadResult<Uint8Array>;
    try {
      chunk = await reader.read();
    } catch {
      // The client hung up mid-body: nobody reads the answer, but it is not a server fault.
      throw new HttpError(400, "aborted", "The connection closed before the body was complete.");
    }
    const { done, value } = chunk;
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await drainReader(reader, drainLimit - total);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString("utf8");
}

async function drain(req: Request, limit: number): Promise<void> {
  if (req.body) await drainReader(req.body.getReader(), limit);
}

/// Reads and discards up to `budget` more bytes, then cancels the stream.
async function drainReader(reader: ReadableStreamDefaultReader<Uint8Array>, budget: number): Promise<void> {
  try {
    while (budget > 0) {
      const { done, value } = await reader.read();
      if (done) return;
      budget -= value.byteLength;
    }
    await reader.cancel();
  } catch {
    // A client that hangs up mid-body needs no answer.
  }
}
