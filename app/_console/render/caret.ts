/// The view of an error: the offending source line, a caret line under the span, and the
/// message, from a §9 Error span (1-based line and column, `to` just past the end).

/// A §9 span.
export interface SpanJson {
  readonly from: { readonly line: number; readonly col: number };
  readonly to: { readonly line: number; readonly col: number };
}

/// What the transcript prints for an error.
export interface ErrorCaret {
  readonly lineNumber: number;
  readonly line: string;
  readonly caret: string;
  readonly location: string;
}

/// The source line holding the span's start and a caret line (`   ^^^`) under the span;
/// a span running past its line is underlined to the line's end; an empty span or one
/// at the end of the line gets a single caret.
export function errorCaret(source: string, span: SpanJson): ErrorCaret {
  const lines = source.split("\n");
  const lineNumber = Math.min(Math.max(span.from.line, 1), Math.max(lines.length, 1));
  const line = (lines[lineNumber - 1] ?? "").replace(/\r$/, "");
  const start = Math.min(Math.max(span.from.col, 1), line.length + 1);
  const end = span.to.line === span.from.line ? Math.min(span.to.col, line.length + 1) : line.length + 1;
  const width = Math.max(end - start, 1);
  // Tabs stay tabs in the padding so the caret lines up under the same glyphs.
  const pad = line.slice(0, start - 1).replace(/[^\t]/g, " ");
  const location =
    span.to.line === span.from.line
      ? `${span.from.line}:${span.from.col}-${span.to.col}`
      : `${span.from.line}:${span.from.col}-${span.to.line}:${span.to.col}`;
  return { lineNumber, line, caret: pad + "^".repeat(width), location };
}
