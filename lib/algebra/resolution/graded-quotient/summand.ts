import { Echelon, kernelBasis } from "../../graded/echelon";
import type { Ideal } from "../../ideal/ideal";
import { checkpoint, type ComputeOptions } from "../../options";
import { variablesOf } from "./residue";
import { densify, type GradedFree, sparsify } from "./free";
import { type ModulePresentation, resolveDegreewise } from "./resolve";

/// Whether the residue field k is a direct summand of the p-th syzygy Ω^p(R/I) over
/// R = S/J (p ≥ 1; I = m for Ω^p k). A finitely generated graded module N has k as a direct
/// summand exactly when its socle (0 :_N m) is not inside m·N (common practice: a socle
/// element outside mN is a minimal generator spanning a copy of k that splits off).
/// Ω^p = K_{p−1} ⊆ F_{p−1} is read degree by degree from the resolution.
export function residueSplitsFromSyzygy(J: Ideal, p: number, I?: Ideal, opts?: ComputeOptions & { degree?: number }): boolean {
  let splits = false;
  resolveDegreewise({
    ring: J,
    module: I ?? variablesOf(J),
    length: p,
    degree: opts?.degree,
    opts,
    inspect: ({ i, j, F, block, kernel, decomposable }) => {
      if (i !== p - 1 || splits || kernel.rank === 0) return;
      const K = F.K;
      // The socle of K_j: combinations of the kernel rows killed by every variable. The
      // images x_v·b are sparse; their coordinates are numbered compactly.
      const position = new Map<string, number>();
      const sparse = kernel.rows.map((b) => {
        const w = sparsify(K, b, block);
        const out: { at: number; c: unknown }[] = [];
        for (let v = 0; v < F.A.n; v++) {
          const img = F.mulVarSparse(v, j, w);
          img.idx.forEach((x, k) => {
            const key = `${v}:${x}`;
            if (!position.has(key)) position.set(key, position.size);
            out.push({ at: position.get(key)!, c: img.val[k] });
          });
        }
        return out;
      });
      const images = sparse.map((entries) => {
        const d = new Array(position.size).fill(K.zero);
        for (const { at, c } of entries) d[at] = c;
        return d;
      });
      for (const c of kernelBasis(K, position.size, images)) {
        const s = new Array(block.length).fill(K.zero);
        c.forEach((x, r) => {
          if (K.isZero(x)) return;
          kernel.rows[r].forEach((y, k) => (s[k] = K.add(s[k], K.mul(x, y))));
        });
        if (decomposable.reduce(s).some((x) => !K.isZero(x))) splits = true;
      }
    },
  });
  return splits;
}

/// The socle of a module M = coker(A) over R = S/J (A a presentation, M of finite length or
/// R Artinian): the degrees of a basis of (0 :_M m), with multiplicity, and whether the
/// residue field is a direct summand of M (the socle is not inside m·M, as above). Computed
/// degree by degree: M_j = F_j / K_j with K = image of A, read from the resolution's first step.
/// null when the pieces computed cannot decide (M not of finite length over a ring that is not
/// Artinian): the caller may know more (a module of positive depth has no socle).
export function moduleSocle(
  J: Ideal,
  presentation: ModulePresentation,
  opts?: ComputeOptions,
): { degrees: number[]; splits: boolean } | null {
  const step = presentationKernels(J, presentation, opts);
  if (!step) return null;
  const degrees: number[] = [];
  let splits = false;
  const { F, kernels } = step;
  if (!F) return { degrees, splits };
  const top = Math.max(...kernels.keys());
  for (let j = Math.min(...F.degrees); j <= top; j++) {
    checkpoint(opts, { stage: "socle", detail: `degree ${j}` });
    const dim = F.dim(j);
    const Kj = kernels.get(j);
    if (dim === 0 || (Kj && Kj.rank === dim)) continue;
    const colon = colonByMaximalIdeal(F, kernels, j);
    const base = kernelPlusMaximalPart(F, Kj, j);
    const inK = new Echelon<unknown>(F.K, dim);
    if (Kj) for (const row of Kj.rows) inK.insert(row);
    for (const z of colon) {
      if (inK.insert(z)) degrees.push(j);
      if (base.reduce(z).some((x) => !F.K.isZero(x))) splits = true;
    }
  }
  return { degrees, splits };
}

/// The first step of the resolution of M = coker(A): the free module F it maps onto and, per
/// degree j, K_j = image of A in F_j as an echelon basis (F null when M has no generators).
/// null when the resolution did not compute every degree needed.
function presentationKernels(
  J: Ideal,
  presentation: ModulePresentation,
  opts?: ComputeOptions,
): { F: GradedFree<unknown> | null; kernels: Map<number, Echelon<unknown>> } | null {
  const kernels = new Map<number, Echelon<unknown>>();
  let Fm: GradedFree<unknown> | null = null;
  const r = resolveDegreewise<unknown>({
    ring: J,
    presentation,
    length: 1,
    opts,
    inspect: ({ i, j, F, kernel }) => {
      if (i !== 0) return;
      Fm = F;
      kernels.set(j, kernel);
    },
  });
  if (!r.complete && !r.columns.every((c) => c.complete)) return null;
  return { F: Fm as GradedFree<unknown> | null, kernels };
}

/// A basis of (K : m)_j ⊆ F_j: the kernel of v ↦ (x_v·v mod K_{j+w_v})_v on the unit vectors of F_j.
function colonByMaximalIdeal(F: GradedFree<unknown>, kernels: Map<number, Echelon<unknown>>, j: number): unknown[][] {
  const K = F.K;
  const A = F.A;
  const dim = F.dim(j);
  const images: unknown[][] = [];
  for (let k = 0; k < dim; k++) {
    const parts: unknown[] = [];
    for (let v = 0; v < A.n; v++) {
      const t = j + A.weights[v];
      const img = F.mulVarSparse(v, j, { idx: [k], val: [K.one] });
      const dense = densify(K, img, F.layout(t), F.dim(t));
      const low = kernels.get(t);
      parts.push(...(low ? low.reduce(dense) : dense));
    }
    images.push(parts);
  }
  return kernelBasis(K, images[0]?.length ?? 0, images);
}

/// K_j + (m·F)_j as an echelon basis of F_j: m·F is spanned by the coordinates u·g with u ≠ 1,
/// that is those of generators g of degree other than j.
function kernelPlusMaximalPart(F: GradedFree<unknown>, Kj: Echelon<unknown> | undefined, j: number): Echelon<unknown> {
  const K = F.K;
  const dim = F.dim(j);
  const base = new Echelon<unknown>(K, dim);
  if (Kj) for (const row of Kj.rows) base.insert(row);
  const offs = F.offsets(j);
  F.degrees.forEach((a, g) => {
    for (let k = offs[g]; k < offs[g + 1]; k++) {
      if (a === j) continue;
      const e = new Array(dim).fill(K.zero);
      e[k] = K.one;
      base.insert(e);
    }
  });
  return base;
}
