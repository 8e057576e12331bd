import { runtimeError } from "../../errors";
import type { Ideal } from "../../ideal/ideal";
import { idealGroebnerBasis } from "../../ideal/ideal";
import { checkpoint, type ComputeOptions } from "../../options";
import type { Poly } from "../../poly/poly";
import { ringCtx, type PolyRing, type RingCtx } from "../../poly/ring";
import { moduleGroebner } from "../../module/groebner";
import { termOverPosition, type ModuleOrder } from "../../module/order";
import { vecFromPolys, type Vec } from "../../module/vector";
import { bettiTable, type BettiColumn, type BettiTable } from "./betti";
import { schreyerResolution, type SchreyerResolution } from "./frame";
import { denseMap, minimizeResolution, scalarRanks } from "./minimize";

/// Options of a resolution: the ComputeOptions, bounds, and a callback for finished columns.
export interface ResolveOptions extends ComputeOptions {
  /// Compute F_0 … F_length only.
  length?: number;
  /// Keep internal degrees ≤ degree only.
  degree?: number;
  /// Called with each Betti column as soon as it is final, in increasing i.
  partial?: (column: BettiColumn) => void;
  /// The caller reads only the Betti numbers, ranks and degrees: each level of the frame is
  /// released once the next one is built, and `map(i)` is refused (the same Betti numbers;
  /// for the Plücker ideal of G(2,7) the peak memory falls from 0.4 GB).
  bettiOnly?: boolean;
}

/// A minimal graded free resolution 0 ← F_0 ← F_1 ← … ← F_length ← 0 of a graded module.
export interface Resolution {
  readonly ring: PolyRing;
  /// rank F_i for i = 0…length.
  readonly ranks: readonly number[];
  /// The degrees of the basis elements of F_i (increasing).
  readonly degrees: readonly (readonly number[])[];
  readonly betti: BettiTable;
  readonly length: number;
  /// False when a length or degree bound cut it short.
  readonly complete: boolean;
  /// The matrix of d_i: F_i → F_{i−1} (rank F_{i−1} rows, rank F_i columns), 1 ≤ i ≤ length.
  map(i: number): Poly[][];
}

/// The minimal graded free resolution of S/I for a homogeneous ideal I of a polynomial ring.
export function resolveQuotient(I: Ideal, opts?: ResolveOptions): Resolution {
  const R = I.ring;
  const C = ringCtx(R);
  const G = idealGroebnerBasis(I, opts);
  const O = termOverPosition(C.layout, 1);
  for (const g of G)
    if (!g.m.every((m) => m[1] === g.m[0][1]))
      throw runtimeError(
        "resolveQuotient",
        "the ideal is not homogeneous, so it has no graded resolution: make the terms of each generator share one degree (homogenize with a new variable)",
      );
  const basis = G.map((g) => vecFromPolys(C, O, [g]));
  return resolveFromBasis(C, [0], O, basis, opts);
}

/// The minimal graded free resolution of coker(A) for a homogeneous matrix A (given by its
/// rows) with target R^[rowDegrees] (default all 0): the degree of column q is deg A[a][q] +
/// rowDegrees[a] for its nonzero entries, which must agree.
export function resolveCoker(
  R: PolyRing,
  rows: readonly (readonly Poly[])[],
  rowDegrees?: readonly number[],
  opts?: ResolveOptions,
): Resolution {
  const C = ringCtx(R);
  const r = rows.length;
  const degs = rowDegrees ? [...rowDegrees] : new Array<number>(r).fill(0);
  if (degs.length !== r) throw runtimeError("resolveCoker", `expected ${r} row degrees, got ${degs.length}`);
  const ncols = r === 0 ? 0 : rows[0].length;
  if (rows.some((row) => row.length !== ncols)) throw runtimeError("resolveCoker", "the rows have different lengths");
  const O = termOverPosition(C.layout, r);
  const gens: Vec<unknown>[] = [];
  for (let q = 0; q < ncols; q++) {
    const v = vecFromPolys(
      C,
      O,
      rows.map((row) => row[q]),
    );
    if (v.mono.length > 0) gens.push(v);
  }
  checkpoint(opts, { stage: "resolution", detail: "Gröbner basis of the presentation" });
  const basis = moduleGroebner(C, O, degs, gens, opts);
  return resolveFromBasis(C, degs, O, basis, opts);
}

