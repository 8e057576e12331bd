"use client";
/// Done/total as a bar, with the rate, the time left and the status in words.
import { formatEta, formatRate } from "./data/format";
import { isActive, type Experiment } from "./types";

export function ProgressBar({ experiment }: { experiment: Experiment }) {
  const { done, total } = experiment;
  const p = experiment.progress;
  const fraction = total === 0 ? 1 : done / total;
  const active = isActive(experiment.status);
  return (
    <div className="flex min-w-0 flex-1 flex-col gap-1">
      <div
        role="progressbar"
        aria-label="Members done"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${done} of ${total} members done`}
        className="relative h-2.5 overflow-hidden rounded bg-ink/10 dark:bg-paper/10"
      >
        <div
          className={`absolute inset-y-0 left-0 rounded ${experiment.failures ? "bg-signal" : "bg-ink-soft dark:bg-signal-soft"}`}
          style={{ width: `${Math.max(fraction * 100, done > 0 ? 1 : 0)}%` }}
        />
      </div>
      <p className="flex flex-wrap gap-x-4 text-sm text-ink-soft dark:text-paper/70" aria-live="polite" data-testid="progress-text">
        <span>
          <strong className="font-mono text-ink dark:text-paper" data-testid="progress-done">
            {done}/{total}
          </strong>{" "}
          done
        </span>
        <span>{experiment.failures} not ok</span>
        {active && <span>rate {formatRate(p.rate)}</span>}
        {active && <span>left: {formatEta(p.etaSeconds)}</span>}
        {experiment.status === "paused" && <span>paused: finished rows are kept; resume queues the rest</span>}
      </p>
    </div>
  );
}
