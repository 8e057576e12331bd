/// Errors of evaluation, with the kind and span the Error encoding of notation.md §9 needs.
import { AlgebraError } from "../algebra/index";
import type { Span } from "../../grammar/ast";
import type { ErrorJson, ErrorKind, SpanJson } from "./json";
import type { LimitName } from "../limits";

export class EvalError extends Error {
  constructor(
    readonly kind: ErrorKind,
    message: string,
    readonly span: Span,
  ) {
    super(message);
    this.name = "EvalError";
  }
}

export const runtime = (message: string, span: Span): EvalError => new EvalError("runtime", message, span);
/// A limit error; `name` is the limit's name in lib/limits.ts, said in the message so the
/// user can look it up in the table (README.md, "Limits").
export const limit = (message: string, span: Span, name?: LimitName): EvalError =>
  new EvalError("limit", name === undefined ? message : `${message} (limit ${name})`, span);

/// Any failure inside the evaluation of the node at `span` as an EvalError: engine errors
/// keep their kind, everything unexpected is reported as a runtime error at that node.
export function asEvalError(e: unknown, span: Span): EvalError {
  if (e instanceof EvalError) return e;
  if (e instanceof AlgebraError) return new EvalError(e.kind, inUsersWords(e.message), span);
  if (e instanceof RangeError && /BigInt|Invalid array length/i.test(e.message)) {
    return limit(`the result is too large to represent (${e.message})`, span);
  }
  if (e instanceof RangeError && /call stack/i.test(e.message)) return limit("the computation nested too deeply", span);
  // anything else is a defect of the evaluator or the engine, said so rather than blamed on the input
  const detail = inUsersWords(e instanceof Error ? e.message : String(e));
  return runtime(
    `Ringside could not finish this (a defect of Ringside, not of your input: ${detail}); please report it with this cell`,
    span,
  );
}

/// The engine names the function that raised an error ("resolveQuotient: …", see
/// lib/algebra/errors.ts); that name means nothing to the user, who called a notation
/// function, so it is dropped here, at the one place engine errors reach the user. Nested
/// prefixes ("a: b: …") go too.
export function inUsersWords(message: string): string {
  let out = message;
  for (let m = INTERNAL_PREFIX.exec(out); m; m = INTERNAL_PREFIX.exec(out)) out = out.slice(m[0].length);
  return out;
}

// an identifier, then ": " — the engine's "where" prefix (words of a sentence are never
// followed directly by a colon and a space at the very start of a message)
const INTERNAL_PREFIX = /^[A-Za-z_][A-Za-z0-9_]*: /;

export function spanJson(span: Span): SpanJson {
  return { from: { line: span.from.line, col: span.from.col }, to: { line: span.to.line, col: span.to.col } };
}

/// "runtime error at 2:5-2:9: division by zero"
export function errorJson(kind: ErrorKind, message: string, span: Span): ErrorJson {
  const s = spanJson(span);
  return {
    type: "Error",
    text: `${kind} error at ${s.from.line}:${s.from.col}-${s.to.line}:${s.to.col}: ${message}`,
    kind,
    message,
    span: s,
  };
}
