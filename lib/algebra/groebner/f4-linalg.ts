import { invMod } from "../field/gfp";
import type { Ticker } from "../options";
import { WasmPivotReducer } from "./f4-kernel";
import type { F4Matrix, SparseRow } from "./f4-linalg-types";

export type { F4Matrix, SparseRow } from "./f4-linalg-types";

/// The linear algebra of one F4 step over GF(p), p < 2^31, in the block form of
/// J.-C. Faugère, S. Lachartre, "Parallel Gaussian elimination for Gröbner bases computations
/// in finite fields", PASCO 2010: the columns are split into pivot columns (the leading
/// column of some reducer row, block A) and the others (block B); the matrix is
///
///     [ A  B ]   reducer rows (one per pivot column, A upper triangular with unit diagonal)
///     [ C  D ]   rows to reduce (the S-polynomial halves)
///
/// Step 1 reduces each row of [C D] by the reducer rows, leaving D' = D − C·A⁻¹·B (rows in the
/// B columns only); step 2 brings D' to echelon form. Only the non-zero rows of D' matter to
/// F4: their leading monomials are new. Step 2 runs as the rows come, in the order of
/// M.rows: each remainder is reduced by the echelon rows found before it and, when something
/// is left, made monic and kept; so memory holds the rank of D', not every remainder.
///
/// Two implementations compute exactly the same rows (tests/algebra/f4-kernel.test.ts):
/// the WebAssembly kernel of f4-kernel.ts (kernel/f4-kernel.as.ts: eight rows at a time in
/// 64-bit integer lanes with SIMD, sparse rows in u32 arrays), which the engine uses, and
/// the TypeScript one below (`reduceF4MatrixTS`, `reduceRowTS`), kept as the reference and
/// for reducing a few rows without loading a matrix into the kernel. In the TypeScript one
/// each row being reduced is spread into a dense accumulator of doubles, and products of
/// residues are added without reduction while the sum provably stays below 2^52 (delayed
/// modular reduction; the budget is counted in row operations). For p above 2^23 a product
/// of two residues would use up the 53-bit mantissa too fast, so the multiplier is split
/// into 16-bit halves added into two accumulators.

/// A prime with p ≤ 2^23 adds plain products; above, the split multiplier.
const PLAIN_PRIME_BOUND = 2 ** 23;
const SUM_BOUND = 2 ** 52;
/// Row operations between reductions of the two accumulators of the split form: each product
/// is below 2^16·2^31 = 2^47, so 31 of them plus a residue stay below 2^52.
const SPLIT_BUDGET = 31;

/// One dense accumulator of ncols columns with delayed reduction modulo p.
class Accumulator {
  readonly lo: Float64Array;
  readonly hi: Float64Array | null;
  private readonly pinv: number;
  /// Row operations allowed before every column must be reduced again.
  readonly budget: number;

  constructor(
    readonly p: number,
    ncols: number,
  ) {
    this.lo = new Float64Array(ncols);
    const plain = p <= PLAIN_PRIME_BOUND;
    this.hi = plain ? null : new Float64Array(ncols);
    this.pinv = 1 / p;
    this.budget = plain ? Math.max(1, Math.floor((SUM_BOUND - p) / ((p - 1) * (p - 1)))) : SPLIT_BUDGET;
  }

  /// x mod p for 0 ≤ x < 2^52 (floating quotient, corrected by at most one step).
  mod(x: number): number {
    const p = this.p;
    let r = x - Math.floor(x * this.pinv) * p;
    if (r < 0) r += p;
    else if (r >= p) r -= p;
    return r;
  }

  /// The residue at column c, which is then cleared.
  take(c: number): number {
    const lo = this.lo,
      hi = this.hi;
    let v = lo[c];
    if (hi !== null) {
      const h = hi[c];
      if (h !== 0) {
        v = this.mod(h) * 65536 + v;
        hi[c] = 0;
      }
    }
    if (v === 0) return 0;
    lo[c] = 0;
    return v < this.p ? v : this.mod(v);
  }

  /// Adds mult·row (without its first entry) to the accumulator; mult in [1, p).
  addTail(row: SparseRow, mult: number): void {
    const pc = row.cols,
      pv = row.vals,
      lo = this.lo,
      hi = this.hi,
      len = row.len,
      o = row.off;
    if (hi === null) {
      for (let k = 1; k < len; k++) lo[pc[o + k]] += mult * pv[k];
      return;
    }
    const mh = Math.floor(mult / 65536),
      ml = mult - mh * 65536;
    for (let k = 1; k < len; k++) {
      const c = pc[o + k],
        v = pv[k];
      lo[c] += ml * v;
      hi[c] += mh * v;
    }
  }

