import type { Coeffs } from "../field/coeffs";

/// A semi-echelon basis of a subspace of K^dim: each stored row has a pivot equal to 1
/// and is zero at the pivots of the rows stored before it, so reducing a vector against
/// the rows in insertion order clears every pivot (Gaussian elimination, common practice).
export class Echelon<C> {
  readonly rows: C[][] = [];
  readonly pivots: number[] = [];
  /// Optional: for every row, the combination of inserted vectors it came from.
  readonly combos: C[][] = [];

  /// Set for GF(p) with p < 2^26, where a·b + c is exact in a double: the hot loops then
  /// use plain number arithmetic.
  private readonly p: number;

  constructor(
    readonly K: Coeffs<C>,
    readonly dim: number,
  ) {
    const F = K.field;
    this.p = F.kind === "gf" && F.p < 1 << 26 ? F.p : 0;
  }

  /// w ← w − c·row over the field.
  private axpy(w: C[], c: C, row: readonly C[]): void {
    const K = this.K;
    if (this.p) {
      const p = this.p,
        nc = p - (c as number);
      const ww = w as unknown as number[],
        rr = row as unknown as number[];
      for (let k = 0; k < ww.length; k++) {
        const a = rr[k];
        if (a !== 0) ww[k] = (ww[k] + nc * a) % p;
      }
      return;
    }
    for (let k = 0; k < w.length; k++) {
      const a = row[k];
      if (!K.isZero(a)) w[k] = K.sub(w[k], K.mul(c, a));
    }
  }

  get rank(): number {
    return this.rows.length;
  }

  /// v minus its projection on the span (a copy; v is not changed).
  reduce(v: readonly C[]): C[] {
    const K = this.K;
    const w = v.slice();
    for (let r = 0; r < this.rows.length; r++) {
      const c = w[this.pivots[r]];
      if (!K.isZero(c)) this.axpy(w, c, this.rows[r]);
    }
    return w;
  }

  /// Adds v to the span; false when v already lies in it.
  insert(v: readonly C[]): boolean {
    const w = this.reduce(v);
    const p = w.findIndex((a) => !this.K.isZero(a));
    if (p < 0) return false;
    this.pushNormalized(w, p);
    return true;
  }

  private pushNormalized(w: C[], p: number, combo?: C[]): void {
    const K = this.K;
    const inv = K.inv(w[p]);
    for (let k = 0; k < w.length; k++) if (!K.isZero(w[k])) w[k] = K.mul(w[k], inv);
    if (combo) for (let k = 0; k < combo.length; k++) if (!K.isZero(combo[k])) combo[k] = K.mul(combo[k], inv);
    this.rows.push(w);
    this.pivots.push(p);
    if (combo) this.combos.push(combo);
  }

  /// Inserts v tracking its combination; returns the combination when v reduces to 0.
  insertTracked(v: readonly C[], combo: C[]): C[] | null {
    const K = this.K;
    const w = v.slice();
    for (let r = 0; r < this.rows.length; r++) {
      const c = w[this.pivots[r]];
      if (K.isZero(c)) continue;
      this.axpy(w, c, this.rows[r]);
      this.axpy(combo, c, this.combos[r]);
    }
    const p = w.findIndex((a) => !K.isZero(a));
    if (p < 0) return combo;
    this.pushNormalized(w, p, combo);
    return null;
  }
}

/// A basis of the kernel of the linear map sending the j-th unit vector of K^src to
/// images[j] (vectors of length tgt); `tick` is called once per column.
export function kernelBasis<C>(K: Coeffs<C>, tgt: number, images: readonly (readonly C[])[], tick?: () => void): C[][] {
  const E = new Echelon(K, tgt);
  const out: C[][] = [];
  const src = images.length;
  images.forEach((v, j) => {
    tick?.();
    const combo = new Array<C>(src).fill(K.zero);
    combo[j] = K.one;
    const z = E.insertTracked(v, combo);
    if (z) out.push(z);
  });
  return out;
}

/// The rank of a list of vectors.
export function rankOf<C>(K: Coeffs<C>, dim: number, vectors: readonly (readonly C[])[]): number {
  const E = new Echelon(K, dim);
  for (const v of vectors) E.insert(v);
  return E.rank;
}
