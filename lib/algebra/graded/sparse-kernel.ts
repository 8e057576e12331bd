import type { Coeffs } from "../field/coeffs";
import type { SparseRow } from "./sparse-echelon";

/// A basis of the kernel of the linear map sending the j-th unit vector of K^src to
/// images[j] (sparse vectors of K^tgt), as sparse vectors of K^src: kernelBasis of
/// echelon.ts with sparse rows and sparse combinations. The dense form keeps one combination
/// of length src per stored row (src × rank numbers); these are mostly zero, and for the
/// largest graded pieces of a resolution that was most of the memory. Gaussian elimination
/// tracking the combinations (common practice); `tick` is called once per image.
export function sparseKernelBasis<C>(
  K: Coeffs<C>,
  tgt: number,
  src: number,
  images: readonly SparseRow<C>[],
  tick?: () => void,
): SparseRow<C>[] {
  const w = new Array<C>(tgt).fill(K.zero);
  const z = new Array<C>(src).fill(K.zero);
  const rows: SparseRow<C>[] = [],
    combos: SparseRow<C>[] = [],
    pivots: number[] = [];
  const out: SparseRow<C>[] = [];
  const gather = (acc: C[], touched: number[]): SparseRow<C> => {
    touched.sort((a, b) => a - b);
    const idx: number[] = [],
      val: C[] = [];
    let last = -1;
    for (const k of touched) {
      if (k === last) continue;
      last = k;
      const a = acc[k];
      if (!K.isZero(a)) {
        idx.push(k);
        val.push(a);
      }
      acc[k] = K.zero;
    }
    return { idx, val };
  };
  images.forEach((v, j) => {
    tick?.();
    const tw: number[] = [],
      tz: number[] = [j];
    for (let k = 0; k < v.idx.length; k++) {
      w[v.idx[k]] = v.val[k];
      tw.push(v.idx[k]);
    }
    z[j] = K.one;
    for (let r = 0; r < rows.length; r++) {
      const c = w[pivots[r]];
      if (K.isZero(c)) continue;
      const row = rows[r],
        combo = combos[r];
      for (let k = 0; k < row.idx.length; k++) {
        const i = row.idx[k];
        w[i] = K.sub(w[i], K.mul(c, row.val[k]));
        tw.push(i);
      }
      for (let k = 0; k < combo.idx.length; k++) {
        const i = combo.idx[k];
        z[i] = K.sub(z[i], K.mul(c, combo.val[k]));
        tz.push(i);
      }
    }
    const row = gather(w, tw),
      combo = gather(z, tz);
    if (row.idx.length === 0) {
      out.push(combo);
      return;
    }
    const inv = K.inv(row.val[0]);
    for (let k = 0; k < row.val.length; k++) row.val[k] = K.mul(row.val[k], inv);
    for (let k = 0; k < combo.val.length; k++) combo.val[k] = K.mul(combo.val[k], inv);
    rows.push(row);
    combos.push(combo);
    pivots.push(row.idx[0]);
  });
  return out;
}
