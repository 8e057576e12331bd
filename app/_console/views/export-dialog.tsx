"use client";
/// The export dialog: which cells (all finished ones by default; error and stopped cells
/// can be left out at once), and the format; the download holds just those cells
/// (GET /api/sessions/:id/export?cells=…&skipErrors=1).
import { useMemo, useState } from "react";
import { errorOf, messageOf } from "@/app/_client/fetch";
import { exportUrl, type ExportFormat } from "../api/client";
import type { Cell } from "@/lib/wire/reading";
import { buttonPrimary, buttonQuiet } from "./styles";

const LABEL: Record<ExportFormat, string> = { latex: "LaTeX", markdown: "Markdown", json: "JSON" };
const EXT: Record<ExportFormat, string> = { latex: "tex", markdown: "md", json: "json" };

/// The file name the server suggests (Content-Disposition), else `fallback`.
function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get("content-disposition") ?? "");
  return m?.[1] ?? fallback;
}

export interface ExportDialogProps {
  readonly sessionId: string;
  readonly link: string | null;
  readonly cells: readonly Cell[];
  readonly onDone: (notice: string) => void;
}

export function ExportPanel({ sessionId, link, cells, onDone }: ExportDialogProps) {
  const finished = useMemo(() => cells.filter((c) => c.status !== "running"), [cells]);
  const [format, setFormat] = useState<ExportFormat>("markdown");
  const [skipErrors, setSkipErrors] = useState(true);
  const [chosen, setChosen] = useState<ReadonlySet<number>>(() => new Set(finished.map((c) => c.position)));
  const [problem, setProblem] = useState<string | null>(null);
  const isError = (c: Cell) => c.status === "error" || c.status === "cancelled";
  const included = finished.filter((c) => chosen.has(c.position) && !(skipErrors && isError(c)));

  const download = async () => {
    if (included.length === 0) return setProblem("Choose at least one cell.");
    setProblem(null);
    const all = included.length === finished.length;
    const query = all ? "" : `&cells=${included.map((c) => c.position).join(",")}`;
    try {
      const res = await fetch(exportUrl(sessionId, format, link) + query + (skipErrors ? "&skipErrors=1" : ""));
      if (!res.ok) return setProblem(`Export failed: ${(await errorOf(res)).message}`);
      const blob = await res.blob();
      const a = document.createElement("a");
      a.href = URL.createObjectURL(blob);
      a.download = fileNameOf(res, `transcript.${EXT[format]}`);
      a.click();
      URL.revokeObjectURL(a.href);
      onDone(`Exported ${included.length} cell${included.length === 1 ? "" : "s"} as ${LABEL[format]} (${a.download}).`);
    } catch (e) {
      setProblem(`Export failed: ${messageOf(e)}`);
    }
  };

  const toggle = (p: number) =>
    setChosen((old) => {
      const next = new Set(old);
      if (next.has(p)) next.delete(p);
      else next.add(p);
      return next;
    });

  return (
    <div className="flex flex-col gap-3 text-sm">
      <fieldset className="flex flex-wrap gap-4">
        <legend className="sr-only">Format</legend>
        {(Object.keys(LABEL) as ExportFormat[]).map((f) => (
          <label key={f} className="flex items-center gap-1">
            <input type="radio" name="export-format" checked={format === f} onChange={() => setFormat(f)} /> {LABEL[f]}
          </label>
        ))}
      </fieldset>
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={skipErrors} onChange={(e) => setSkipErrors(e.target.checked)} /> Leave out cells that ended in an
        error or were stopped
      </label>
      <div className="flex items-center gap-2">
        <span className="font-medium">Cells</span>
        <button type="button" className={buttonQuiet} onClick={() => setChosen(new Set(finished.map((c) => c.position)))}>
          all
        </button>
        <button type="button" className={buttonQuiet} onClick={() => setChosen(new Set())}>
          none
        </button>
      </div>
      <ul aria-label="Cells to export" className="max-h-64 overflow-y-auto rounded-md border border-ink/10 dark:border-paper/10">
        {finished.map((c) => {
          const off = skipErrors && isError(c);
          return (
            <li key={c.id} className={`flex items-start gap-2 px-2 py-1 ${off ? "opacity-50" : ""}`}>
              <input
                type="checkbox"
                id={`export-cell-${c.position}`}
                aria-label={`Cell ${c.position + 1}`}
                checked={chosen.has(c.position) && !off}
                disabled={off}
                onChange={() => toggle(c.position)}
              />
              <label htmlFor={`export-cell-${c.position}`} className="min-w-0 flex-1">
                <span className="font-mono text-xs text-ink/50 dark:text-paper/50">[{c.position + 1}]</span>{" "}
                <span className="font-mono">{c.source.split("\n")[0]}</span>
                {isError(c) && <span className="ml-2 text-xs text-red-700 dark:text-red-300">{c.status}</span>}
              </label>
            </li>
          );
        })}
      </ul>
      {problem && (
        <p role="alert" className="text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
      <button type="button" className={`${buttonPrimary} self-start`} onClick={() => void download()}>
        Download {included.length} cell{included.length === 1 ? "" : "s"} as {LABEL[format]}
      </button>
    </div>
  );
}
