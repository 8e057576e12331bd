"use client";
/// A Betti table as an HTML table: a column per homological degree, a row per internal
/// degree minus homological degree, blank zeros, and a totals row.
import type { BettiGrid } from "../render/betti";

/// Renders a laid-out Betti grid; `partial` marks a table still being computed.
export function BettiTable({ grid, partial = false }: { grid: BettiGrid; partial?: boolean }) {
  const marks = [grid.truncated && !partial ? "truncated" : null, partial ? "so far" : null].filter(Boolean);
  return (
    <table className="rs-betti my-1 border-collapse font-mono text-sm tabular-nums">
      <caption className="caption-top pb-1 text-left font-sans text-xs font-semibold uppercase tracking-wide text-ink-soft dark:text-paper/70">
        Betti table
        {marks.map((m) => (
          <span key={m} className="ml-2 rounded bg-signal-soft px-1.5 py-0.5 normal-case text-ink dark:bg-signal/30 dark:text-paper">
            {m}
          </span>
        ))}
      </caption>
      <thead>
        <tr>
          <th
            scope="col"
            className="border-b border-ink/20 px-2 text-right font-normal text-ink/50 dark:border-paper/20 dark:text-paper/50"
          >
            <span className="sr-only">j − i \ i</span>
          </th>
          {grid.columns.map((i) => (
            <th key={i} scope="col" className="border-b border-ink/20 px-3 text-right font-semibold dark:border-paper/20">
              {i}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {grid.rows.map((row) => (
          <tr key={row.shift}>
            <th scope="row" className="border-r border-ink/20 px-2 text-right font-semibold dark:border-paper/20">
              {row.shift}
            </th>
            {row.cells.map((b, i) => (
              <td key={i} className="px-3 text-right">
                {b ?? ""}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <th
            scope="row"
            className="border-r border-t border-ink/20 px-2 text-right font-normal text-ink-soft dark:border-paper/20 dark:text-paper/70"
          >
            total
          </th>
          {grid.totals.map((t, i) => (
            <td key={i} className="border-t border-ink/20 px-3 text-right font-semibold dark:border-paper/20">
              {t}
            </td>
          ))}
        </tr>
      </tfoot>
    </table>
  );
}
