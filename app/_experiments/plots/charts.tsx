"use client";
/// The four plots of the room, drawn with visx as plain SVG (no CSS classes: colours and
/// fonts are attributes, so the downloaded file is what was on screen). Each takes the
/// rows so far and redraws as more arrive.
import { AxisBottom, AxisLeft } from "@visx/axis";
import { Group } from "@visx/group";
import { HeatmapRect } from "@visx/heatmap";
import { scaleBand, scaleLinear } from "@visx/scale";
import { Bar, Circle } from "@visx/shape";
import type { Ref } from "react";
import { bettiHeat, histogram, scatterPoints } from "../data/plot-data";
import type { Row } from "../types";
import type { PlotPalette } from "./palette";

export const WIDTH = 760;
export const HEIGHT = 380;
const M = { top: 40, right: 24, bottom: 52, left: 64 };
const FONT = "Inter, system-ui, sans-serif";

function Frame({
  svgRef,
  title,
  caption,
  palette,
  children,
  label,
}: {
  svgRef: Ref<SVGSVGElement>;
  title: string;
  caption: string;
  palette: PlotPalette;
  children: React.ReactNode;
  label: string;
}) {
  return (
    <svg
      ref={svgRef}
      xmlns="http://www.w3.org/2000/svg"
      width={WIDTH}
      height={HEIGHT}
      viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
      role="img"
      aria-label={label}
      className="h-auto w-full max-w-[52rem]"
      fontFamily={FONT}
    >
      <title>{title}</title>
      <rect width={WIDTH} height={HEIGHT} fill={palette.background} />
      <text x={M.left} y={22} fill={palette.text} fontSize={14} fontWeight={600}>
        {title}
      </text>
      <text x={WIDTH - M.right} y={22} fill={palette.muted} fontSize={11} textAnchor="end">
        {caption}
      </text>
      {children}
    </svg>
  );
}

const axisProps = (p: PlotPalette) => ({
  stroke: p.muted,
  tickStroke: p.muted,
  tickLabelProps: { fill: p.text, fontSize: 11, fontFamily: FONT },
  labelProps: { fill: p.text, fontSize: 12, fontFamily: FONT },
});

const innerW = WIDTH - M.left - M.right;
const innerH = HEIGHT - M.top - M.bottom;

/// "n points, m rows without a number left out" — what the plot does not show, said.
const leftOut = (used: number, skipped: number, noun = "rows") =>
  `${used} ${noun}${skipped ? `; ${skipped} without a number left out` : ""}`;

/// The props of a plot of one column of the rows.
interface OneColumnChart {
  rows: Row[];
  column: string;
  palette: PlotPalette;
  svgRef: Ref<SVGSVGElement>;
}

export function Histogram({ rows, column, palette, svgRef }: OneColumnChart) {
  const { bins, used, skipped } = histogram(rows, column);
  const x = scaleLinear<number>({ domain: bins.length ? [bins[0].from, bins[bins.length - 1].to] : [0, 1], range: [0, innerW] });
  const y = scaleLinear<number>({ domain: [0, Math.max(1, ...bins.map((b) => b.count))], range: [innerH, 0], nice: true });
  const integerBins = bins.length > 0 && bins.every((b) => b.to - b.from === 1 && Number.isInteger(b.from));
  return (
    <Frame
      svgRef={svgRef}
      title={`Histogram of ${column}`}
      caption={leftOut(used, skipped)}
      palette={palette}
      label={`Histogram of ${column} over ${used} rows`}
    >
      <Group left={M.left} top={M.top}>
        {bins.map((b, k) => {
          const x0 = x(b.from);
          const w = Math.max(1, (bins.length === 1 ? innerW / 3 : x(b.to) - x0) - 2);
          return (
            <Bar
              key={k}
              x={bins.length === 1 ? innerW / 3 : x0 + 1}
              y={y(b.count)}
              width={w}
              height={innerH - y(b.count)}
              fill={palette.mark}
              data-count={b.count}
            />
          );
        })}
        <AxisLeft scale={y} label="members" numTicks={5} {...axisProps(palette)} />
        <AxisBottom
          scale={x}
          top={innerH}
          label={column}
          numTicks={integerBins ? Math.min(bins.length, 12) : 8}
          tickFormat={integerBins ? (v) => (Number.isInteger(Number(v)) ? String(v) : "") : undefined}
          {...axisProps(palette)}
        />
        {integerBins &&
          bins.map((b, k) => (
            <text
              key={`l${k}`}
              x={x(b.from) + (x(b.to) - x(b.from)) / 2}
              y={y(b.count) - 4}
              fill={palette.text}
              fontSize={10}
              textAnchor="middle"
            >
              {b.count || ""}
            </text>
          ))}
      </Group>
    </Frame>
  );
}

