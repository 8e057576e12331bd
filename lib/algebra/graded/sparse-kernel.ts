import type { Coeffs } from "../field/coeffs";
import { PositionHeap } from "./position-heap";
import type { SparseRow } from "./sparse-echelon";

/// A basis of the kernel of the linear map sending the j-th unit vector of K^src to
/// images[j] (sparse vectors of K^tgt), as sparse vectors of K^src: kernelBasis of
/// echelon.ts with sparse rows and sparse combinations. The dense form keeps one combination
/// of length src per stored row (src × rank numbers); these are mostly zero, and for the
/// largest graded pieces of a resolution that was most of the memory. Gaussian elimination
/// tracking the combinations (common practice), each image reduced like a vector of
/// SparseEchelon (sparse-echelon.ts): its coordinates visited in increasing order from a
/// heap, each pivot's row found in a table, so the work is the arithmetic done and not
/// rank + tgt per image. `tick` is called once per image.
export function sparseKernelBasis<C>(
  K: Coeffs<C>,
  tgt: number,
  src: number,
  images: readonly SparseRow<C>[],
  tick?: () => void,
): SparseRow<C>[] {
  const w = new Array<C>(tgt).fill(K.zero);
  const z = new Array<C>(src).fill(K.zero);
  // the positions of z touched, each listed once
  const inZ = new Uint8Array(src);
  const heap = new PositionHeap(tgt);
  const pivotRow = new Int32Array(tgt).fill(-1);
  const rows: SparseRow<C>[] = [],
    combos: SparseRow<C>[] = [];
  const out: SparseRow<C>[] = [];
  /// The combination accumulated in z at the positions touched, cleared.
  const gather = (list: number[]): SparseRow<C> => {
    // a typed array sorts numerically without a comparator call per step
    const touched = Int32Array.from(list).sort();
    const idx: number[] = [],
      val: C[] = [];
    for (const k of touched) {
      inZ[k] = 0;
      const a = z[k];
      if (!K.isZero(a)) {
        idx.push(k);
        val.push(a);
      }
      z[k] = K.zero;
    }
    return { idx, val };
  };
  images.forEach((v, j) => {
    tick?.();
    for (let k = 0; k < v.idx.length; k++) {
      w[v.idx[k]] = K.add(w[v.idx[k]], v.val[k]);
      heap.push(v.idx[k]);
    }
    const tz: number[] = [j];
    z[j] = K.one;
    inZ[j] = 1;
    const idx: number[] = [],
      val: C[] = [];
    while (heap.size > 0) {
      const k = heap.pop();
      const c = w[k];
      w[k] = K.zero;
      if (K.isZero(c)) continue;
      const r = pivotRow[k];
      if (r < 0) {
        idx.push(k);
        val.push(c);
        continue;
      }
      const row = rows[r],
        combo = combos[r];
      for (let t = 1; t < row.idx.length; t++) {
        const i = row.idx[t];
        w[i] = K.sub(w[i], K.mul(c, row.val[t]));
        heap.push(i);
      }
      for (let t = 0; t < combo.idx.length; t++) {
        const i = combo.idx[t];
        z[i] = K.sub(z[i], K.mul(c, combo.val[t]));
        if (!inZ[i]) {
          inZ[i] = 1;
          tz.push(i);
        }
      }
    }
    const combo = gather(tz);
    if (idx.length === 0) {
      out.push(combo);
      return;
    }
    const inv = K.inv(val[0]);
    for (let k = 0; k < val.length; k++) val[k] = K.mul(val[k], inv);
    for (let k = 0; k < combo.val.length; k++) combo.val[k] = K.mul(combo.val[k], inv);
    pivotRow[idx[0]] = rows.length;
    rows.push({ idx, val });
    combos.push(combo);
  });
  return out;
}
