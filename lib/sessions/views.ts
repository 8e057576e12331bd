/// The JSON shapes of app/api/README.md (typed by the wire contract, lib/wire), made from
/// database rows. The jsonb columns were validated when they were written.
import type { Cell, CellResult } from "@/lib/wire/cells";
import type { NamedObject, ObjectOrigin } from "@/lib/wire/sessions";
import type { ErrorJson, ValueJson } from "@/lib/wire/values";
import type { CellRow, ObjectRow } from "./store";

/// `author` is who ran the cell (null for cells from before authors were recorded, or
/// whose account is gone); its name is shown beside the cell in shared sessions.
export function cellView(row: CellRow & { authorName?: string | null }): Cell {
  const result = row.result as { statements?: CellResult[]; stopped?: unknown } | null;
  return {
    id: row.id,
    position: row.position,
    source: row.source,
    // the app inserts cells as running; the schema's default "pending" reads the same way
    status: row.status === "pending" ? "running" : row.status,
    results: result?.statements ?? [],
    /// where a cancel, a limit or a lost server stopped the cell, with its work so far kept in `results`
    stopped: typeof result?.stopped === "string" ? result.stopped : null,
    error: (row.error as ErrorJson | null) ?? null,
    timings: { totalMs: row.durationMs },
    engineVersion: row.engineVersion,
    author: row.createdBy ? { id: row.createdBy, name: row.authorName ?? "" } : null,
    createdAt: row.createdAt.toISOString(),
  };
}

export function objectView(row: ObjectRow): NamedObject {
  const value = row.value as { text?: unknown } | null;
  const text = typeof value?.text === "string" ? value.text : "";
  return {
    id: row.id,
    name: row.name,
    type: row.type,
    value: row.value as ValueJson,
    summary: summarize(text),
    source: row.source,
    origin: (row.origin as ObjectOrigin | null) ?? null,
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