  /// Reduces columns [from, to) so that another `budget` row operations fit.
  normalise(from: number, to: number): void {
    const lo = this.lo,
      hi = this.hi;
    for (let c = from; c < to; c++) {
      let v = lo[c];
      if (hi !== null && hi[c] !== 0) {
        v = this.mod(hi[c]) * 65536 + v;
        hi[c] = 0;
      }
      if (v >= this.p) lo[c] = this.mod(v);
      else lo[c] = v;
    }
  }
}

/// Step 1: reduces `row` without its first `skip` entries (columns in the combined
/// numbering, A columns [0, nA) first) by the reducer rows `pivots` (indexed by their pivot
/// column) and returns the remainder in the B columns, renumbered from 0 and increasing, or
/// null when it is zero.
function reduceByA(
  acc: Accumulator,
  row: SparseRow,
  skip: number,
  pivots: readonly SparseRow[],
  nA: number,
  ncols: number,
): SparseRow | null {
  const p = acc.p,
    lo = acc.lo,
    hi = acc.hi,
    budget = acc.budget;
  const rc = row.cols,
    rv = row.vals,
    o = row.off;
  let first = ncols;
  for (let k = skip; k < row.len; k++) {
    const c = rc[o + k];
    lo[c] = rv[k];
    if (c < first) first = c;
  }
  let ops = 0;
  for (let c = first; c < nA; c++) {
    if (lo[c] === 0 && (hi === null || hi[c] === 0)) continue;
    const v = acc.take(c);
    if (v === 0) continue;
    acc.addTail(pivots[c], p - v);
    if (++ops === budget) {
      acc.normalise(c + 1, ncols);
      ops = 0;
    }
  }
  const cols: number[] = [],
    vals: number[] = [];
  for (let c = first > nA ? first : nA; c < ncols; c++) {
    if (lo[c] === 0 && (hi === null || hi[c] === 0)) continue;
    const v = acc.take(c);
    if (v === 0) continue;
    cols.push(c - nA);
    vals.push(v);
  }
  if (cols.length === 0) return null;
  return { cols: Int32Array.from(cols), off: 0, len: cols.length, vals: Float64Array.from(vals) };
}

/// Step 2 for one remainder `row` (B numbering, increasing columns): reduces it by the
/// echelon rows `pivots` (indexed by leading column) and returns what is left, monic, or null.
function echelonRow(acc: Accumulator, row: SparseRow, pivots: (SparseRow | undefined)[], nB: number): SparseRow | null {
  const p = acc.p,
    lo = acc.lo,
    hi = acc.hi,
    budget = acc.budget;
  const rc = row.cols,
    rv = row.vals;
  for (let k = 0; k < row.len; k++) lo[rc[k]] = rv[k];
  let ops = 0,
    lead = -1,
    nonzero = 0;
  for (let c = rc[0]; c < nB; c++) {
    if (lo[c] === 0 && (hi === null || hi[c] === 0)) continue;
    const v = acc.take(c);
    if (v === 0) continue;
    const piv = pivots[c];
    if (piv === undefined) {
      lo[c] = v; // kept, reduced
      if (lead < 0) lead = c;
      nonzero++;
      continue;
    }
    acc.addTail(piv, p - v);
    if (++ops === budget) {
      acc.normalise(c + 1, nB);
      ops = 0;
    }
  }
  if (lead < 0) return null;
  const cols = new Int32Array(nonzero),
    vals = new Float64Array(nonzero);
  const inv = invMod(lo[lead], p);
  let k = 0;
  for (let c = lead; k < nonzero; c++) {
    const v = lo[c];
    if (v === 0) continue;
    cols[k] = c;
    vals[k++] = acc.mod(v * inv >= SUM_BOUND ? mulSplit(v, inv, p, acc) : v * inv);
    lo[c] = 0;
  }
  const r = { cols, off: 0, len: nonzero, vals };
  pivots[lead] = r;
  return r;
}

/// v·w mod p when the product may not be exact in a double (p > 2^26).
function mulSplit(v: number, w: number, p: number, acc: Accumulator): number {
  const wh = Math.floor(w / 65536),
    wl = w - wh * 65536;
  return acc.mod(acc.mod(v * wh) * 65536 + v * wl);
}

