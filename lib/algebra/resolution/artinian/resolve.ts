import { AlgebraError } from "../../errors";
import { Echelon, kernelBasis } from "../../graded/echelon";
import { type Ideal, idealGroebnerBasis } from "../../ideal/ideal";
import { add, monomial, mul, zero } from "../../poly/checked";
import { type Poly } from "../../poly/poly";
import { checkLimit, checkpoint, type ComputeOptions } from "../../options";
import { FiniteAlgebra } from "../../artinian/algebra";

/// A minimal free resolution over a local Artinian ring, truncated at `length`.
export interface LocalResolution {
  /// β_0 … β_length (β_i = rank F_i).
  ranks: number[];
  /// True when F_length = 0 (the resolution ended inside the bound).
  complete: boolean;
  /// d_i : F_i → F_{i−1} for i = 1…, entries polynomials in standard monomials of the algebra.
  maps: Poly[][][];
}

/// The minimal free resolution of A/I over a local Artinian algebra A = S/Q (Q of finite
/// colength, A local at the origin), ungraded, by linear algebra on A as a k-vector space:
/// with K_i ⊆ F_i the kernel of d_i (K_0 = I·A), the minimal generators of K_i are a basis of
/// a complement of m·K_i in K_i, and their number is dim_k K_i/m·K_i (Nakayama's lemma;
/// common practice). dim_k K_{i+1} = rank F_{i+1} · dim A − dim K_i by exactness.
export function resolveLocalArtinian(Q: Ideal, I: Ideal, length: number, opts?: ComputeOptions): LocalResolution {
  if (!Number.isInteger(length) || length < 0) throw new AlgebraError("runtime", "resolution: the length must be a non-negative integer");
  const A = new FiniteAlgebra(Q.ring, Q, opts);
  const S = Q.ring;
  const K = A.K;
  const N = A.dim;
  const n = S.vars.length;
  // Every basis monomial but 1 is x_v times an earlier one (the basis is an order ideal grown
  // by degree): how to reach it.
  const steps = A.basis.map((u, k) => {
    if (k === 0) return null;
    const v = u.findIndex((e) => e > 0);
    const w = u.slice();
    w[v]--;
    return { v, from: A.basis.findIndex((b) => b.every((e, i) => e === w[i])) };
  });
  /// u·g for every basis monomial u, g ∈ A^r (r blocks of N coordinates).
  const multiples = (g: readonly unknown[], r: number): unknown[][] => {
    const out: unknown[][] = [g.slice()];
    for (let k = 1; k < N; k++) {
      const { v, from } = steps[k]!;
      const src = out[from];
      const img: unknown[] = [];
      for (let p = 0; p < r; p++) img.push(...A.mulVector(v, src.slice(p * N, (p + 1) * N)));
      out.push(img);
    }
    return out;
  };
  const toPolys = (g: readonly unknown[], r: number): Poly[] =>
    Array.from({ length: r }, (_, p) => {
      let f = zero(S);
      for (let k = 0; k < N; k++) {
        const c = g[p * N + k];
        if (K.isZero(c)) continue;
        const q = K.toRational(c);
        f = add(S, f, monomial(S, A.basis[k], q.num, q.den));
      }
      return f;
    });

  // K_0 = I·A inside F_0 = A.
  let kernel = new Echelon<unknown>(K, N);
  for (const g of idealGroebnerBasis(I, opts)) {
    for (const u of A.basis) kernel.insert(A.coordinates(mul(S, g, monomial(S, u))));
  }
  const ranks = [1];
  const maps: Poly[][][] = [];
  let r = 1;
  for (let i = 0; i < length; i++) {
    checkpoint(opts, { stage: "resolution over a local Artinian ring", detail: `homological degree ${i + 1}`, fraction: i / length });
    // m·K_i, then a complement of it in K_i: the minimal generators.
    const mK = new Echelon<unknown>(K, r * N);
    for (const b of kernel.rows) {
      for (let v = 0; v < n; v++) {
        const img: unknown[] = [];
        for (let p = 0; p < r; p++) img.push(...A.mulVector(v, b.slice(p * N, (p + 1) * N)));
        mK.insert(img);
      }
    }
    const gens: unknown[][] = [];
    for (const b of kernel.rows) if (mK.insert(b)) gens.push(b);
    const next = gens.length;
    ranks.push(next);
    maps.push(Array.from({ length: r }, (_, p) => gens.map((g) => toPolys(g, r)[p])));
    if (next === 0) {
      for (let k = i + 2; k <= length; k++) ranks.push(0);
      return { ranks, complete: true, maps };
    }
    checkLimit(opts, "maxBasisSize", next * N, "a free module of the resolution (as a vector space)");
    // K_{i+1} = ker(F_{i+1} → F_i), F_{i+1} with basis u·e_g.
    const images: unknown[][] = [];
    for (const g of gens) images.push(...multiples(g, r));
    const ker = kernelBasis(K, r * N, images, () => checkpoint(opts));
    if (ker.length !== next * N - kernel.rank) throw new AlgebraError("runtime", "resolution: internal inconsistency (kernel dimension)");
    // coordinates of F_{i+1}: generator-major (g, u) — the order `images` was built in
    kernel = new Echelon<unknown>(K, next * N);
    for (const z of ker) kernel.insert(z);
    r = next;
  }
  return { ranks, complete: false, maps };
}
