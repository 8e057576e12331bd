"use client";
/// The Plots tab: choose a kind and its columns; the plot redraws as rows arrive and
/// downloads as SVG or PNG.
import { useEffect, useMemo, useRef, useState } from "react";
import { messageOf } from "@/app/_client/fetch";
import { buttonSecondary, panelHeading } from "@/app/_console/views/styles";
import { bettiColumns, numericColumns } from "../data/cells";
import type { Row } from "../types";
import { BettiHeatMap, Histogram, Scatter } from "./charts";
import { downloadPng, downloadSvg } from "./download";
import { usePlotPalette } from "./palette";

export type PlotKind = "histogram" | "scatter" | "series" | "heat";
const KINDS: [PlotKind, string][] = [
  ["histogram", "Histogram of a column"],
  ["scatter", "Scatter of two columns"],
  ["series", "A column against the index or a parameter"],
  ["heat", "Heat map of graded Betti numbers"],
];

const selectClass =
  "rounded-md border border-ink/20 bg-white px-2 py-1 text-sm text-ink focus-visible:outline focus-visible:outline-2 focus-visible:outline-signal dark:border-paper/20 dark:bg-night dark:text-paper";

function Pick({
  label,
  value,
  options,
  onChange,
  allowNone,
}: {
  label: string;
  value: string | null;
  options: string[];
  onChange: (v: string | null) => void;
  allowNone?: boolean;
}) {
  return (
    <label className="flex items-center gap-1.5 text-sm">
      <span className="text-ink-soft dark:text-paper/70">{label}</span>
      <select className={selectClass} value={value ?? ""} onChange={(e) => onChange(e.target.value || null)} aria-label={label}>
        {allowNone && <option value="">none</option>}
        {options.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
    </label>
  );
}

export function PlotPanel({
  rows,
  columns,
  fileStem,
  truncatedTo,
  initialKind,
}: {
  rows: Row[];
  columns: readonly string[];
  fileStem: string;
  truncatedTo: number | null;
  initialKind?: PlotKind;
}) {
  const palette = usePlotPalette();
  const numeric = useMemo(() => numericColumns(columns, rows), [columns, rows]);
  const betti = useMemo(() => bettiColumns(columns, rows), [columns, rows]);
  const probeNumeric = numeric.filter((c) => c !== "index" && c !== "seconds");
  const [kind, setKind] = useState<PlotKind>(initialKind ?? (betti.length > 0 ? "heat" : "histogram"));
  const [col, setCol] = useState<string | null>(null);
  const [x, setX] = useState<string | null>(null);
  const [y, setY] = useState<string | null>(null);
  const [colour, setColour] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const svg = useRef<SVGSVGElement>(null);

  // sensible first choices once the probe's columns are known
  const first = probeNumeric[0] ?? numeric[0] ?? null;
  useEffect(() => {
    if (col === null && first) setCol(first);
    if (y === null && first) setY(first);
    if (x === null && (probeNumeric[1] ?? first)) setX(probeNumeric[1] ?? first);
  }, [first, col, x, y, probeNumeric]);
  const heatColumn = betti[0] ?? null;
  const [heatCol, setHeatCol] = useState<string | null>(null);

  const body = (() => {
    if (rows.length === 0)
      return <p className="p-6 text-sm text-ink-soft dark:text-paper/70">No rows yet: the plot appears with the first rows.</p>;
    switch (kind) {
      case "histogram":
        return col ? <Histogram rows={rows} column={col} palette={palette} svgRef={svg} /> : <NoColumn />;
      case "scatter":
        return x && y ? <Scatter rows={rows} x={x} y={y} colour={colour} palette={palette} svgRef={svg} /> : <NoColumn />;
      case "series":
        return y ? (
          <Scatter rows={rows} x={x && x !== y ? x : "index"} y={y} colour={null} palette={palette} svgRef={svg} line />
        ) : (
          <NoColumn />
        );
      case "heat":
        return (heatCol ?? heatColumn) ? (
          <BettiHeatMap rows={rows} column={(heatCol ?? heatColumn)!} palette={palette} svgRef={svg} />
        ) : (
          <p className="p-6 text-sm text-ink-soft dark:text-paper/70">
            No column holds Betti tables. A probe such as I -&gt; {"{"}betti: resolve(S / I).betti{"}"} gives one.
          </p>
        );
    }
  })();

  const save = async (format: "svg" | "png") => {
    setProblem(null);
    if (!svg.current) return setProblem("There is no plot to download yet.");
    try {
      if (format === "svg") downloadSvg(svg.current, `${fileStem}-${kind}`);
      else await downloadPng(svg.current, `${fileStem}-${kind}`);
    } catch (e) {
      setProblem(`The ${format.toUpperCase()} could not be made: ${messageOf(e)}`);
    }
  };

  return (
    <section aria-label="Plots" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <fieldset className="flex flex-wrap gap-1" aria-label="Kind of plot">
          <legend className={`${panelHeading} mb-1`}>Plot</legend>
          {KINDS.map(([k, label]) => (
            <button
              key={k}
              type="button"
              aria-pressed={kind === k}
              onClick={() => setKind(k)}
              className={`${buttonSecondary} ${kind === k ? "!bg-ink !text-paper dark:!bg-signal dark:!text-night" : ""}`}
            >
              {label}
            </button>
          ))}
        </fieldset>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        {kind === "histogram" && <Pick label="Column" value={col} options={numeric} onChange={setCol} />}
        {kind === "scatter" && (
          <>
            <Pick label="Across (x)" value={x} options={numeric} onChange={setX} />
            <Pick label="Up (y)" value={y} options={numeric} onChange={setY} />
            <Pick label="Colour by" value={colour} options={numeric} onChange={setColour} allowNone />
          </>
        )}
        {kind === "series" && (
          <>
            <Pick label="Column" value={y} options={numeric} onChange={setY} />
            <Pick label="Against" value={x && x !== y ? x : "index"} options={numeric} onChange={setX} />
          </>
        )}
        {kind === "heat" && betti.length > 1 && (
          <Pick label="Betti column" value={heatCol ?? heatColumn} options={betti} onChange={setHeatCol} />
        )}
        <span className="ml-auto flex gap-1.5">
          <button type="button" className={buttonSecondary} onClick={() => void save("svg")}>
            Download SVG
          </button>
          <button type="button" className={buttonSecondary} onClick={() => void save("png")}>
            Download PNG
          </button>
        </span>
      </div>
      {truncatedTo !== null && (
        <p role="note" className="text-sm text-signal">
          The plot shows the first {truncatedTo} members in index order, not all of them.
        </p>
      )}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
      <div className="overflow-x-auto rounded-md border border-ink/10 dark:border-paper/10" data-testid="plot">
        {body}
      </div>
    </section>
  );
}

function NoColumn() {
  return <p className="p-6 text-sm text-ink-soft dark:text-paper/70">No column with numbers yet.</p>;
}
