"use client";
/// The guided first steps: each example with what it computes, why, and what to look
/// at; "Insert" puts its program into the input, ready to run.
import { EXPERIMENT_STEP, GUIDED_TOUR, type GuidedExample } from "@/lib/examples/tour";
import { buttonSecondary } from "./styles";

/// The tour as a list; `onInsert` receives the chosen example; `onRunExperiment`, when
/// given, runs the last step's sweep as an experiment and opens its plot.
export function TourList({
  onInsert,
  canRun,
  onRunExperiment,
}: {
  onInsert: (e: GuidedExample) => void;
  canRun: boolean;
  onRunExperiment?: (e: GuidedExample) => void;
}) {
  return (
    <ol className="flex flex-col gap-3" aria-label="Guided examples">
      {[...GUIDED_TOUR, EXPERIMENT_STEP].map((e) => (
        <li key={e.id} className="rounded-md border border-ink/10 bg-white/60 p-3 dark:border-paper/10 dark:bg-night-panel/60">
          <div className="flex items-start justify-between gap-3">
            <h3 className="font-semibold">{e.title}</h3>
            <span className="flex shrink-0 gap-1.5">
              {canRun && (
                <button type="button" className={buttonSecondary} onClick={() => onInsert(e)} aria-label={`Insert example: ${e.title}`}>
                  Insert
                </button>
              )}
              {e.id === EXPERIMENT_STEP.id && onRunExperiment && (
                <button
                  type="button"
                  className={buttonSecondary}
                  onClick={() => onRunExperiment(e)}
                  aria-label="Run the sweep as an experiment and show its plot"
                >
                  Run as an experiment
                </button>
              )}
            </span>
          </div>
          <pre className="mt-2 overflow-x-auto rounded bg-paper-deep/70 px-2 py-1 font-mono text-sm dark:bg-night">{e.source}</pre>
          <dl className="mt-2 grid grid-cols-[7rem_1fr] gap-x-2 gap-y-1 text-sm">
            <dt className="text-ink-soft dark:text-paper/60">Computes</dt>
            <dd>{e.computes}</dd>
            <dt className="text-ink-soft dark:text-paper/60">Why</dt>
            <dd>{e.why}</dd>
            <dt className="text-ink-soft dark:text-paper/60">Look at</dt>
            <dd>{e.lookAt}</dd>
          </dl>
        </li>
      ))}
    </ol>
  );
}

/// The welcome shown in an empty session.
export function EmptySessionWelcome({
  onInsert,
  onOpenTour,
  canRun,
}: {
  onInsert: (e: GuidedExample) => void;
  onOpenTour: () => void;
  canRun: boolean;
}) {
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-3 py-6">
      <h2 className="text-lg font-semibold">An empty session</h2>
      <p className="text-sm">
        New to Ringside? Walk through the first steps of the Saltmarsh Syzygy Circle, a small research group studying &ldquo;tideline
        ideals&rdquo;: products of neighbouring variables along a line.
        {canRun
          ? " Each example can be inserted into the input and run with Enter."
          : " This session is read-only for you, so the examples are there to read."}
      </p>
      <div>
        <button type="button" className={buttonSecondary} onClick={onOpenTour}>
          Open the guided first steps (Alt+G)
        </button>
      </div>
      {canRun && (
        <p className="text-sm">
          Or start with the first example:{" "}
          <button
            type="button"
            className="font-mono text-ink-soft underline dark:text-signal-soft"
            onClick={() => onInsert(GUIDED_TOUR[0])}
          >
            {GUIDED_TOUR[0].source}
          </button>
        </p>
      )}
    </div>
  );
}
