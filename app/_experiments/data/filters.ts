/// The filter a person types above a column: `3` or `= 3`, `!= 0`, `> 2`, `>= 2`, `< 5`,
/// `<= 5`, or words. One syntax for both table modes: filtered in the browser when every
/// row is loaded, or handed to the API's `where=column:op:value` for large experiments.
/// Pure functions.
import type { Row } from "../types";
import { cellNumber, cellText } from "./cells";

export type FilterOp = "eq" | "ne" | "lt" | "le" | "gt" | "ge" | "contains";

export interface ColumnFilter {
  op: FilterOp;
  value: string;
}

const OPS: [string, FilterOp][] = [
  [">=", "ge"],
  ["<=", "le"],
  ["!=", "ne"],
  [">", "gt"],
  ["<", "lt"],
  ["=", "eq"],
];

/// Parses what was typed; an empty text is no filter. Words without an operator mean
/// "contains" in the browser (and "equals" at the server, which has no "contains").
export function parseFilter(text: string): ColumnFilter | null {
  const t = text.trim();
  if (t === "") return null;
  for (const [sign, op] of OPS) {
    if (t.startsWith(sign)) {
      const value = t.slice(sign.length).trim();
      return value === "" ? null : { op, value };
    }
  }
  return /^-?\d+(\.\d+)?$/.test(t) ? { op: "eq", value: t } : { op: "contains", value: t };
}

function compare(a: number | string, b: number | string, op: Exclude<FilterOp, "contains">): boolean {
  switch (op) {
    case "eq":
      return a === b;
    case "ne":
      return a !== b;
    case "lt":
      return a < b;
    case "le":
      return a <= b;
    case "gt":
      return a > b;
    case "ge":
      return a >= b;
  }
}

/// Whether `row` passes `filter` on `column`: numbers compare as numbers when both the
/// cell and the typed value are numbers, otherwise the texts compare.
export function rowPasses(row: Row, column: string, filter: ColumnFilter): boolean {
  const text = cellText(row, column);
  if (filter.op === "contains") return text.toLowerCase().includes(filter.value.toLowerCase());
  const n = cellNumber(row, column);
  const wanted = Number(filter.value);
  if (n !== null && filter.value.trim() !== "" && Number.isFinite(wanted)) return compare(n, wanted, filter.op);
  return compare(text, filter.value, filter.op);
}

/// The API's `where` parameter for a probe column (contains becomes eq: the server has no
/// substring match, and the filter box says so).
export function whereParam(column: string, filter: ColumnFilter): string {
  return `${column}:${filter.op === "contains" ? "eq" : filter.op}:${filter.value}`;
}
