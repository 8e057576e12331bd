import type { Coeffs } from "../field/coeffs";
import { PositionHeap } from "./position-heap";

/// A sparse vector of K^dim: increasing indices with nonzero coefficients.
export interface SparseRow<C> {
  idx: number[];
  val: C[];
}

/// Something sparse vectors can be added into one coordinate at a time.
export interface Accumulator<C> {
  /// Adds c to coordinate k.
  add(k: number, c: C): void;
}

/// An echelon basis of a subspace of K^dim with sparse rows: each stored row starts at its
/// pivot (its first nonzero index) with coefficient 1, the pivots are distinct and every
/// row is zero at the pivots that existed when it was stored. A vector is reduced by
/// walking its nonzero coordinates in increasing order and clearing each one that is a
/// pivot with that pivot's row (rows only reach further right, so a cleared coordinate
/// stays cleared): Gaussian elimination, common practice. The set of pivots is that of any
/// echelon basis of the span (the first nonzero indices of its vectors), so it does not
/// depend on the order of insertion.
///
/// The work of one insertion is the arithmetic it does: the pivot of a coordinate is looked
/// up in a table and the coordinates still to visit are kept in a heap, instead of testing
/// every stored row and scanning all dim coordinates per vector (that was 80 % of the time
/// of the residue field over the Anick-shaped ring, whose products of syzygies by variables
/// have one or two entries). Vectors are accumulated densely in one array of the basis'
/// own, cleared as they are read. Over GF(p), p < 2^26, the hot loop is plain number
/// arithmetic.
export class SparseEchelon<C> implements Accumulator<C> {
  readonly pivots: number[] = [];
  /// The rows, one after the other (no object per row: a kernel basis has hundreds of
  /// thousands of rows of one or two entries, and per-row arrays were most of the garbage):
  /// row r is idx/val[start[r] … start[r + 1]), its first entry the pivot with value 1.
  readonly idx: number[] = [];
  readonly val: C[] = [];
  readonly start: number[] = [0];
  /// For every coordinate, the row whose pivot it is, else −1.
  private readonly pivotRow: Int32Array;
  private readonly acc: C[];
  private readonly heap: PositionHeap;
  private readonly p: number;

  constructor(
    readonly K: Coeffs<C>,
    readonly dim: number,
  ) {
    const F = K.field;
    this.p = F.kind === "gf" && F.p < 1 << 26 ? F.p : 0;
    this.acc = new Array<C>(dim).fill(K.zero);
    this.pivotRow = new Int32Array(dim).fill(-1);
    this.heap = new PositionHeap(dim);
  }

  get rank(): number {
    return this.pivots.length;
  }

  /// The rows as separate sparse vectors (a copy, for inspection).
  get rows(): SparseRow<C>[] {
    return this.pivots.map((_, r) => ({
      idx: this.idx.slice(this.start[r], this.start[r + 1]),
      val: this.val.slice(this.start[r], this.start[r + 1]),
    }));
  }

  /// Adds c to coordinate k of the vector being accumulated (for `insertAccumulated`).
  add(k: number, c: C): void {
    // over GF(p) plain sums (exact in a double), reduced when the coordinate is visited
    if (this.p) (this.acc as unknown as number[])[k] += c as unknown as number;
    else this.acc[k] = this.K.add(this.acc[k], c);
    this.heap.push(k);
  }

  /// Adds the vector accumulated by `add` to the span (and clears the accumulator); false
  /// when it already lies in the span. The reduced vector is written straight after the
  /// last row and kept there only when it is not zero.
  insertAccumulated(): boolean {
    const from = this.idx.length;
    if (this.p) this.reduceGF();
    else this.reduceGeneric();
    const to = this.idx.length;
    if (to === from) return false;
    const K = this.K,
      val = this.val;
    if (!K.isOne(val[from])) {
      const inv = K.inv(val[from]);
      for (let k = from; k < to; k++) val[k] = K.mul(val[k], inv);
    }
    this.pivotRow[this.idx[from]] = this.pivots.length;
    this.pivots.push(this.idx[from]);
    this.start.push(to);
    return true;
  }

  private reduceGF(): void {
    const p = this.p,
      w = this.acc as unknown as number[],
      heap = this.heap,
      pivotRow = this.pivotRow,
      start = this.start,
      idx = this.idx,
      val = this.val as unknown as number[];
    while (heap.size > 0) {
      const k = heap.pop();
      const a = w[k] % p;
      w[k] = 0;
      if (a === 0) continue;
      const r = pivotRow[k];
      if (r < 0) {
        idx.push(k);
        val.push(a);
        continue;
      }
      const nc = p - a;
      for (let t = start[r] + 1, end = start[r + 1]; t < end; t++) {
        const i = idx[t];
        w[i] = (w[i] + nc * val[t]) % p;
        heap.push(i);
      }
    }
  }

  private reduceGeneric(): void {
    const K = this.K,
      w = this.acc,
      heap = this.heap,
      pivotRow = this.pivotRow,
      start = this.start,
      idx = this.idx,
      val = this.val;
    while (heap.size > 0) {
      const k = heap.pop();
      const a = w[k];
      w[k] = K.zero;
      if (K.isZero(a)) continue;
      const r = pivotRow[k];
      if (r < 0) {
        idx.push(k);
        val.push(a);
        continue;
      }
      for (let t = start[r] + 1, end = start[r + 1]; t < end; t++) {
        const i = idx[t];
        w[i] = K.sub(w[i], K.mul(a, val[t]));
        heap.push(i);
      }
    }
  }

  /// Adds a sparse vector to the span; false when it already lies in it.
  insert(v: SparseRow<C>): boolean {
    for (let k = 0; k < v.idx.length; k++) this.add(v.idx[k], v.val[k]);
    return this.insertAccumulated();
  }

  /// Adds a dense vector to the span; false when it already lies in it.
  insertDense(v: readonly C[]): boolean {
    const K = this.K;
    for (let k = 0; k < v.length; k++) if (!K.isZero(v[k])) this.add(k, v[k]);
    return this.insertAccumulated();
  }
}
