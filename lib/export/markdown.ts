/// A transcript as Markdown (CommonMark with GitHub tables): sources in fenced blocks,
/// results as math, inline code, Markdown tables (Betti tables with their totals row) or
/// fenced text, truncation notes as quotes. A fenced block is only ever at the top level —
/// never inside a list item, where renderers disagree about it — so lists of values and
/// the named objects that need blocks are written as headed paragraphs instead.
import { bettiGrid, bettiTotals, fieldTex, mathText, recordEntries, ringTex, TRUNCATED_BETTI } from "./tex";
import { notesOf, plainText, seriesPrefixText } from "./annotations";
import type { Transcript, TranscriptCell, ValueJsonLike } from "./transcript";

function fence(text: string, lang = ""): string {
  const longest = Math.max(2, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  const f = "`".repeat(longest + 1);
  return `${f}${lang}\n${text}\n${f}`;
}

/// Inline code that survives backticks inside the text.
function code(text: string): string {
  const longest = Math.max(0, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  const tick = "`".repeat(longest + 1);
  const pad = text.startsWith("`") || text.endsWith("`") ? " " : "";
  return `${tick}${pad}${text}${pad}${tick}`;
}

const cellText = (s: string) => s.replace(/\|/g, "\\|").replace(/\n/g, " ");

function bettiMarkdown(entries: [number, number, number][], complete: boolean): string {
  const { rows, cols, cell } = bettiGrid(entries);
  const out: string[] = [];
  if (rows.length === 0) out.push("All Betti numbers are zero.");
  else {
    out.push(`| j−i \\ i | ${cols.join(" | ")} |`, `|---|${cols.map(() => "---:").join("|")}|`);
    for (const r of rows) out.push(`| ${r} | ${cols.map((i) => cell(r, i) ?? "").join(" | ")} |`);
    out.push(`| total | ${bettiTotals(entries, cols).join(" | ")} |`);
  }
  if (!complete) out.push("", `> ${TRUNCATED_BETTI}`);
  return out.join("\n");
}

/// The value on one line (math or inline code), or null when it needs blocks.
function inlineMarkdown(v: ValueJsonLike): string | null {
  if (notesOf(v).length > 0) return null;
  switch (v.type) {
    case "Int":
    case "Rat":
    case "Poly":
      return `$${mathText(plainText(v))}$`;
    case "HilbertSeries":
      return `$${mathText(plainText(v))}$`;
    case "Series":
      return `$${mathText(seriesPrefixText(Array.isArray(v.coefficients) ? (v.coefficients as string[]) : []))}$`;
    case "Ideal": {
      const gens = Array.isArray(v.gens) ? (v.gens as string[]) : [];
      return gens.length === 0 ? "$\\langle 0 \\rangle$" : `$\\langle ${gens.map(mathText).join(", ")} \\rangle$`;
    }
    case "Field":
      return `$${fieldTex(v.text)}$`;
    case "Ring":
      return `$${ringTex(v)}$`;
    case "Bool":
    case "None":
      return v.text;
    case "BettiTable":
    case "Complex":
    case "List":
    case "Record":
    case "Table":
      return null;
    default:
      return v.text.includes("\n") ? null : code(v.text);
  }
}

function valueMarkdown(v: ValueJsonLike): string {
  const notes = notesOf(v)
    .map((n) => `\n\n> ${n.before}${n.math ? `$${mathText(n.math)}$` : ""}${n.after ?? ""}`)
    .join("");
  return valueBodyMarkdown(v) + notes;
}

function valueBodyMarkdown(v: ValueJsonLike): string {
  switch (v.type) {
    case "Series":
      return `$${mathText(seriesPrefixText(Array.isArray(v.coefficients) ? (v.coefficients as string[]) : []))}$`;
    case "BettiTable":
      return bettiMarkdown((v.entries as [number, number, number][]) ?? [], v.complete !== false);
    case "Complex":
      return `Free ranks ${((v.ranks as number[]) ?? []).join(", ")}.\n\n${bettiMarkdown((v.betti as [number, number, number][]) ?? [], v.complete !== false)}`;
    case "List": {
      const items = Array.isArray(v.items) ? (v.items as ValueJsonLike[]) : [];
      if (items.length === 0) return "(empty list)";
      const inlines = items.map(inlineMarkdown);
      if (inlines.every((x) => x !== null)) return inlines.map((x) => `- ${x}`).join("\n");
      return items.map((x, i) => `*Item ${i + 1}:*\n\n${valueMarkdown(x)}`).join("\n\n");
    }
    case "Record": {
      const entries = recordEntries(v);
      if (entries.length === 0) return "(empty record)";
      const inlines = entries.map(([, x]) => inlineMarkdown(x));
      if (inlines.every((x) => x !== null)) {
        return ["| field | value |", "|---|---|", ...entries.map(([k], i) => `| ${cellText(k)} | ${cellText(inlines[i]!)} |`)].join("\n");
      }
      return entries.map(([k, x]) => `*${k}:*\n\n${valueMarkdown(x)}`).join("\n\n");
    }
    case "Table": {
      const columns = Array.isArray(v.columns) ? (v.columns as string[]) : [];
      const rows = Array.isArray(v.rows) ? (v.rows as ValueJsonLike[][]) : [];
      if (columns.length === 0) return fence(v.text);
      return [
        `| ${columns.map(cellText).join(" | ")} |`,
        `|${columns.map(() => "---").join("|")}|`,
        ...rows.map((r) => `| ${r.map((x) => cellText(inlineMarkdown(x) ?? x.text)).join(" | ")} |`),
      ].join("\n");
    }
    default:
      // the notes are written under the body by valueMarkdown
      return inlineMarkdown({ ...v, note: undefined }) ?? fence(v.text);
  }
}

function cellMarkdown(cell: TranscriptCell, n: number): string {
  const parts = [`## Cell ${n}`, fence(cell.source, "ringside")];
  for (const r of cell.results) {
    const body = valueMarkdown(r.value);
    parts.push(body.includes("\n") ? `**Statement ${r.statement + 1}:**\n\n${body}` : `**Statement ${r.statement + 1}:** ${body}`);
  }
  if (cell.error) parts.push(`> **Error (${cell.error.kind ?? "error"}):** ${(cell.error.message ?? "").replace(/\n/g, " ")}`);
  if (cell.status === "cancelled" || cell.status === "interrupted") parts.push("> This cell was stopped before it finished.");
  return parts.join("\n\n");
}

export function transcriptToMarkdown(t: Transcript): string {
  const parts = [`# ${t.title}`, `*${t.ownerName} · exported from Ringside ${t.exportedAt.slice(0, 10)}*`];
  parts.push(...(t.cells.length === 0 ? ["*No cells.*"] : t.cells.map((c, i) => cellMarkdown(c, i + 1))));
  if (t.objects.length > 0) {
    parts.push("## Named objects");
    for (const o of t.objects) {
      parts.push(`### ${code(o.name)} (${o.type})\n\n${valueMarkdown(o.value)}`);
    }
  }
  return parts.join("\n\n") + "\n";
}
