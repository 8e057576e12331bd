"use client";
/// Draws one §9 value for people: typeset algebra, Betti tables, chains of ranks,
/// series with their number of terms, lists, records and tables.
import type { ValueReading } from "@/lib/wire/reading";
import { noteOfValue, viewOfValue, type ValueView as View } from "../render/view-model";
import { BettiTable } from "./betti-table";
import { Tex } from "./tex";

function Draw({ view, text }: { view: View; text: string }) {
  switch (view.kind) {
    case "tex":
      return <Tex tex={view.tex} label={text} />;
    case "betti":
      return <BettiTable grid={view.grid} />;
    case "complex":
      return (
        <div className="flex flex-col gap-1">
          <Tex tex={view.chain} label={text} />
          <BettiTable grid={view.grid} />
        </div>
      );
    case "series":
      return (
        <span>
          <Tex tex={view.tex} label={text} />
          <span className="ml-3 text-xs text-ink-soft dark:text-paper/70">{view.note}</span>
        </span>
      );
    case "text":
      return <span className="whitespace-pre-wrap font-mono">{view.text}</span>;
    case "list":
      return (
        <span>
          [
          {view.items.map((item, i) => (
            <span key={i}>
              {i > 0 && ", "}
              <Draw view={item} text="" />
            </span>
          ))}
          ]
        </span>
      );
    case "record":
      return (
        <dl className="grid grid-cols-[auto_1fr] gap-x-3">
          {view.fields.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="font-mono text-ink-soft dark:text-paper/70">{k}</dt>
              <dd>
                <Draw view={v} text="" />
              </dd>
            </div>
          ))}
        </dl>
      );
    case "table":
      return (
        <table className="border-collapse font-mono text-sm">
          <thead>
            <tr>
              {view.columns.map((c) => (
                <th key={c} scope="col" className="border-b border-ink/20 px-2 text-left dark:border-paper/20">
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {view.rows.map((r, i) => (
              <tr key={i}>
                {r.map((c, j) => (
                  <td key={j} className="px-2">
                    {c}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      );
  }
}

/// The value of one statement, with its type as a small label.
export function ValueView({ value }: { value: ValueReading }) {
  return (
    <div className="flex items-start gap-3" data-value-type={value.type}>
      <span className="mt-0.5 w-24 shrink-0 text-right text-xs uppercase tracking-wide text-ink/50 dark:text-paper/50">
        {value.type}
      </span>
      <div className="min-w-0 overflow-x-auto">
        <Draw view={viewOfValue(value)} text={value.text} />
        {noteOfValue(value) && (
          <p className="mt-1 text-xs text-ink-soft dark:text-paper/70" data-testid="value-note">
            {noteOfValue(value)}
          </p>
        )}
      </div>
    </div>
  );
}
