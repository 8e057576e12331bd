import type { Coeffs } from "../field/coeffs";

/// A sparse vector of K^dim: increasing indices with nonzero coefficients.
export interface SparseRow<C> {
  idx: number[];
  val: C[];
}

/// The semi-echelon basis of Echelon (echelon.ts) with sparse rows: each stored row has a
/// pivot equal to 1 and is zero at the pivots of the rows stored before it, so one pass in
/// insertion order reduces a vector (Gaussian elimination, common practice). Vectors are
/// reduced in one dense accumulator of the Echelon's own (cleared after every use), so the
/// memory is that of the nonzero entries, not rank × dim — the kernels of a resolution over
/// a quotient ring are sparse (products of syzygies by variables). Over GF(p), p < 2^26, the
/// hot loop is plain number arithmetic.
export class SparseEchelon<C> {
  readonly rows: SparseRow<C>[] = [];
  readonly pivots: number[] = [];
  private readonly acc: C[];
  private readonly p: number;

  constructor(
    readonly K: Coeffs<C>,
    readonly dim: number,
  ) {
    const F = K.field;
    this.p = F.kind === "gf" && F.p < 1 << 26 ? F.p : 0;
    this.acc = new Array<C>(dim).fill(K.zero);
  }

  get rank(): number {
    return this.rows.length;
  }

  /// The accumulator to fill before `insertAccumulated` (all zero when handed out).
  get accumulator(): C[] {
    return this.acc;
  }

  /// Adds the vector held in the accumulator to the span (and clears the accumulator);
  /// false when it already lies in the span.
  insertAccumulated(): boolean {
    const K = this.K,
      w = this.acc;
    if (this.p) {
      const p = this.p,
        ww = w as unknown as number[];
      for (let r = 0; r < this.rows.length; r++) {
        const c = ww[this.pivots[r]] % p;
        if (c === 0) continue;
        const nc = p - c,
          row = this.rows[r] as unknown as SparseRow<number>;
        const idx = row.idx,
          val = row.val;
        for (let k = 0; k < idx.length; k++) ww[idx[k]] = (ww[idx[k]] + nc * val[k]) % p;
      }
    } else {
      for (let r = 0; r < this.rows.length; r++) {
        const c = w[this.pivots[r]];
        if (K.isZero(c)) continue;
        const row = this.rows[r];
        for (let k = 0; k < row.idx.length; k++) w[row.idx[k]] = K.sub(w[row.idx[k]], K.mul(c, row.val[k]));
      }
    }
    let lead = -1;
    const idx: number[] = [],
      val: C[] = [];
    for (let k = 0; k < w.length; k++) {
      const a = w[k];
      if (K.isZero(a)) continue;
      if (lead < 0) lead = k;
      idx.push(k);
      val.push(a);
      w[k] = K.zero;
    }
    if (lead < 0) return false;
    const inv = K.inv(val[0]);
    for (let k = 0; k < val.length; k++) val[k] = K.mul(val[k], inv);
    this.rows.push({ idx, val });
    this.pivots.push(lead);
    return true;
  }

  /// Adds a sparse vector to the span; false when it already lies in it.
  insert(v: SparseRow<C>): boolean {
    for (let k = 0; k < v.idx.length; k++) this.acc[v.idx[k]] = v.val[k];
    return this.insertAccumulated();
  }

  /// Adds a dense vector to the span; false when it already lies in it.
  insertDense(v: readonly C[]): boolean {
    for (let k = 0; k < v.length; k++) this.acc[k] = v[k];
    return this.insertAccumulated();
  }
}
