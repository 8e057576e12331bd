import { runtimeError } from "../errors";
import { componentAtOrigin, originIdeal } from "../artinian/origin";
import { FiniteAlgebra } from "../artinian/algebra";
import { type Ideal } from "../ideal/ideal";
import { idealColon, idealColonElement } from "../ideal/colon";
import { idealEquals, idealIsSubset } from "../ideal/compare";
import { idealIsHomogeneous } from "../ideal/invariants";
import { idealPower, idealProduct } from "../ideal/arith";
import { add, constant, formatPoly, mul, variable, zero } from "../poly/checked";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { checkpoint, type ComputeOptions } from "../options";
import { cutByLinearForm } from "./substitute";

// H. Dao, T. Kobayashi, R. Takahashi, "Burch ideals and Burch rings", Algebra & Number
// Theory 14 (2020): an ideal I of a local ring (S, m) is Burch when m·I ≠ m·(I : m); a
// local ring of depth t is Burch when, after factoring out a maximal regular sequence, its
// completion is S/I with S regular local and I a Burch ideal (their Definitions 2.1 and
// 2.7, cited from memory). The Burch index: H. Dao, D. Eisenbud, "Burch index, summands of
// syzygies and linearity in resolutions", Bull. Iranian Math. Soc. 49 (2023), arXiv
// 2208.05427, checked against their introduction: for R = S/I of depth 0, S regular local
// with maximal ideal n, n² ⊆ In : (I : n) ⊆ n and Burch_S(R) = dim_k n/(In : (I : n)); R is
// Burch in the sense of DKT exactly when this index is ≥ 1, and (DKT, as quoted there) a
// depth-0 ring is Burch if and only if k is a direct summand of the second syzygy of k; for
// positive depth the index is defined by reducing to depth 0. m·(I : m) ⊄ m·I exactly when
// m ⊄ (m·I) : (I : m) = B(I), so the index lies between 0 and the number of variables.

/// The Burch ideal B(I) = (m·I) : (I : m), m the ideal of the origin. For I not homogeneous,
/// I is first replaced by its component at the origin (the ideal of the local ring there).
export function burchIdeal(I: Ideal, opts?: ComputeOptions): Ideal {
  const J = idealIsHomogeneous(I) ? I : componentAtOrigin(I, opts).ideal;
  const m = originIdeal(J);
  return idealColon(idealProduct(m, J, opts), idealColon(J, m, opts), opts);
}

/// dim_k m/B(I) by the definition (no regular sequence is factored out).
export function burchIndexOfIdeal(I: Ideal, opts?: ComputeOptions): number {
  const B = burchIdeal(I, opts);
  return new FiniteAlgebra(B.ring, B, opts).dim - 1;
}

/// The Burch index of R = S/I at the origin, for I ⊆ m² (a minimal presentation).
export interface BurchIndex {
  index: number;
  isBurch: boolean;
  /// The depth of R at the origin (the number of linear forms factored out).
  depth: number;
  /// Set when linear forms were chosen at random to reach depth 0.
  random: { seed: number; forms: string[] } | null;
}

/// In depth 0 the index of I itself; in positive depth, general linear forms (random, from
/// `seed`) that are regular on R are factored out one at a time until depth 0, and the
/// index of the resulting ideal is returned, marked as depending on a random choice.
export function burchIndexOfRing(I: Ideal, opts?: ComputeOptions & { seed?: number }): BurchIndex {
  const seed = opts?.seed ?? 1;
  const next = lcg(seed);
  const S = I.ring;
  let J = idealIsHomogeneous(I) ? I : componentAtOrigin(I, opts).ideal;
  if (!idealIsSubset(J, idealPower(originIdeal(J), 2, opts), opts)) {
    throw runtimeError("burch_index", "the presentation is not minimal: the ideal has an element of order 1 at the origin");
  }
  const forms: string[] = [];
  let T: PolyRing = S;
  for (;;) {
    checkpoint(opts, { stage: "Burch index", detail: `depth ${forms.length}` });
    const m = originIdeal(J);
    if (!idealEquals(idealColon(J, m, opts), J, opts)) break;
    if (T.vars.length === 0) throw runtimeError("burch_index", "the ring is zero");
    let found = false;
    for (let attempt = 0; attempt < 20 && !found; attempt++) {
      const a = T.vars.map(() => BigInt(1 + (next() % 30011)));
      const l = linearForm(T, a);
      if (!idealEquals(idealColonElement(J, l, opts), J, opts)) continue;
      forms.push(formatPoly(T, l));
      const cut = cutByLinearForm(J, a);
      J = cut.ideal;
      T = cut.ring;
      found = true;
    }
    if (!found) throw runtimeError("burch_index", "no regular linear form was found (the field may be too small)");
  }
  const index = burchIndexOfIdeal(J, opts);
  return { index, isBurch: index >= 1, depth: forms.length, random: forms.length > 0 ? { seed, forms } : null };
}

function linearForm(T: PolyRing, a: readonly bigint[]): Poly {
  let l = zero(T);
  a.forEach((c, i) => (l = add(T, l, mul(T, constant(T, c), variable(T, i)))));
  return l;
}

/// A small deterministic generator (Park–Miller minimal standard, common practice).
function lcg(seed: number): () => number {
  let s = (Math.abs(Math.floor(seed)) % 2147483646) + 1;
  return () => (s = (s * 48271) % 2147483647);
}

