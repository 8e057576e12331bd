/// Events a cell job emits while it runs (see app/api/README.md for the stream the client
/// reads; `bound` stays on the server: it tells the route which named objects to store).
export interface Span {
  from: { line: number; col: number };
  to: { line: number; col: number };
}

export interface ErrorValue {
  type: "Error";
  text: string;
  kind: "parse" | "type" | "runtime" | "limit" | "cancelled";
  message: string;
  span: Span;
}

export type CellEvent =
  | { event: "checked"; statements: number; spans: Span[] }
  | { event: "progress"; statement: number; stage: string; detail?: string; fraction?: number }
  | { event: "partial"; statement: number; value: unknown }
  | { event: "result"; statement: number; span: Span; value: unknown }
  | { event: "bound"; statement: number; name: string; type: string; value: unknown; source?: string }
  | { event: "error"; statement: number | null; error: ErrorValue };

/// The payload the route sends to the job.
export interface CellJob {
  source: string;
  bindings: { name: string; type: string; value: unknown }[];
  /// the binding that was the current ring after the session's previous cell
  currentRing: string | null;
}

/// What the job returns when the evaluator finished (also after an error or a cancel).
export interface CellJobOutcome {
  status: "ok" | "error" | "cancelled";
  currentRing: string | null;
}

export function errorValue(kind: ErrorValue["kind"], message: string, span: Span): ErrorValue {
  const at = `${span.from.line}:${span.from.col}-${span.to.line}:${span.to.col}`;
  const label = kind === "limit" ? "limit reached" : kind === "cancelled" ? "cancelled" : `${kind} error`;
  return { type: "Error", text: `${label} at ${at}: ${message}`, kind, message, span };
}
