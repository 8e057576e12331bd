/// A transcript as Markdown: sources in fenced blocks, results as their text, Betti tables
/// as Markdown tables, polynomials and ideals in `$…$` math, truncation notes as quotes.
import { bettiGrid, mathText, TRUNCATED_BETTI } from "./tex";
import { notesOf, plainText, seriesPrefixText } from "./annotations";
import type { Transcript, TranscriptCell, ValueJsonLike } from "./transcript";

function fence(text: string, lang = ""): string {
  const longest = Math.max(2, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  const f = "`".repeat(longest + 1);
  return `${f}${lang}\n${text}\n${f}`;
}

function bettiMarkdown(entries: [number, number, number][], complete: boolean): string {
  const { rows, cols, cell } = bettiGrid(entries);
  const out: string[] = [];
  if (rows.length === 0) out.push("All Betti numbers are zero.");
  else {
    out.push(`| j−i \\ i | ${cols.join(" | ")} |`, `|---|${cols.map(() => "---:").join("|")}|`);
    for (const r of rows) out.push(`| ${r} | ${cols.map((i) => cell(r, i) ?? "").join(" | ")} |`);
  }
  if (!complete) out.push("", `> ${TRUNCATED_BETTI}`);
  return out.join("\n");
}

function valueMarkdown(v: ValueJsonLike): string {
  const notes = notesOf(v)
    .map((n) => `\n\n> ${n.before}${n.math ? `$${mathText(n.math)}$` : ""}${n.after ?? ""}`)
    .join("");
  return valueBodyMarkdown(v) + notes;
}

function valueBodyMarkdown(v: ValueJsonLike): string {
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
    case "BettiTable":
      return bettiMarkdown((v.entries as [number, number, number][]) ?? [], v.complete !== false);
    case "Complex":
      return `free ranks ${((v.ranks as number[]) ?? []).join(", ")}\n\n${bettiMarkdown((v.betti as [number, number, number][]) ?? [], v.complete !== false)}`;
    case "List":
      return Array.isArray(v.items) && v.items.length > 0
        ? (v.items as ValueJsonLike[]).map((x) => `- ${valueMarkdown(x).replace(/\n/g, "\n  ")}`).join("\n")
        : "(empty list)";
    default:
      return fence(v.text);
  }
}

function cellMarkdown(cell: TranscriptCell, n: number): string {
  const parts = [`## Cell ${n}`, fence(cell.source, "ringside")];
  for (const r of cell.results) parts.push(`**Statement ${r.statement + 1}:** ${valueMarkdown(r.value).includes("\n") ? "\n\n" : ""}${valueMarkdown(r.value)}`);
  if (cell.error) parts.push(`> **Error (${cell.error.kind ?? "error"}):** ${(cell.error.message ?? "").replace(/\n/g, " ")}`);
  if (cell.status === "cancelled") parts.push("> This cell was stopped before it finished.");
  return parts.join("\n\n");
}

export function transcriptToMarkdown(t: Transcript): string {
  const parts = [`# ${t.title}`, `*${t.ownerName} · exported from Ringside ${t.exportedAt.slice(0, 10)}*`];
  parts.push(...(t.cells.length === 0 ? ["*No cells.*"] : t.cells.map((c, i) => cellMarkdown(c, i + 1))));
  if (t.objects.length > 0) {
    parts.push("## Named objects", ...t.objects.map((o) => `- \`${o.name}\` (${o.type}): ${valueMarkdown(o.value).replace(/\n/g, "\n  ")}`));
  }
  return parts.join("\n\n") + "\n";
}
