import { runtimeError } from "../errors";
import { componentAtOrigin, originIdeal } from "../artinian/origin";
import { FiniteAlgebra } from "../artinian/algebra";
import { type Ideal, idealGroebnerBasis } from "../ideal/ideal";
import { idealColon, idealColonElement } from "../ideal/colon";
import { idealEquals, idealIsSubset } from "../ideal/compare";
import { idealIsHomogeneous } from "../ideal/invariants";
import { idealPower, idealProduct, idealSum } from "../ideal/arith";
import { add, constant, formatPoly, mul, variable, zero } from "../poly/checked";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { checkpoint, type ComputeOptions } from "../options";
import { cutByLinearForm, eliminateByElement } from "./substitute";

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

/// dim_k m/B(I) at the origin for any I ⊆ m (no isolated point needed): B(I) is formed from
/// products and colons, which commute with localisation, and m² ⊆ B(I) locally (Dao–Eisenbud,
/// above), so m/B(I)_m = m/(B(I) + m²), a finite-dimensional space computed globally.
function burchIndexAtOrigin(I: Ideal, opts?: ComputeOptions): number {
  const m = originIdeal(I);
  const B = idealColon(idealProduct(m, I, opts), idealColon(I, m, opts), opts);
  const Q = idealSum(B, idealPower(m, 2, opts));
  return new FiniteAlgebra(Q.ring, Q, opts).dim - 1;
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
  // the origin's ring: every step below (colons, products, substitutions) commutes with
  // localisation at the origin, so I itself serves, isolated point or not
  let J = I;
  let T: PolyRing = S;
  // One rule for every presentation: linear forms in I are eliminated first (S/I ≅ S'/I'
  // with one variable fewer per form), so S/m and S/0 both reach the field k = k[]/0,
  // whose index is 0.
  for (;;) {
    if (idealIsSubset(J, idealPower(originIdeal(J), 2, opts), opts)) break;
    // an element a·x_c + h with h free of x_c (a linear form, or x − y^2 …) removes x_c
    let cut: { ideal: Ideal; ring: PolyRing } | null = null;
    for (const g of [...idealGroebnerBasis(J, opts), ...J.gens]) {
      cut = eliminateByElement(J, g);
      if (cut) break;
    }
    if (!cut) {
      throw runtimeError(
        "burch_index",
        "the ideal has an element of order 1 at the origin whose variable cannot be solved for polynomially; eliminating it needs power series, which are not implemented here",
      );
    }
    J = cut.ideal;
    T = cut.ring;
  }
  const forms: string[] = [];
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
  const index = idealIsHomogeneous(J) ? burchIndexOfIdeal(J, opts) : burchIndexAtOrigin(J, opts);
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