function extent(xs: number[]): [number, number] {
  if (xs.length === 0) return [0, 1];
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  return lo === hi ? [lo - 1, hi + 1] : [lo, hi];
}

export function Scatter({
  rows,
  x: xc,
  y: yc,
  colour,
  palette,
  svgRef,
  line = false,
}: {
  rows: Row[];
  x: string;
  y: string;
  colour: string | null;
  palette: PlotPalette;
  svgRef: Ref<SVGSVGElement>;
  line?: boolean;
}) {
  const { points, skipped } = scatterPoints(rows, xc, yc, colour);
  const x = scaleLinear<number>({ domain: extent(points.map((p) => p.x)), range: [0, innerW], nice: true });
  const y = scaleLinear<number>({ domain: extent(points.map((p) => p.y)), range: [innerH, 0], nice: true });
  const cs = points.map((p) => p.c).filter((c): c is number => c !== null);
  const c = scaleLinear<string>({ domain: extent(cs), range: [palette.low, palette.high] });
  const title = line ? `${yc} against ${xc}` : `${yc} against ${xc}${colour ? `, coloured by ${colour}` : ""}`;
  // equal points overlap; a count of distinct positions tells the reader so
  const distinct = new Set(points.map((p) => `${p.x},${p.y}`)).size;
  const caption = `${points.length} points (${distinct} distinct positions)${skipped ? `; ${skipped} rows without numbers left out` : ""}`;
  const sorted = line ? [...points].sort((a, b) => a.x - b.x) : points;
  return (
    <Frame svgRef={svgRef} title={title} caption={caption} palette={palette} label={`${title}: ${points.length} points`}>
      <Group left={M.left} top={M.top}>
        {line && sorted.length > 1 && (
          <polyline
            points={sorted.map((p) => `${x(p.x)},${y(p.y)}`).join(" ")}
            fill="none"
            stroke={palette.muted}
            strokeWidth={1}
            strokeOpacity={0.6}
          />
        )}
        {sorted.map((p) => (
          <Circle
            key={p.index}
            cx={x(p.x)}
            cy={y(p.y)}
            r={4}
            fill={colour && p.c !== null ? c(p.c) : palette.mark}
            stroke={colour ? palette.text : palette.background}
            strokeWidth={colour ? 0.5 : 1}
            fillOpacity={0.85}
          >
            <title>{`member ${p.index}: ${xc} = ${p.x}, ${yc} = ${p.y}${colour && p.c !== null ? `, ${colour} = ${p.c}` : ""}`}</title>
          </Circle>
        ))}
        <AxisLeft scale={y} label={yc} numTicks={6} {...axisProps(palette)} />
        <AxisBottom scale={x} top={innerH} label={xc} numTicks={8} {...axisProps(palette)} />
      </Group>
      {colour && cs.length > 0 && <ColourKey palette={palette} colour={colour} domain={extent(cs)} scale={c} />}
    </Frame>
  );
}

