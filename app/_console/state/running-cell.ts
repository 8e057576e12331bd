/// The state of the cell being run, folded from the stream's events (app/api/README.md):
/// its stage and fraction for the progress bar, partial Betti columns as they arrive,
/// results, the error, and the final status.
import { mergeBettiEntries, type BettiEntry } from "../render/betti";
import type { CellEvent, CellResult, CellStatus } from "@/lib/wire/reading";
import type { NamedObject } from "@/lib/wire/reading";
import type { ErrorJson } from "@/lib/wire/reading";

export interface RunningCell {
  readonly source: string;
  readonly cellId: string | null;
  readonly position: number | null;
  /// Number of statements once the program is checked.
  readonly statements: number | null;
  readonly stage: string | null;
  readonly detail: string | null;
  readonly fraction: number | null;
  /// Statement index of the progress shown.
  readonly statement: number | null;
  /// Betti entries streamed so far for the current statement.
  readonly partialBetti: readonly BettiEntry[];
  readonly results: readonly CellResult[];
  readonly error: ErrorJson | null;
  readonly status: CellStatus;
  readonly totalMs: number | null;
  readonly objects: readonly NamedObject[];
  readonly cancelRequested: boolean;
}

/// A cell just sent.
export function startedCell(source: string): RunningCell {
  return {
    source,
    cellId: null,
    position: null,
    statements: null,
    stage: null,
    detail: null,
    fraction: null,
    statement: null,
    partialBetti: [],
    results: [],
    error: null,
    status: "running",
    totalMs: null,
    objects: [],
    cancelRequested: false,
  };
}

const bettiOf = (v: {
  type: string;
  entries?: readonly (readonly [number, number, number])[];
  betti?: readonly (readonly [number, number, number])[];
}) => (v.type === "BettiTable" ? (v.entries ?? []) : v.type === "Complex" ? (v.betti ?? []) : []);

/// Folds one stream event into the running cell.
export function applyCellEvent(cell: RunningCell, e: CellEvent): RunningCell {
  switch (e.event) {
    case "accepted":
      return { ...cell, cellId: e.cellId, position: e.position };
    case "checked":
      return { ...cell, statements: e.statements, stage: "checked" };
    case "progress": {
      const sameStatement = cell.statement === e.statement;
      return {
        ...cell,
        statement: e.statement,
        stage: e.stage,
        detail: e.detail ?? null,
        fraction: typeof e.fraction === "number" && Number.isFinite(e.fraction) ? Math.min(Math.max(e.fraction, 0), 1) : null,
        partialBetti: sameStatement ? cell.partialBetti : [],
      };
    }
    case "partial": {
      const earlier = cell.statement === e.statement ? cell.partialBetti : [];
      return { ...cell, statement: e.statement, partialBetti: mergeBettiEntries([earlier, bettiOf(e.value)]) };
    }
    case "result":
      return {
        ...cell,
        results: [...cell.results, { index: e.statement, span: e.span, value: e.value }],
        partialBetti: [],
      };
    case "error":
      return { ...cell, error: e.error };
    case "done":
      return { ...cell, status: e.status, totalMs: e.timings.totalMs, objects: e.objects };
  }
}

/// The fraction of the cell done, from the statement count and the current statement's
/// own fraction; null when unknown (the bar is then indeterminate).
export function overallFraction(cell: RunningCell): number | null {
  if (cell.statements === null || cell.statements === 0) return null;
  const doneStatements = cell.results.length;
  const inStatement = cell.fraction ?? 0;
  return Math.min((doneStatements + inStatement) / cell.statements, 1);
}
