/// Offsets to 1-based line:col positions, and the printed form of errors.
import type { Position, Span } from "./ast";
import type { Diagnostic } from "./analysis";

export interface Locator {
  /// The position of an offset, clamped into [0, source.length].
  at(offset: number): Position;
}

export function makeLocator(source: string): Locator {
  const starts = [0];
  for (let i = 0; i < source.length; i++) if (source.charCodeAt(i) === 10) starts.push(i + 1);
  return {
    at(offset: number): Position {
      const o = Number.isFinite(offset) ? Math.min(Math.max(0, Math.trunc(offset)), source.length) : source.length;
      let lo = 0;
      let hi = starts.length - 1;
      while (lo < hi) {
        const mid = (lo + hi + 1) >> 1;
        if (starts[mid] <= o) lo = mid;
        else hi = mid - 1;
      }
      return { line: lo + 1, col: o - starts[lo] + 1, offset: o };
    },
  };
}

/// `1:13-1:14`
export function formatSpan(span: Span): string {
  return `${span.from.line}:${span.from.col}-${span.to.line}:${span.to.col}`;
}

/// `type error at 1:13-1:14: burch_index expects a Ring, got Ideal — did you mean …?`
export function formatError(d: Diagnostic): string {
  return `${d.kind} error at ${formatSpan(d.span)}: ${d.message}`;
}
