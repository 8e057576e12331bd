/// The JSON shapes of app/api/README.md, made from database rows.
import type { CellRow, ObjectRow } from "./store";

export function cellView(row: CellRow) {
  const result = row.result as { statements?: unknown[]; stopped?: unknown } | null;
  return {
    id: row.id,
    position: row.position,
    source: row.source,
    status: row.status,
    results: result?.statements ?? [],
    /// where a cancel, a limit or a lost server stopped the cell, with its work so far kept in `results`
    stopped: typeof result?.stopped === "string" ? result.stopped : null,
    error: row.error ?? null,
    timings: { totalMs: row.durationMs },
    engineVersion: row.engineVersion,
    createdAt: row.createdAt.toISOString(),
  };
}

export function objectView(row: ObjectRow) {
  const value = row.value as { text?: unknown } | null;
  const text = typeof value?.text === "string" ? value.text : "";
  return {
    id: row.id,
    name: row.name,
    type: row.type,
    value: row.value,
    summary: summarize(text),
    source: row.source,
    origin: row.origin ?? null,
    sourceCellId: row.sourceCellId,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/// One line for the shelf: the value's text, shortened at a character boundary.
function summarize(text: string, max = 80): string {
  const line = text.replace(/\s+/g, " ").trim();
  return line.length <= max ? line : line.slice(0, max - 1) + "…";
}