/// The non-zero rows of the echelon form of D' (B-column numbering, monic, increasing
/// columns, distinct leading columns), each with the index in M.rows of the row it came
/// from; computed by the WebAssembly kernel.
export function reduceF4Matrix(p: number, M: F4Matrix, ticker: Ticker): { rows: SparseRow[]; from: number[] } {
  const reducer = new WasmPivotReducer(p, M.pivots, M.nA, M.ncols);
  try {
    return reducer.reduceAndEchelon(M.rows, ticker);
  } finally {
    reducer.release();
  }
}

/// The tail (all entries but the first) of each row reduced by the reducer rows: its
/// remainder in the B columns (renumbered from 0, increasing), or null when it is zero.
/// With the elements of a Gröbner basis as rows, these are the tails of the reduced basis.
export function reduceTails(p: number, M: F4Matrix, ticker: Ticker): (SparseRow | null)[] {
  const reducer = new WasmPivotReducer(p, M.pivots, M.nA, M.ncols);
  try {
    return reducer.reduceRows(M.rows, 1, ticker);
  } finally {
    reducer.release();
  }
}

/// The reducer rows of a matrix loaded once into the WebAssembly kernel, to reduce many rows
/// by them: `reduceRow` / `reduceRows` return B-parts as `reduceRowTS` does. Call `release()`
/// when done (the kernel's memory is then reused for the next matrix).
export class PivotReducer {
  private readonly kernel: WasmPivotReducer;
  constructor(
    readonly p: number,
    readonly M: Pick<F4Matrix, "pivots" | "nA" | "ncols">,
  ) {
    this.kernel = new WasmPivotReducer(p, M.pivots, M.nA, M.ncols);
  }

  /// The B-part of one row: a sparse row or a dense one (residues in [0, p) by column of the
  /// combined numbering, length ncols).
  reduceRow(row: SparseRow | Float64Array): SparseRow | null {
    return this.kernel.reduceRows([row instanceof Float64Array ? sparseOfDense(row) : row])[0];
  }

  /// The B-parts of rows, eight at a time (faster than one by one).
  reduceRows(rows: readonly SparseRow[], ticker?: Ticker): (SparseRow | null)[] {
    return this.kernel.reduceRows(rows, 0, ticker);
  }

  release(): void {
    this.kernel.release();
  }
}

/// The non-zero entries of a dense row.
function sparseOfDense(d: Float64Array): SparseRow {
  let n = 0;
  for (let c = 0; c < d.length; c++) if (d[c] !== 0) n++;
  const cols = new Int32Array(n),
    vals = new Float64Array(n);
  for (let c = 0, k = 0; c < d.length; c++) {
    if (d[c] !== 0) {
      cols[k] = c;
      vals[k++] = d[c];
    }
  }
  return { cols, off: 0, len: n, vals };
}

/// `reduceF4Matrix` in TypeScript (the reference the kernel is tested against).
export function reduceF4MatrixTS(p: number, M: F4Matrix, ticker: Ticker): { rows: SparseRow[]; from: number[] } {
  const { pivots, rows, nA, ncols } = M;
  const acc = new Accumulator(p, ncols);
  const eacc = new Accumulator(p, ncols - nA);
  const echelonPivots: (SparseRow | undefined)[] = new Array(ncols - nA);
  const out: SparseRow[] = [],
    from: number[] = [];
  for (let i = 0; i < rows.length; i++) {
    ticker.tick();
    const r = reduceByA(acc, rows[i], 0, pivots, nA, ncols);
    const e = r && echelonRow(eacc, r, echelonPivots, ncols - nA);
    if (e) {
      out.push(e);
      from.push(i);
    }
  }
  return { rows: out, from };
}

/// The B-part of one row reduced by the reducer rows of M, in TypeScript: a sparse row, or a
/// dense one (residues in [0, p) by column of the combined numbering, length ncols).
export function reduceRowTS(p: number, M: Pick<F4Matrix, "pivots" | "nA" | "ncols">, row: SparseRow | Float64Array): SparseRow | null {
  const acc = new Accumulator(p, M.ncols);
  return reduceByA(acc, row instanceof Float64Array ? sparseOfDense(row) : row, 0, M.pivots, M.nA, M.ncols);
}

/// `reduceTails` in TypeScript.
export function reduceTailsTS(p: number, M: F4Matrix, ticker: Ticker): (SparseRow | null)[] {
  const { pivots, rows, nA, ncols } = M;
  const acc = new Accumulator(p, ncols);
  return rows.map((row) => {
    ticker.tick();
    return row.len > 1 ? reduceByA(acc, row, 1, pivots, nA, ncols) : null;
  });
}
