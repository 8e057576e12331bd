"use client";
/// Exports of the table: CSV, JSON and a LaTeX tabular straight from the API (its caption
/// records family, seed, probe and engine version), and Markdown made here from the same
/// rows with the same record in a caption paragraph.
import { useState } from "react";
import { messageOf } from "@/app/_client/fetch";
import { buttonSecondary } from "@/app/_console/views/styles";
import { allRows, exportUrl } from "./api";
import { fileStem } from "./data/format";
import { rowsMarkdown } from "./data/markdown";
import { saveBlob } from "./plots/download";
import type { Experiment } from "./types";

const linkButton = buttonSecondary;

export function ExportMenu({ experiment, link }: { experiment: Experiment; link: string | null }) {
  const [problem, setProblem] = useState<string | null>(null);
  const stem = fileStem(experiment.title, experiment.id);
  const markdown = async () => {
    setProblem(null);
    try {
      const { rows, matched } = await allRows(experiment.id, link, Math.max(experiment.total, 1));
      if (rows.length < matched) throw new Error(`only ${rows.length} of ${matched} rows were read`);
      saveBlob(new Blob([rowsMarkdown(experiment, rows)], { type: "text/markdown" }), `${stem}.md`);
    } catch (e) {
      setProblem(`Markdown export failed: ${messageOf(e)}`);
    }
  };
  return (
    <details className="relative">
      <summary className={`${buttonSecondary} cursor-pointer list-none`}>Export</summary>
      <div
        className="absolute right-0 z-20 mt-1 flex w-60 flex-col gap-1 rounded-md border border-ink/20 bg-white p-2 shadow-lg dark:border-paper/20 dark:bg-night-panel"
        role="group"
        aria-label="Export the table"
      >
        <a className={linkButton} href={exportUrl(experiment.id, "csv", link)} download>
          Table as CSV
        </a>
        <a className={linkButton} href={exportUrl(experiment.id, "json", link)} download>
          Table as JSON
        </a>
        <button type="button" className={linkButton} onClick={() => void markdown()}>
          Table as Markdown
        </button>
        <a className={linkButton} href={exportUrl(experiment.id, "latex", link)} download>
          Table as LaTeX tabular
        </a>
        <p className="px-1 text-xs text-ink-soft dark:text-paper/70">Plots download from the Plots tab (SVG or PNG).</p>
        {problem && (
          <p role="alert" className="text-xs text-red-700 dark:text-red-300">
            {problem}
          </p>
        )}
      </div>
    </details>
  );
}