function ColourKey({
  palette,
  colour,
  domain,
  scale,
}: {
  palette: PlotPalette;
  colour: string;
  domain: [number, number];
  scale: (v: number) => string;
}) {
  const steps = 6;
  const left = WIDTH - M.right - 150;
  return (
    <g transform={`translate(${left}, ${HEIGHT - 16})`}>
      <text x={-6} y={0} fill={palette.text} fontSize={10} textAnchor="end">
        {colour}
      </text>
      {Array.from({ length: steps }, (_, k) => {
        const v = domain[0] + ((domain[1] - domain[0]) * k) / (steps - 1);
        return <rect key={k} x={k * 20} y={-9} width={20} height={10} fill={scale(v)} />;
      })}
      <text x={0} y={-12} fill={palette.muted} fontSize={9}>
        {domain[0]}
      </text>
      <text x={steps * 20} y={-12} fill={palette.muted} fontSize={9} textAnchor="end">
        {domain[1]}
      </text>
    </g>
  );
}

interface HeatColumn {
  member: number;
  bins: { position: string; count: number }[];
}

export function BettiHeatMap({ rows, column, palette, svgRef }: OneColumnChart) {
  const heat = bettiHeat(rows, column);
  const left = 80;
  const w = WIDTH - left - M.right;
  const h = HEIGHT - M.top - M.bottom;
  const labels = heat.positions.map(([i, j]) => `β${i},${j}`);
  const byKey = new Map(heat.cells.map((c) => [`${c.member}|${c.i},${c.j}`, c.value]));
  const data: HeatColumn[] = heat.members.map((m) => ({
    member: m,
    bins: heat.positions.map(([i, j]) => ({ position: `${i},${j}`, count: byKey.get(`${m}|${i},${j}`) ?? 0 })),
  }));
  const binWidth = heat.members.length ? w / heat.members.length : w;
  const binHeight = heat.positions.length ? h / heat.positions.length : h;
  const xs = scaleLinear<number>({ domain: [0, Math.max(1, heat.members.length)], range: [0, w] });
  const ys = scaleLinear<number>({ domain: [0, Math.max(1, heat.positions.length)], range: [0, h] });
  const colour = scaleLinear<string>({ domain: [0, Math.max(1, heat.max)], range: [palette.low, palette.high] });
  const memberAxis = scaleBand<number>({ domain: heat.members, range: [0, w] });
  const every = Math.max(1, Math.ceil(heat.members.length / 20));
  return (
    <Frame
      svgRef={svgRef}
      title={`Graded Betti numbers of ${column} across members`}
      caption={`${heat.members.length} members, ${heat.positions.length} nonzero positions, largest ${heat.max}`}
      palette={palette}
      label={`Heat map of graded Betti numbers of ${column} for ${heat.members.length} members`}
    >
      <Group left={left} top={M.top}>
        <HeatmapRect<HeatColumn, { position: string; count: number }>
          data={data}
          xScale={(k) => xs(k) ?? 0}
          yScale={(k) => ys(k) ?? 0}
          colorScale={(v) => colour(Number(v))}
          binWidth={binWidth}
          binHeight={binHeight}
          gap={1}
          bins={(d) => d.bins}
          count={(b) => b.count}
        >
          {(cells) =>
            cells.flatMap((col) =>
              col.map((cell) => (
                <rect
                  key={`${cell.row}-${cell.column}`}
                  x={cell.x}
                  y={cell.y}
                  width={Math.max(0, cell.width)}
                  height={Math.max(0, cell.height)}
                  fill={cell.color}
                  data-value={cell.count}
                >
                  <title>{`member ${heat.members[cell.column]}: β${heat.positions[cell.row]?.join(",")} = ${cell.count}`}</title>
                </rect>
              )),
            )
          }
        </HeatmapRect>
        {labels.map((l, k) => (
          <text key={l} x={-6} y={ys(k + 0.5)} dy="0.33em" textAnchor="end" fill={palette.text} fontSize={10}>
            {l}
          </text>
        ))}
        <AxisBottom
          scale={memberAxis}
          top={h}
          label="member index"
          tickValues={heat.members.filter((_, k) => k % every === 0)}
          {...axisProps(palette)}
        />
      </Group>
    </Frame>
  );
}
