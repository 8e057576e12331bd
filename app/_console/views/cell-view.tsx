"use client";
/// One transcript cell: source, status, time taken and results; while it runs, a
/// progress bar with the stage, the Betti columns computed so far and a Cancel button.
import type { ReactNode } from "react";
import { resultIndex, type Cell, type CellStatus } from "@/lib/wire/reading";
import { bettiGrid } from "../render/betti";
import type { ViewContext } from "../render/view-model";
import { overallFraction, type RunningCell } from "../state/running-cell";
import { BettiTable } from "./betti-table";
import { ErrorView } from "./error-view";
import { ValueView } from "./value-view";
import { buttonSecondary } from "./styles";

const STATUS_STYLE: Record<CellStatus, string> = {
  running: "bg-signal-soft text-ink dark:bg-signal/30 dark:text-paper",
  done: "bg-ink/10 text-ink dark:bg-paper/10 dark:text-paper",
  error: "bg-red-100 text-red-800 dark:bg-red-900/50 dark:text-red-200",
  cancelled: "bg-paper-deep text-ink-soft dark:bg-night-line dark:text-paper/70",
  interrupted: "bg-paper-deep text-ink-soft dark:bg-night-line dark:text-paper/70",
};

/// "0.42 s", "12 ms", "3 min 05 s".
export function formatDuration(ms: number): string {
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(ms < 10_000 ? 2 : 1)} s`;
  const s = Math.round(ms / 1000);
  return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, "0")} s`;
}

/// Who ran a cell, as the API reports it (null for cells from before authors were kept).
type Author = { readonly id: string; readonly name: string } | null | undefined;

function Header({ position, status, ms, author }: { position: number | null; status: CellStatus; ms: number | null; author?: Author }) {
  return (
    <div className="flex flex-wrap items-center gap-2 text-xs">
      <span className="font-mono text-ink/50 dark:text-paper/50">{position === null ? "…" : `[${position + 1}]`}</span>
      <span className={`rounded px-1.5 py-0.5 font-medium ${STATUS_STYLE[status]}`} data-testid="cell-status">
        {status}
      </span>
      {ms !== null && <span className="text-ink/60 dark:text-paper/60">{formatDuration(ms)}</span>}
      {author && (
        <span className="text-ink/60 dark:text-paper/60" data-testid="cell-author">
          run by {author.name || "a former member"}
        </span>
      )}
    </div>
  );
}

function Source({ source }: { source: string }) {
  return (
    <pre className="overflow-x-auto whitespace-pre-wrap rounded bg-paper-deep/70 px-3 py-1.5 font-mono text-sm dark:bg-night">{source}</pre>
  );
}

/// A finished (or stored) cell; `footer` is drawn under its results (the experiments room
/// puts its links there); `context` lets values name their ring (render/view-model).
export function CellView({ cell, footer, context }: { cell: Cell; footer?: ReactNode; context?: ViewContext }) {
  return (
    <article
      aria-label={`Cell ${cell.position + 1}`}
      className="rs-cell flex flex-col gap-2 border-b border-ink/10 py-3 dark:border-paper/10"
    >
      <Header
        position={cell.position}
        status={cell.status}
        ms={cell.timings?.totalMs ?? null}
        author={(cell as Cell & { author?: Author }).author}
      />
      <Source source={cell.source} />
      {cell.results.map((r, k) => (
        <ValueView key={resultIndex(r, k)} value={r.value} context={context} />
      ))}
      {cell.stopped ? (
        <p className="text-sm text-ink-soft dark:text-paper/70" data-testid="cell-stopped">
          {cell.stopped}
        </p>
      ) : (
        cell.error && <ErrorView error={cell.error} source={cell.source} />
      )}
      {cell.status === "running" && <p className="text-sm text-ink-soft dark:text-paper/70">Still running elsewhere.</p>}
      {footer}
    </article>
  );
}

/// The cell being run from this page, drawn from its streamed state.
export function RunningCellView({ cell, onCancel, context }: { cell: RunningCell; onCancel: () => void; context?: ViewContext }) {
  const fraction = overallFraction(cell);
  const running = cell.status === "running";
  const stage = cell.stage === null ? "sending" : cell.stage === "checked" ? "checked, starting" : cell.stage;
  return (
    <article
      aria-label="Running cell"
      aria-busy={running}
      className="rs-cell flex flex-col gap-2 border-b border-ink/10 py-3 dark:border-paper/10"
    >
      <Header position={cell.position} status={cell.status} ms={cell.totalMs} />
      <Source source={cell.source} />
      {cell.results.map((r, k) => (
        <ValueView key={resultIndex(r, k)} value={r.value} context={context} />
      ))}
      {running && (
        <div className="flex flex-col gap-1">
          <div className="flex items-center gap-3">
            <div
              role="progressbar"
              aria-label="Cell progress"
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={fraction === null ? undefined : Math.round(fraction * 100)}
              aria-valuetext={stage}
              className="relative h-2 flex-1 overflow-hidden rounded bg-ink/10 dark:bg-paper/10"
            >
              <div
                className={`absolute inset-y-0 left-0 rounded bg-signal ${fraction === null ? "w-1/3 animate-pulse" : ""}`}
                style={fraction === null ? undefined : { width: `${Math.max(fraction * 100, 2)}%` }}
              />
            </div>
            <button type="button" onClick={onCancel} disabled={cell.cancelRequested} className={buttonSecondary}>
              {cell.cancelRequested ? "Cancelling…" : "Cancel"}
            </button>
          </div>
          <p className="text-sm text-ink-soft dark:text-paper/70" aria-live="polite" data-testid="cell-stage">
            {cell.statements !== null && cell.statement !== null ? `statement ${cell.statement + 1} of ${cell.statements}: ` : ""}
            {stage}
            {cell.detail ? ` — ${cell.detail}` : ""}
          </p>
          {cell.partialBetti.length > 0 && <BettiTable grid={bettiGrid(cell.partialBetti, false)} partial />}
        </div>
      )}
      {cell.error && <ErrorView error={cell.error} source={cell.source} />}
    </article>
  );
}
