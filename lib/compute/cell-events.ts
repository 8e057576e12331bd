/// Events a cell job emits while it runs. The shapes are the wire contract
/// (lib/wire/cells.ts); `bound` stays on the server: it tells the route which named
/// objects to store.
import type { ErrorJson, SpanJson } from "../wire/values";
export type { CellJob, CellJobOutcome, JobEvent as CellEvent, Span } from "../wire/cells";
export type ErrorValue = ErrorJson;

export function errorValue(kind: ErrorValue["kind"], message: string, span: SpanJson): ErrorValue {
  const at = `${span.from.line}:${span.from.col}-${span.to.line}:${span.to.col}`;
  const label = kind === "limit" ? "limit reached" : kind === "cancelled" ? "cancelled" : `${kind} error`;
  return { type: "Error", text: `${label} at ${at}: ${message}`, kind, message, span };
}
