/// The table as a Markdown (GitHub-flavoured pipe) table, with a caption paragraph that
/// records how to reproduce it, as the LaTeX export's caption does. Pure functions.
import type { Experiment, Row } from "../types";
import { cellText } from "./cells";

/// A pipe and a backslash would end or escape a cell; line breaks would end the row.
const cell = (s: string) => s.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/\r?\n/g, " ");

export function rowsMarkdown(e: Experiment, rows: readonly Row[]): string {
  const columns = e.columns;
  const numeric = new Set(["index", "seconds"]);
  const head = `| ${columns.map(cell).join(" | ")} |`;
  const rule = `| ${columns.map((c) => (numeric.has(c) ? "---:" : "---")).join(" | ")} |`;
  const body = rows.map((r) => `| ${columns.map((c) => cell(cellText(r, c))).join(" | ")} |`);
  const failed = rows.filter((r) => r.status !== "ok").length;
  const caption = `*${cell(e.title)}.* Family: \`${e.familyDefinition}\`. Probe: \`${e.probe}\`. Engine: ${e.engineVersion}. ${rows.length} of ${e.total} members${failed ? `, ${failed} not ok` : ""}.`;
  return [caption, "", head, rule, ...body, ""].join("\n");
}
