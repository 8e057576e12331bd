/// The API's JSON shapes for experiments (documented in app/api/README.md), and the exports
/// of their rows as CSV, JSON and a LaTeX tabular.
import { escapeTex } from "@/lib/export/tex";
import { FIXED_COLUMNS, type Experiment, type ExperimentRowView } from "@/lib/wire/experiments";
import type { ValueJson } from "@/lib/wire/values";
import type { ExperimentRow, Progress, StoredRow } from "./store";

export { FIXED_COLUMNS };
export type ExperimentView = Experiment;
export type RowView = ExperimentRowView;

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

export const probeColumns = (e: ExperimentRow): string[] => (e.columns as string[] | null) ?? [];

export function experimentView(e: ExperimentRow, progress: Progress): ExperimentView {
  return {
    id: e.id,
    sessionId: e.sessionId,
    title: e.title,
    status: e.status,
    done: progress.done,
    total: e.total,
    failures: progress.failures,
    progress,
    columns: [...FIXED_COLUMNS, ...probeColumns(e)],
    program: e.program,
    familyDefinition: e.familyDefinition,
    probe: e.probeText,
    engineVersion: e.engineVersion,
    limits: e.limits as ExperimentView["limits"],
    sourceCellId: e.sourceCellId,
    uploadId: e.uploadId,
    rerunOf: e.rerunOf,
    createdAt: iso(e.createdAt)!,
    startedAt: iso(e.startedAt),
    finishedAt: iso(e.finishedAt),
  };
}

export function rowView(e: ExperimentRow, r: StoredRow): RowView {
  return {
    index: r.memberIndex,
    label: (e.labels as string[])[r.memberIndex] ?? "",
    status: r.status,
    seconds: r.durationMs / 1000,
    fields: r.fields as Record<string, ValueJson>,
    message: r.message,
    worker: r.worker,
    finishedAt: iso(r.finishedAt)!,
  };
}

const textOf = (v: unknown): string => (v && typeof v === "object" && "text" in v ? String((v as { text: unknown }).text) : "");

/// Export columns: the §11 columns, then message and worker.
function exportColumns(e: ExperimentRow): string[] {
  return [...FIXED_COLUMNS, ...probeColumns(e), "message", "worker"];
}

function cellsOf(e: ExperimentRow, r: RowView): string[] {
  return [
    String(r.index),
    r.label,
    r.status,
    r.seconds.toFixed(3),
    ...probeColumns(e).map((c) => textOf(r.fields[c])),
    r.message ?? "",
    r.worker,
  ];
}

/// RFC 4180 CSV (common practice): quote every field holding a comma, quote or line break.
export function rowsCsv(e: ExperimentRow, rows: RowView[]): string {
  const q = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  return [exportColumns(e), ...rows.map((r) => cellsOf(e, r))].map((line) => line.map(q).join(",")).join("\r\n") + "\r\n";
}

/// The experiment's record and its rows as a §11 Table (rows of §9 values in column order).
export function rowsJson(e: ExperimentRow, view: ExperimentView, rows: RowView[]) {
  const str = (s: string) => ({ type: "Str", text: s, value: s });
  const columns = [...FIXED_COLUMNS, ...probeColumns(e)];
  return {
    experiment: view,
    table: {
      type: "Table",
      text: `${view.title}: ${rows.length} rows`,
      columns,
      rows: rows.map((r) => [
        { type: "Int", text: String(r.index), value: String(r.index) },
        str(r.label),
        str(r.status),
        { type: "Rat", text: `${Math.round(r.seconds * 1000)}/1000`, value: `${Math.round(r.seconds * 1000)}/1000` },
        ...probeColumns(e).map((c) => r.fields[c] ?? { type: "None", text: "none" }),
      ]),
    },
    rows,
  };
}

/// A LaTeX tabular in a table environment; the caption names the family (with its seed), the
/// probe and the engine version, so a printed table says how to reproduce it.
export function rowsLatex(e: ExperimentRow, rows: RowView[]): string {
  const cols = [...FIXED_COLUMNS, ...probeColumns(e)];
  const header = cols.map((c) => `\\textbf{${escapeTex(c)}}`).join(" & ");
  const body = rows.map(
    (r) =>
      cellsOf(e, r)
        .slice(0, cols.length)
        .map((c, i) => (i === 1 ? `\\texttt{${escapeTex(c)}}` : escapeTex(c)))
        .join(" & ") + " \\\\",
  );
  const failed = rows.filter((r) => r.status !== "ok").length;
  return [
    "\\begin{table}[ht]",
    "\\centering",
    `\\begin{tabular}{${"r".repeat(1)}l${"l".repeat(cols.length - 2)}}`,
    "\\hline",
    `${header} \\\\`,
    "\\hline",
    ...body,
    "\\hline",
    "\\end{tabular}",
    `\\caption{${escapeTex(`Family: ${e.familyDefinition}. Probe: ${e.probeText}. Engine: ${e.engineVersion}. ${rows.length} of ${e.total} members${failed ? `, ${failed} not ok` : ""}.`)}}`,
    "\\end{table}",
    "",
  ].join("\n");
}
