"use client";
/// Draws one §9 value for people: typeset algebra, Betti tables, chains of ranks,
/// series with their number of terms, lists, records and tables.
import { useState } from "react";
import type { ValueReading } from "@/lib/wire/reading";
import { detailOfValue } from "../render/detail";
import { typeWords } from "../render/type-words";
import { noteOfValue, viewOfValue, type ValueView as View, type ViewContext } from "../render/view-model";
import { BettiTable } from "./betti-table";
import { CopyMenu } from "./copy-menu";
import { Tex } from "./tex";
import { ValueDetail } from "./value-detail";

function Draw({ view, text }: { view: View; text: string }) {
  switch (view.kind) {
    case "tex":
      return <Tex tex={view.tex} label={text} />;
    case "betti":
      return <BettiTable grid={view.grid} />;
    case "complex":
      return <Resolution view={view} text={text} />;
    case "hilbert":
      return (
        <div className="flex flex-col gap-1" data-testid="hilbert-series">
          <span className="text-base">
            <Tex tex={view.tex} label={text} />
            {view.facts && view.facts.reduced !== text && (
              <>
                <span className="mx-2">=</span>
                <Tex tex={view.facts.reducedTex} label={view.facts.reduced} />
              </>
            )}
          </span>
          {view.facts && (
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
              <dt className="text-ink-soft dark:text-paper/70">h-vector</dt>
              <dd className="font-mono" data-testid="h-vector">
                ({view.facts.hVector.join(", ")})
              </dd>
              <dt className="text-ink-soft dark:text-paper/70">dimension</dt>
              <dd className="font-mono">{view.facts.dimension}</dd>
              <dt className="text-ink-soft dark:text-paper/70">degree</dt>
              <dd className="font-mono">{view.facts.degree.toString()}</dd>
              <dt className="text-ink-soft dark:text-paper/70">Hilbert polynomial</dt>
              <dd>
                <Tex tex={`P(n) = ${view.facts.polynomialTex}`} label={`P(n) = ${view.facts.polynomial}`} />
              </dd>
            </dl>
          )}
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

/// A free resolution: its free modules with their twists over the named ring, the Betti
/// table, and the differentials when asked for.
function Resolution({ view, text }: { view: Extract<View, { kind: "complex" }>; text: string }) {
  const [open, setOpen] = useState(false);
  const maps = view.resolution.differentials;
  return (
    <div className="flex flex-col gap-1" data-testid="resolution">
      <span className="text-base" data-testid="resolution-chain" data-plain={view.resolutionText}>
        <Tex tex={view.chain} label={view.resolutionText || text} />
      </span>
      <BettiTable grid={view.grid} />
      {maps && maps.length > 0 && (
        <div>
          <button
            type="button"
            className="text-xs text-ink-soft underline dark:text-paper/70"
            aria-expanded={open}
            onClick={() => setOpen((o) => !o)}
          >
            {open ? "Hide the differentials" : "Show the differentials"}
          </button>
          {open && (
            <ol className="mt-1 flex flex-col gap-2" data-testid="differentials">
              {maps.map((m, k) => (
                <li key={k} className="flex items-center gap-2 overflow-x-auto">
                  <Tex tex={`d_{${k + 1}} = ${m}`} label={`d${k + 1}`} />
                </li>
              ))}
            </ol>
          )}
        </div>
      )}
    </div>
  );
}

/// The value of one statement, with its type in words as a small label; a value stored as a
/// summary has the control that loads or downloads the whole of it (value-detail.tsx).
export function ValueView({ value, context, copyable = true }: { value: ValueReading; context?: ViewContext; copyable?: boolean }) {
  const marker = detailOfValue(value);
  return (
    <div className="group/value flex items-start gap-3" data-value-type={value.type}>
      <span className="mt-0.5 w-24 shrink-0 text-right text-xs tracking-wide text-ink/50 dark:text-paper/50" data-testid="type-tag">
        {typeWords(value.type)}
      </span>
      <div className="min-w-0 flex-1 overflow-x-auto">
        <Draw view={viewOfValue(value, context)} text={value.text} />
        {noteOfValue(value) && (
          <p className="mt-1 text-xs text-ink-soft dark:text-paper/70" data-testid="value-note">
            {noteOfValue(value)}
          </p>
        )}
        {marker && (
          <ValueDetail
            marker={marker}
            address={context?.detailAddress ? context.detailAddress(marker.id) : null}
            draw={(whole) => <ValueView value={whole} context={context} copyable={copyable} />}
          />
        )}
      </div>
      {copyable && <CopyMenu value={value} context={context} />}
    </div>
  );
}
