/// A transcript as a LaTeX document: each cell's source verbatim, each result typeset
/// (lib/export/tex.ts), errors and truncation notes kept, then the named objects.
import { escapeTex, valueTex } from "./tex";
import type { Transcript, TranscriptCell } from "./transcript";

function verbatim(source: string): string {
  // A source line that would end the environment early is broken up.
  return `\\begin{verbatim}\n${source.replace(/\\end\{verbatim\}/g, "\\end {verbatim}")}\n\\end{verbatim}`;
}

function cellTex(cell: TranscriptCell, n: number): string {
  const parts = [`\\subsection*{Cell ${n}}`, verbatim(cell.source)];
  for (const r of cell.results) parts.push(`\\noindent\\textit{Statement ${r.statement + 1}:}\\quad ${valueTex(r.value)}`);
  if (cell.error) {
    parts.push(`\\noindent\\textbf{Error (${escapeTex(cell.error.kind ?? "error")}):} ${escapeTex(cell.error.message ?? "")}`);
  }
  if (cell.status === "cancelled" || cell.status === "interrupted")
    parts.push("\\noindent\\emph{This cell was stopped before it finished.}");
  return parts.join("\n\n");
}

export function transcriptToLatex(t: Transcript): string {
  const objects = t.objects.map((o) => `\\item[\\texttt{${escapeTex(o.name)}}] (${escapeTex(o.type)}) ${valueTex(o.value)}`);
  return [
    "\\documentclass{article}",
    "\\usepackage[utf8]{inputenc}",
    "\\usepackage{amsmath,amssymb}",
    `\\title{${escapeTex(t.title)}}`,
    `\\author{${escapeTex(t.ownerName)}}`,
    `\\date{Exported from Ringside, ${escapeTex(t.exportedAt.slice(0, 10))}}`,
    "\\begin{document}",
    "\\maketitle",
    "\\section*{Transcript}",
    ...(t.cells.length === 0 ? ["\\emph{No cells.}"] : t.cells.map((c, i) => cellTex(c, i + 1))),
    ...(objects.length > 0 ? ["\\section*{Named objects}", "\\begin{description}", ...objects, "\\end{description}"] : []),
    "\\end{document}",
    "",
  ].join("\n\n");
}
