/// What the plots draw, computed from the rows so far. Pure functions, unit-tested.
import type { Row } from "../types";
import { cellNumber } from "./cells";

export interface Bin {
  /// [from, to): the last bin also holds its right end
  from: number;
  to: number;
  count: number;
}

/// A histogram of the numbers in `column` over the ok rows. Integer data with few distinct
/// values gets one bin per integer (a Betti number of 3 is not "2.5 to 3.5"); otherwise
/// `maxBins` equal bins over [min, max].
export function histogram(rows: readonly Row[], column: string, maxBins = 20): { bins: Bin[]; used: number; skipped: number } {
  const xs: number[] = [];
  let skipped = 0;
  for (const r of rows) {
    const n = r.status === "ok" || column === "seconds" || column === "index" ? cellNumber(r, column) : null;
    if (n === null || !Number.isFinite(n)) skipped++;
    else xs.push(n);
  }
  if (xs.length === 0) return { bins: [], used: 0, skipped };
  const min = Math.min(...xs);
  const max = Math.max(...xs);
  let bins: Bin[];
  if (xs.every(Number.isInteger) && max - min + 1 <= maxBins * 2) {
    bins = Array.from({ length: max - min + 1 }, (_, k) => ({ from: min + k, to: min + k + 1, count: 0 }));
    for (const x of xs) bins[x - min].count++;
  } else if (min === max) {
    bins = [{ from: min, to: max, count: xs.length }];
  } else {
    const width = (max - min) / maxBins;
    bins = Array.from({ length: maxBins }, (_, k) => ({ from: min + k * width, to: min + (k + 1) * width, count: 0 }));
    for (const x of xs) bins[Math.min(maxBins - 1, Math.floor((x - min) / width))].count++;
  }
  return { bins, used: xs.length, skipped };
}

export interface Point {
  index: number;
  x: number;
  y: number;
  /// the colour column's number, when one is chosen and the cell has one
  c: number | null;
}

/// Points (x, y[, colour]) of the rows where both coordinates are numbers.
export function scatterPoints(rows: readonly Row[], x: string, y: string, colour: string | null): { points: Point[]; skipped: number } {
  const points: Point[] = [];
  let skipped = 0;
  for (const r of rows) {
    const px = cellNumber(r, x);
    const py = cellNumber(r, y);
    if (px === null || py === null) {
      skipped++;
      continue;
    }
    points.push({ index: r.index, x: px, y: py, c: colour ? cellNumber(r, colour) : null });
  }
  return { points, skipped };
}

export interface HeatCell {
  /// the member's index
  member: number;
  /// "β_{i,j}" position
  i: number;
  j: number;
  value: number;
}

/// Graded Betti numbers β_{i,j} of `column` (a §9 Betti table: entries [i, j, b]) across the
/// ok rows: one heat-map column per member, one row per (i, j) that is nonzero somewhere,
/// ordered by i then j. Members are in index order.
export function bettiHeat(
  rows: readonly Row[],
  column: string,
): { members: number[]; positions: [number, number][]; cells: HeatCell[]; max: number } {
  const cells: HeatCell[] = [];
  const keys = new Map<string, [number, number]>();
  const members: number[] = [];
  for (const r of [...rows].sort((a, b) => a.index - b.index)) {
    const v = r.fields[column];
    const entries = (v?.entries ?? v?.betti) as readonly (readonly [number, number, number])[] | undefined;
    if (r.status !== "ok" || !Array.isArray(entries)) continue;
    members.push(r.index);
    for (const e of entries) {
      if (!Array.isArray(e) || e.length !== 3 || e[2] === 0) continue;
      keys.set(`${e[0]},${e[1]}`, [e[0], e[1]]);
      cells.push({ member: r.index, i: e[0], j: e[1], value: e[2] });
    }
  }
  const positions = [...keys.values()].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  return { members, positions, cells, max: cells.reduce((m, c) => Math.max(m, c.value), 0) };
}
