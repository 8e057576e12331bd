/// Complex values from the engine's resolutions, one renderer per method of the dispatcher
/// (lib/algebra/resolution/dispatch.ts), and the notes that say what a truncated one leaves out.
import { LIMIT_TABLE } from "../limits";
import type { LocalResolution, QuotientResolution, Resolution } from "../algebra/index";
import type { BettiEntry, BettiTableValue, ComplexValue, MatrixValue, RingValue } from "./values";

/// Differentials are kept as matrices while the resolution has at most this many matrix
/// entries in all (beyond it C.map and C.minors say they were not kept).
export const MAX_MAP_ENTRIES = LIMIT_TABLE.keptMapEntries.value;

/// A list of n items each built on first reading (and then kept): the differentials of a
/// resolution are dense matrices of polynomials, far larger than its Betti numbers, and most
/// programs read only those (resolve(…).betti, poincare). Writing the value out (a named
/// object, a statement's result) reads every item.
export function lazyList<T>(n: number, build: (i: number) => T): readonly T[] {
  const items: T[] = new Array<T>(n);
  const cache = new Map<number, T>();
  for (let i = 0; i < n; i++) {
    Object.defineProperty(items, i, {
      enumerable: true,
      get: () => {
        let v = cache.get(i);
        if (v === undefined) cache.set(i, (v = build(i)));
        return v;
      },
    });
  }
  return Object.freeze(items);
}

/// The Complex value of a resolution over S (Schreyer); `shift`: how far the module was
/// moved up in degree before resolving (its Betti numbers are moved back). The
/// differentials are built only when read (lazyList): Koszul complex on 14 variables,
/// resolve(…).betti through the evaluator, 886 MB → 306 MB peak.
export function complexOf(r: Resolution, ring: RingValue, shift = 0): ComplexValue {
  const maps = lazyList<MatrixValue>(r.length, (k) => ({ type: "Matrix", ring, rows: r.map(k + 1), cols: r.ranks[k + 1] ?? 0 }));
  const entries = shift === 0 ? r.betti.entries : r.betti.entries.map(([i, j, b]) => [i, j - shift, b] as const);
  const betti: BettiTableValue = { type: "BettiTable", entries, complete: r.complete };
  return { type: "Complex", ring, ranks: r.ranks, betti, complete: r.complete, maps };
}

/// The first column that a degree bound may have cut (its total and all later ones are
/// lower bounds), or null when every column is exact.
export function firstInexact(r: QuotientResolution): number | null {
  const k = r.columns.findIndex((col) => !col.complete);
  return k < 0 ? null : k;
}

/// What a truncated resolution leaves out, said plainly.
export function truncationNote(r: QuotientResolution, length: number, shift: number): string | undefined {
  const k = firstInexact(r);
  if (k !== null) {
    const d = r.exactThroughDegree - shift;
    return `internal degrees above ${d} were not computed, so β_i for i ≥ ${k} are lower bounds (β_{i,j} with j ≤ ${d} are exact)`;
  }
  const last = r.columns[r.columns.length - 1];
  if (last.total > 0) return `only homological degrees ≤ ${length} were computed; the resolution goes on`;
  return undefined;
}

type QuotientColumn = QuotientResolution["columns"][number];

export function entriesOf(columns: readonly QuotientColumn[], shift = 0): BettiEntry[] {
  return columns.flatMap((col) => col.entries.map((e) => [col.index, e.degree - shift, e.count] as const));
}

/// The Complex value of a resolution over a graded quotient, degree by degree.
export function gradedQuotientComplex(r: QuotientResolution, base: RingValue, length: number, shift: number): ComplexValue {
  const complete = r.complete && r.columns[r.columns.length - 1].total === 0;
  const note = complete ? undefined : truncationNote(r, length, shift);
  const ranks = r.columns.map((col) => col.total);
  const maps: MatrixValue[] | null = r.maps ? r.maps.map((rows, i) => ({ type: "Matrix", ring: base, rows, cols: ranks[i + 1] })) : null;
  return {
    type: "Complex",
    ring: base,
    ranks,
    betti: { type: "BettiTable", entries: entriesOf(r.columns, shift), complete, ...(note ? { note } : {}) },
    complete,
    maps,
    ...(note ? { note } : {}),
  };
}

const LOCAL_NOTE = "over the local ring at the origin, ungraded: the Betti table lists β_i under internal degree 0";

/// The Complex value of a resolution over the local ring at the origin (ungraded);
/// `overGivenRing`: that local ring is the given ring itself, so its maps are maps over it.
export function localComplex(r: LocalResolution, overGivenRing: boolean, base: RingValue, length: number): ComplexValue {
  const note = r.complete ? LOCAL_NOTE : `only homological degrees ≤ ${length} were computed; the resolution goes on; ${LOCAL_NOTE}`;
  const entries: BettiEntry[] = r.ranks.flatMap((b, i) => (b > 0 ? [[i, 0, b] as const] : []));
  // the maps live over the local ring; they are maps over A itself only when A is that ring
  const maps: MatrixValue[] | null = overGivenRing
    ? r.maps.map((rows, i) => ({ type: "Matrix", ring: base, rows, cols: r.ranks[i + 1] }))
    : null;
  return {
    type: "Complex",
    ring: base,
    ranks: r.ranks,
    betti: { type: "BettiTable", entries, complete: r.complete, note },
    complete: r.complete,
    maps,
    note,
  };
}
