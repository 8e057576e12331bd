"use client";
/// Chips with the count of rows in each status; pressing one shows only that status (and
/// pressing more shows the union). Colours follow the console's cell statuses.
import { focusRing } from "@/app/_console/views/styles";
import { ROW_STATUSES, type RowStatus } from "./types";

export const ROW_STATUS_STYLE: Record<RowStatus, string> = {
  ok: "bg-ink/10 text-ink dark:bg-paper/10 dark:text-paper",
  error: "bg-red-100 text-red-800 dark:bg-red-900/50 dark:text-red-200",
  limit: "bg-signal-soft text-ink dark:bg-signal/30 dark:text-paper",
  cancelled: "bg-paper-deep text-ink-soft dark:bg-night-line dark:text-paper/70",
};

export function StatusChips({
  counts,
  chosen,
  onToggle,
}: {
  counts: Record<RowStatus, number>;
  chosen: ReadonlySet<RowStatus>;
  onToggle: (s: RowStatus) => void;
}) {
  return (
    <div role="group" aria-label="Rows by status" className="flex flex-wrap items-center gap-1.5">
      {ROW_STATUSES.map((s) => (
        <button
          key={s}
          type="button"
          aria-pressed={chosen.has(s)}
          onClick={() => onToggle(s)}
          data-testid={`chip-${s}`}
          title={chosen.has(s) ? `Stop showing only ${s} rows` : `Show only ${s} rows`}
          className={`rounded-full px-2.5 py-0.5 text-xs font-medium ${ROW_STATUS_STYLE[s]} ${chosen.has(s) ? "ring-2 ring-signal" : ""} ${focusRing}`}
        >
          {s} <span className="font-mono">{counts[s]}</span>
        </button>
      ))}
    </div>
  );
}

export function RowStatusBadge({ status }: { status: RowStatus }) {
  return <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${ROW_STATUS_STYLE[status]}`}>{status}</span>;
}
