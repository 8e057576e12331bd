import type { Coeffs } from "../../field/coeffs";
import type { GradedQuotient, SparseColumn } from "../../graded/piece";
import type { Accumulator } from "../../graded/sparse-echelon";
import { multidegreeKey, WHOLE_DEGREE, type BlockKey } from "./multidegree";

/// A sparse vector: (index, coefficient) pairs.
export type Sparse<C> = SparseColumn<C>;

/// How the coordinates of one degree j of a free module are grouped: by multidegree when
/// the module is Z^n-graded (then every map of the resolution respects the groups), else
/// in one group (WHOLE_DEGREE).
export interface Layout {
  /// Global coordinate indices of each group, increasing.
  blocks: Map<BlockKey, number[]>;
  /// For every global index, its position inside its group.
  local: Int32Array;
  /// For every global index, the generator it belongs to.
  generator: Int32Array;
  offsets: number[];
}

/// A graded free module ⊕_g A(−a_g) over the graded pieces of a ring A. An element of
/// degree j has coordinates over the concatenated bases of A_{j − a_g}; elements are kept
/// sparse, and dense only inside one group of a Layout (small when multigraded).
export class GradedFree<C> {
  /// For every generator, its image under the differential (a sparse vector of the target
  /// in the generator's degree); empty for the last module built.
  readonly boundary: Sparse<C>[] = [];
  readonly degrees: number[] = [];
  /// Multidegrees of the generators, when the module is multigraded.
  readonly multidegrees: number[][] = [];
  private readonly layouts = new Map<number, Layout>();

  constructor(
    readonly A: GradedQuotient<C>,
    readonly multigraded: boolean,
  ) {}

  get K(): Coeffs<C> {
    return this.A.K;
  }

  addGenerator(degree: number, boundary: Sparse<C>, multidegree?: number[]): void {
    if (this.layouts.size > 0) this.layouts.clear();
    this.degrees.push(degree);
    this.boundary.push(boundary);
    this.multidegrees.push(multidegree ?? []);
  }

  get rank(): number {
    return this.degrees.length;
  }

  offsets(j: number): number[] {
    return this.layout(j).offsets;
  }

  dim(j: number): number {
    let s = 0;
    for (const a of this.degrees) s += this.A.dim(j - a);
    return s;
  }

  layout(j: number): Layout {
    let L = this.layouts.get(j);
    if (L) return L;
    const offsets: number[] = [];
    let s = 0;
    for (const a of this.degrees) {
      offsets.push(s);
      s += this.A.dim(j - a);
    }
    offsets.push(s);
    const blocks = new Map<BlockKey, number[]>();
    const local = new Int32Array(s);
    const generator = new Int32Array(s);
    this.degrees.forEach((a, g) => {
      if (j - a < 0) return;
      const B = this.A.basis(j - a);
      const md = this.multidegrees[g];
      for (let k = 0; k < B.length; k++) {
        const idx = offsets[g] + k;
        const key = this.multigraded ? multidegreeKey(B[k].map((e, v) => e + md[v])) : WHOLE_DEGREE;
        let blk = blocks.get(key);
        if (!blk) blocks.set(key, (blk = []));
        local[idx] = blk.length;
        generator[idx] = g;
        blk.push(idx);
      }
    });
    L = { blocks, local, generator, offsets };
    this.layouts.set(j, L);
    return L;
  }

  /// Adds c·x_v·(global coordinate idx of degree j) into the dense vector `out` of the
  /// group of degree j + w_v (positions from that degree's layout).
  private addMulVar(v: number, j: number, idx: number, c: C, out: C[], L: Layout, T: Layout): void {
    const K = this.K;
    const g = L.generator[idx];
    const col = this.A.mulVar(v, j - this.degrees[g])[idx - L.offsets[g]];
    const at = T.offsets[g];
    for (let r = 0; r < col.idx.length; r++) {
      const p = T.local[at + col.idx[r]];
      out[p] = K.add(out[p], K.mul(c, col.val[r]));
    }
  }

  /// x_v · w for w a dense vector of group `from` of degree j, as a dense vector of group
  /// `to` of degree j + w_v (of size `size`).
  mulVarBlock(v: number, j: number, from: readonly number[], w: readonly C[], size: number): C[] {
    const K = this.K;
    const L = this.layout(j),
      T = this.layout(j + this.A.weights[v]);
    const out = new Array<C>(size).fill(K.zero);
    for (let k = 0; k < w.length; k++) if (!K.isZero(w[k])) this.addMulVar(v, j, from[k], w[k], out, L, T);
    return out;
  }

  /// Adds x_v · w into `out` (coordinates: the positions in the group of degree j + w_v),
  /// for w sparse over the positions of group `from` of degree j: its entries are
  /// idx/val[lo … hi) (a row of a SparseEchelon's pool).
  mulVarSparseInto(
    v: number,
    j: number,
    from: readonly number[],
    wIdx: readonly number[],
    wVal: readonly C[],
    lo: number,
    hi: number,
    out: Accumulator<C>,
  ): void {
    const K = this.K;
    const L = this.layout(j),
      T = this.layout(j + this.A.weights[v]);
    for (let k = lo; k < hi; k++) {
      const idx = from[wIdx[k]],
        c = wVal[k];
      const g = L.generator[idx];
      const col = this.A.mulVar(v, j - this.degrees[g])[idx - L.offsets[g]];
      const at = T.offsets[g];
      for (let r = 0; r < col.idx.length; r++) out.add(T.local[at + col.idx[r]], K.mul(c, col.val[r]));
    }
  }

  /// x_v · w for a sparse w of degree j, as a sparse vector of degree j + w_v.
  mulVarSparse(v: number, j: number, w: Sparse<C>): Sparse<C> {
    const K = this.K;
    const L = this.layout(j);
    const acc = new Map<number, C>();
    for (let k = 0; k < w.idx.length; k++) {
      const g = L.generator[w.idx[k]];
      const col = this.A.mulVar(v, j - this.degrees[g])[w.idx[k] - L.offsets[g]];
      const at = this.offsets(j + this.A.weights[v])[g];
      for (let r = 0; r < col.idx.length; r++) {
        const p = at + col.idx[r];
        acc.set(p, K.add(acc.get(p) ?? K.zero, K.mul(w.val[k], col.val[r])));
      }
    }
    return compact(K, acc);
  }
}

/// A sparse vector from an accumulator, zeros dropped, indices increasing.
export function compact<C>(K: Coeffs<C>, acc: Map<number, C>): Sparse<C> {
  const idx = [...acc.keys()].filter((p) => !K.isZero(acc.get(p)!)).sort((a, b) => a - b);
  return { idx, val: idx.map((p) => acc.get(p)!) };
}

/// The dense vector of group `T` of `layout` holding the sparse vector w.
export function densify<C>(K: Coeffs<C>, w: Sparse<C>, L: Layout, size: number): C[] {
  const out = new Array<C>(size).fill(K.zero);
  for (let k = 0; k < w.idx.length; k++) out[L.local[w.idx[k]]] = w.val[k];
  return out;
}

/// The sparse global vector of a dense vector of one group.
export function sparsify<C>(K: Coeffs<C>, w: readonly C[], block: readonly number[]): Sparse<C> {
  const out: Sparse<C> = { idx: [], val: [] };
  for (let k = 0; k < w.length; k++) {
    if (K.isZero(w[k])) continue;
    out.idx.push(block[k]);
    out.val.push(w[k]);
  }
  return out;
}
