/// The Betti table view model: §9 entries `[[i, j, b], …]` (j the internal degree) laid
/// out with a column per homological degree i and a row per j − i, as the table is
/// usually printed (Eisenbud, "The Geometry of Syzygies", 2005, §1B).

/// One row of the grid: `shift` = j − i, `cells[c]` the Betti number of column
/// `columns[c]` in that row, null where it is zero.
export interface BettiRow {
  readonly shift: number;
  readonly cells: readonly (number | null)[];
}

/// The laid-out table: homological degrees, rows by j − i (ascending), column totals.
export interface BettiGrid {
  readonly columns: readonly number[];
  readonly rows: readonly BettiRow[];
  readonly totals: readonly number[];
  readonly truncated: boolean;
}

/// A §9 Betti entry: homological degree i, internal degree j, Betti number b.
export type BettiEntry = readonly [number, number, number];

/// Lays out nonzero Betti numbers as a grid; `complete` false marks it truncated.
/// Columns run from 0 to the largest homological degree present (gaps included, so the
/// shape of the resolution stays visible); rows from the least to the largest j − i.
export function bettiGrid(entries: readonly BettiEntry[], complete: boolean): BettiGrid {
  const nonzero = entries.filter(([, , b]) => b !== 0);
  if (nonzero.length === 0) return { columns: [], rows: [], totals: [], truncated: !complete };
  const maxI = Math.max(...nonzero.map(([i]) => i));
  const shifts = nonzero.map(([i, j]) => j - i);
  const low = Math.min(...shifts);
  const high = Math.max(...shifts);
  const columns = Array.from({ length: maxI + 1 }, (_, i) => i);
  const grid: (number | null)[][] = Array.from({ length: high - low + 1 }, () => columns.map(() => null));
  for (const [i, j, b] of nonzero) {
    const row = grid[j - i - low];
    row[i] = (row[i] ?? 0) + b;
  }
  const totals = columns.map((c) => grid.reduce((s, row) => s + (row[c] ?? 0), 0));
  return {
    columns,
    rows: grid.map((cells, k) => ({ shift: low + k, cells })),
    totals,
    truncated: !complete,
  };
}

/// Merges streamed partial Betti columns (each a list of entries) into one entry list,
/// a later column for the same (i, j) replacing the earlier value.
export function mergeBettiEntries(parts: readonly (readonly BettiEntry[])[]): BettiEntry[] {
  const byKey = new Map<string, BettiEntry>();
  for (const part of parts) for (const e of part) byKey.set(`${e[0]},${e[1]}`, e);
  return [...byKey.values()].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
}
