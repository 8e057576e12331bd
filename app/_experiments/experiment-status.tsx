/// The experiment's status as a small badge, in the colours of the console's cell statuses.
import type { ExperimentStatus } from "./types";

const STYLE: Record<ExperimentStatus, string> = {
  queued: "bg-paper-deep text-ink dark:bg-night-line dark:text-paper",
  running: "bg-signal-soft text-ink dark:bg-signal/30 dark:text-paper",
  paused: "bg-paper-deep text-ink-soft ring-1 ring-signal dark:bg-night-line dark:text-paper/80",
  done: "bg-ink/10 text-ink dark:bg-paper/10 dark:text-paper",
  cancelled: "bg-paper-deep text-ink-soft dark:bg-night-line dark:text-paper/70",
};

export function ExperimentStatusBadge({ status }: { status: ExperimentStatus }) {
  return (
    <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${STYLE[status]}`} data-testid="experiment-status">
      {status}
    </span>
  );
}