function resolveFromBasis<C>(R: RingCtx<C>, degrees0: number[], O: ModuleOrder, basis: Vec<C>[], opts?: ResolveOptions): Resolution {
  const maxLength = opts?.length ?? Infinity;
  if (!(maxLength >= 0) || (maxLength !== Infinity && !Number.isInteger(maxLength))) {
    throw runtimeError("resolve", `the length bound must be a non-negative integer, got ${maxLength}`);
  }
  // One level beyond the bound decides whether F_{length+1} vanishes, i.e. whether the answer is complete.
  const bounds = { maxLevel: maxLength + 2, maxDegree: opts?.degree ?? Infinity };
  const columns: BettiColumn[] = [];
  const ranks: Map<number, number>[] = [];
  // Column i is final once d_{i+1} is known: β_{i,j} = f_{i,j} − rk_{i,j} − rk_{i+1,j}.
  const onLevel = (S: SchreyerResolution<C>, k: number) => {
    ranks[k] = scalarRanks(R, S, k, opts);
    const i = k - 1;
    const count = new Map<number, number>();
    for (const d of S.degrees[i]) count.set(d, (count.get(d) ?? 0) + 1);
    const entries: [number, number][] = [];
    for (const [j, f] of count) {
      const b = f - (ranks[i]?.get(j) ?? 0) - (ranks[k].get(j) ?? 0);
      if (b > 0) entries.push([j, b]);
    }
    entries.sort((x, y) => x[0] - y[0]);
    const col = { i, entries };
    columns.push(col);
    if (i <= maxLength) opts?.partial?.(col);
  };
  const bettiOnly = opts?.bettiOnly === true;
  const S = schreyerResolution(R, degrees0, O, basis, bounds, opts, onLevel, { dropFinishedLevels: bettiOnly });
  const complete = !S.truncatedDegree && columns.every((c) => c.i <= maxLength || c.entries.length === 0);
  const reported = columns.filter((c) => c.i <= maxLength);
  let length = 0;
  for (const c of reported) if (c.entries.length > 0) length = c.i;
  // The Betti numbers, ranks and degrees come from the scalar ranks alone; the minimised
  // complex is built only when a differential is asked for (most callers read only the
  // Betti table: resolve(…).betti, poincare), and then checked against them.
  let M: ReturnType<typeof minimizeResolution<C>> | null = null;
  // Betti-only: the frame is not kept (its early levels are already released)
  const frame: SchreyerResolution<C> | null = bettiOnly ? null : S;
  const minimized = () => {
    if (!frame) throw runtimeError("map", "this resolution was computed for its Betti numbers only; its differentials were not kept");
    if (!M) {
      M = minimizeResolution(R, frame, opts);
      checkMinimal(frame, M.kept, columns);
    }
    return M;
  };
  const rankOf = Array.from({ length: length + 1 }, (_, i) =>
    (reported.find((c) => c.i === i)?.entries ?? []).reduce((s, [, b]) => s + b, 0),
  );
  // the degrees of the basis of the minimal F_i, increasing: β_{i,j} copies of each j
  const degrees = Object.freeze(
    rankOf.map((_, i) =>
      Object.freeze(
        (reported.find((c) => c.i === i)?.entries ?? []).flatMap(([j, b]) => new Array<number>(b).fill(j)).sort((a, b) => a - b),
      ),
    ),
  );
  const maps = new Map<number, Poly[][]>();
  return Object.freeze({
    ring: R.ring,
    ranks: Object.freeze(rankOf),
    degrees,
    betti: bettiTable(reported, complete),
    length,
    complete,
    map(i: number): Poly[][] {
      if (!Number.isInteger(i) || i < 1 || i > length) throw runtimeError("map", `the differentials are numbered 1…${length}, got ${i}`);
      let A = maps.get(i);
      if (!A) maps.set(i, (A = denseMap(R, minimized(), i)));
      return A.map((row) => [...row]);
    },
  });
}

/// The minimised complex must have exactly the ranks predicted by the scalar parts.
function checkMinimal<C>(S: SchreyerResolution<C>, kept: number[][], columns: BettiColumn[]): void {
  for (const c of columns) {
    const have = new Map<number, number>();
    for (const p of kept[c.i] ?? []) have.set(S.degrees[c.i][p], (have.get(S.degrees[c.i][p]) ?? 0) + 1);
    const want = new Map(c.entries);
    const ok = [...have].every(([j, b]) => want.get(j) === b) && [...want].every(([j, b]) => have.get(j) === b);
    if (!ok) throw new Error(`resolve: minimisation disagrees with the scalar ranks in homological degree ${c.i}`);
  }
}
