"use client";
/// An error as the transcript shows it: the source line, a caret under the span and
/// the message with its kind.
import type { ErrorJson } from "@/lib/wire/reading";
import { errorCaret } from "../render/caret";

/// Renders a §9 Error against the cell's source.
export function ErrorView({ error, source }: { error: ErrorJson; source: string }) {
  const c = errorCaret(source, error.span);
  const kind = error.kind === "limit" ? "limit reached" : error.kind === "cancelled" ? "cancelled" : `${error.kind} error`;
  return (
    <div
      role="group"
      aria-label="Error"
      className="rounded border-l-4 border-red-600 bg-red-50 px-3 py-2 dark:border-red-400 dark:bg-red-950/40"
    >
      <pre className="overflow-x-auto font-mono text-sm leading-snug" aria-hidden={error.kind === "cancelled"}>
        <span className="select-none text-ink/40 dark:text-paper/40">{String(c.lineNumber).padStart(3)} │ </span>
        {c.line}
        {"\n"}
        <span className="select-none">{"    │ "}</span>
        <span className="font-bold text-red-700 dark:text-red-300">{c.caret}</span>
      </pre>
      <p className="mt-1 text-sm">
        <span className="font-semibold text-red-800 dark:text-red-200">
          {kind} at {c.location}:
        </span>{" "}
        {error.message}
      </p>
    </div>
  );
}
