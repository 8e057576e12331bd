/// Reading a table cell of an experiment row: its text as the table prints it, and its
/// number when it has one (for sorting, filtering and plotting). Pure functions.
import type { ValueReading as ValueJson } from "@/lib/wire/reading";
import type { Row } from "../types";

/// The exact value of a §9 Int or Rat as a JavaScript number (a Rat is "p/q"); Bool as 0/1.
/// Large integers lose precision here, which only matters for plotting and is fine there.
export function numberOfValue(v: ValueJson | undefined): number | null {
  if (!v) return null;
  if (v.type === "Int" && typeof v.value === "string") return Number(v.value);
  if (v.type === "Rat" && typeof v.value === "string") {
    const [p, q] = v.value.split("/");
    const n = Number(p) / Number(q ?? "1");
    return Number.isFinite(n) ? n : null;
  }
  if (v.type === "Bool") return v.value === true || v.value === "true" ? 1 : 0;
  return null;
}

/// What the table prints for `column` of `row`.
export function cellText(row: Row, column: string): string {
  switch (column) {
    case "index":
      return String(row.index);
    case "label":
      return row.label;
    case "status":
      return row.status;
    case "seconds":
      return row.seconds.toFixed(3);
    default: {
      const v = row.fields[column];
      return v ? v.text : "";
    }
  }
}

/// The number in `column` of `row`, or null when the cell holds none.
export function cellNumber(row: Row, column: string): number | null {
  switch (column) {
    case "index":
      return row.index;
    case "seconds":
      return row.seconds;
    case "label":
    case "status":
      return null;
    default:
      return numberOfValue(row.fields[column]);
  }
}

/// The probe's columns whose cells (among `rows`) are numbers: what a plot can use.
export function numericColumns(columns: readonly string[], rows: readonly Row[]): string[] {
  return columns.filter((c) => c === "index" || c === "seconds" || rows.some((r) => numberOfValue(r.fields[c]) !== null));
}

/// The probe's columns holding Betti tables (§9 BettiTable, or a resolution with entries).
export function bettiColumns(columns: readonly string[], rows: readonly Row[]): string[] {
  return columns.filter((c) => rows.some((r) => (r.fields[c]?.entries ?? r.fields[c]?.betti) !== undefined));
}
