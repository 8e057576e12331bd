/// The copy menu of a result: the value as plain text, LaTeX, Markdown, and CSV for the
/// values that are tables (Betti tables, resolutions' Betti tables, tables). Built from the
/// same view model the transcript draws, so what is copied is what is seen.
import type { ValueReading } from "@/lib/wire/reading";
import { bettiGrid, type BettiEntry, type BettiGrid } from "./betti";
import { viewOfValue, type ValueView, type ViewContext } from "./view-model";

export type CopyFormat = "text" | "latex" | "markdown" | "csv";

export const COPY_LABELS: Readonly<Record<CopyFormat, string>> = {
  text: "Plain text",
  latex: "LaTeX",
  markdown: "Markdown",
  csv: "CSV",
};

const entriesOf = (v: ValueReading): BettiEntry[] =>
  ((v.entries ?? v.betti ?? []) as BettiEntry[]).filter((e) => Array.isArray(e) && e.length === 3);

/// The formats offered for a value: CSV only for tables.
export function copyFormats(v: ValueReading): CopyFormat[] {
  const tabular = v.type === "BettiTable" || v.type === "Complex" || v.type === "Table";
  return tabular ? ["text", "latex", "markdown", "csv"] : ["text", "latex", "markdown"];
}

/// A Betti table as rows of cells: the header (j−i \ i, 0, 1, …), a row per j − i, the totals.
function bettiRows(grid: BettiGrid): string[][] {
  return [
    ["j−i \\ i", ...grid.columns.map(String)],
    ...grid.rows.map((r) => [String(r.shift), ...r.cells.map((c) => (c === null ? "" : String(c)))]),
    ["total", ...grid.totals.map(String)],
  ];
}

function bettiLatex(grid: BettiGrid): string {
  if (grid.rows.length === 0) return "\\text{all Betti numbers are zero}";
  const rows = bettiRows(grid);
  const line = (r: string[]) => r.join(" & ") + " \\\\";
  return [
    `\\begin{array}{r|${"r".repeat(grid.columns.length)}}`,
    line(rows[0]!.map((c, i) => (i === 0 ? "" : c))),
    "\\hline",
    ...rows.slice(1, -1).map(line),
    "\\hline",
    line(["\\text{total}", ...rows.at(-1)!.slice(1)]),
    "\\end{array}",
  ].join("\n");
}

function markdownTable(rows: string[][]): string {
  const esc = (c: string) => c.replace(/\|/g, "\\|").replace(/\n/g, " ");
  const [head, ...body] = rows;
  return [
    `| ${head!.map(esc).join(" | ")} |`,
    `|${head!.map(() => "---").join("|")}|`,
    ...body.map((r) => `| ${r.map(esc).join(" | ")} |`),
  ].join("\n");
}

/// RFC 4180 CSV: fields with a comma, quote or line break are quoted, quotes doubled.
export function csvOf(rows: readonly (readonly string[])[]): string {
  const field = (c: string) => (/[",\r\n]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c);
  return rows.map((r) => r.map(field).join(",")).join("\r\n") + "\r\n";
}

function tableRows(v: ValueReading): string[][] {
  const view = viewOfValue(v);
  if (view.kind !== "table") return [[v.text]];
  return [[...view.columns], ...view.rows.map((r) => [...r])];
}

/// TeX of a view for the LaTeX copy (math material, without surrounding dollars).
function texOfView(view: ValueView, v: ValueReading): string {
  switch (view.kind) {
    case "tex":
    case "series":
      return view.tex;
    case "hilbert":
      return view.tex;
    case "betti":
      return bettiLatex(view.grid);
    case "complex":
      return view.resolution.chain;
    default:
      return `\\text{${v.text.replace(/[\\{}$&#^_%~]/g, (c) => `\\${c === "\\" ? "backslash " : c}`)}}`;
  }
}

export function copyText(v: ValueReading, format: CopyFormat, ctx: ViewContext = {}): string {
  const view = viewOfValue(v, ctx);
  switch (format) {
    case "text":
      if (view.kind === "complex") return `${view.resolutionText}`;
      return v.text;
    case "latex":
      if (v.type === "Table") {
        const rows = tableRows(v);
        return `\\begin{tabular}{${"l".repeat(rows[0]!.length)}}\n${rows.map((r) => r.join(" & ") + " \\\\").join("\n")}\n\\end{tabular}`;
      }
      if (view.kind === "betti") return `\\[\n${bettiLatex(view.grid)}\n\\]`;
      if (view.kind === "complex") return `\\[\n${view.resolution.chain}\n\\]\n\\[\n${bettiLatex(view.grid)}\n\\]`;
      return `$${texOfView(view, v)}$`;
    case "markdown":
      if (view.kind === "betti") return markdownTable(bettiRows(view.grid));
      if (view.kind === "complex") return `$${view.resolution.chain}$\n\n${markdownTable(bettiRows(view.grid))}`;
      if (v.type === "Table") return markdownTable(tableRows(v));
      if (view.kind === "text" || view.kind === "list" || view.kind === "record") return "`" + v.text.replace(/`/g, "'") + "`";
      return `$${texOfView(view, v)}$`;
    case "csv":
      if (view.kind === "betti" || view.kind === "complex")
        return csvOf(bettiRows(view.kind === "betti" ? view.grid : bettiGrid(entriesOf(v), v.complete !== false)));
      return csvOf(tableRows(v));
  }
}
