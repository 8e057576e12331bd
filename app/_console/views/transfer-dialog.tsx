"use client";
/// Export the transcript (LaTeX, Markdown or our JSON) as a download, and import a session
/// from a JSON export file into a new session of mine.
import { useState } from "react";
import type { ExportFormat } from "../api/client";
import { buttonSecondary, panelHeading } from "./styles";

const FORMATS: readonly { format: ExportFormat; label: string; note: string }[] = [
  { format: "latex", label: "LaTeX", note: "a document: Betti tables as tabular, ideals and polynomials in math mode" },
  { format: "markdown", label: "Markdown", note: "the inputs and results as text, for notes and mail" },
  { format: "json", label: "JSON", note: "everything, to import into Ringside again" },
];

export interface TransferProps {
  /// false when no session is open (only import is offered)
  readonly canExport: boolean;
  /// signed-out link visitors have no sessions of their own to import into
  readonly canImport: boolean;
  readonly onExport: (format: ExportFormat) => Promise<void>;
  readonly onImport: (fileText: string, fileName: string) => Promise<string | null>;
  /// opens the export of chosen cells (error cells left out)
  readonly onChooseCells?: () => void;
}

/// The export buttons and the import file picker (rendered inside a Modal).
export function TransferPanel({ canExport, canImport, onExport, onImport, onChooseCells }: TransferProps) {
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      {canExport && (
        <section aria-label="Export the transcript" className="flex flex-col gap-2">
          <h3 className={panelHeading}>Export the transcript</h3>
          <ul className="flex flex-col gap-1.5">
            {FORMATS.map((f) => (
              <li key={f.format} className="flex items-center gap-3">
                <button type="button" className={`${buttonSecondary} w-28 justify-center`} onClick={() => void onExport(f.format)}>
                  {f.label}
                </button>
                <span className="text-xs text-ink/60 dark:text-paper/60">{f.note}</span>
              </li>
            ))}
          </ul>
          {onChooseCells && (
            <button type="button" className={`${buttonSecondary} self-start`} onClick={onChooseCells}>
              Choose cells, leave out errors…
            </button>
          )}
        </section>
      )}
      {canImport && (
        <section aria-label="Import a session" className="flex flex-col gap-2">
          <h3 className={panelHeading}>Import a session</h3>
          <label className="text-sm">
            A JSON export file (a new session of yours is made from it)
            <input
              type="file"
              accept="application/json,.json"
              disabled={busy}
              className="mt-1 block w-full text-sm file:mr-3 file:rounded-md file:border file:border-ink/20 file:bg-white file:px-3 file:py-1 dark:file:bg-night-panel dark:file:text-paper"
              onChange={async (e) => {
                const file = e.currentTarget.files?.[0];
                e.currentTarget.value = "";
                if (!file) return;
                setBusy(true);
                setProblem(null);
                setProblem(await onImport(await file.text(), file.name));
                setBusy(false);
              }}
            />
          </label>
          {problem && (
            <p role="alert" className="text-sm text-red-700 dark:text-red-300">
              {problem}
            </p>
          )}
        </section>
      )}
    </div>
  );
}
