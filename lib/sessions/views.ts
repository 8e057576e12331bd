/// The JSON shapes of app/api/README.md, made from database rows.
import type { CellRow, ObjectRow } from "./store";

/// `author` is who ran the cell (null for cells from before authors were recorded, or
/// whose account is gone); its name is shown beside the cell in shared sessions.
export function cellView(row: CellRow & { authorName?: string | null }) {
  const result = row.result as { statements?: unknown[] } | null;
  return {
    id: row.id,
    position: row.position,
    source: row.source,
    status: row.status,
    results: result?.statements ?? [],
    error: row.error ?? null,
    timings: { totalMs: row.durationMs },
    engineVersion: row.engineVersion,
    author: row.createdBy ? { id: row.createdBy, name: row.authorName ?? "" } : null,
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
    /// who defined it (the id of the user whose cell bound it last, or who imported it)
    definedBy: row.ownerId,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/// One line for the shelf: the value's text, shortened at a character boundary.
function summarize(text: string, max = 80): string {
  const line = text.replace(/\s+/g, " ").trim();
  return line.length <= max ? line : line.slice(0, max - 1) + "…";
}
