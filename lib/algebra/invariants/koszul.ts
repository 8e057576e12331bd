import { runtimeError } from "../errors";
import { degree, isHomogeneous, isZero, neg, zero } from "../poly/checked";
import { ideal } from "../ideal/ideal";
import { idealCodimension } from "../ideal/invariants";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import type { ComputeOptions } from "../options";

/// A complex of graded free modules F_0 ← F_1 ← … ← F_length given by its differentials.
export interface FreeComplex {
  readonly ring: PolyRing;
  readonly ranks: readonly number[];
  readonly degrees: readonly (readonly number[])[];
  readonly length: number;
  map(i: number): Poly[][];
}

function subsetsOf(n: number, k: number): number[][] {
  if (k === 0) return [[]];
  const out: number[][] = [];
  for (let last = k - 1; last < n; last++) for (const s of subsetsOf(last, k - 1)) out.push([...s, last]);
  return out;
}

/// The Koszul complex K(f_1..f_n): F_i = ∧^i S^n with basis e_T (|T| = i, T increasing),
/// d(e_T) = Σ_k (−1)^k f_{t_k} e_{T∖t_k} (common practice).
/// The f must be homogeneous; F_i is graded by deg e_T = Σ_{t ∈ T} deg f_t.
export function koszulComplex(R: PolyRing, fs: readonly Poly[]): FreeComplex {
  const n = fs.length;
  fs.forEach((f, k) => {
    if (isZero(f)) throw runtimeError("koszulComplex", `element ${k + 1} is zero`);
  });
  const degs = fs.map((f) => degree(R, f));
  const bases = Array.from({ length: n + 1 }, (_, i) => subsetsOf(n, i));
  const index = bases.map((B) => new Map(B.map((T, p) => [T.join(","), p])));
  return Object.freeze({
    ring: R,
    ranks: Object.freeze(bases.map((B) => B.length)),
    degrees: Object.freeze(bases.map((B) => Object.freeze(B.map((T) => T.reduce((s, t) => s + degs[t], 0))))),
    length: n,
    map(i: number): Poly[][] {
      if (!Number.isInteger(i) || i < 1 || i > n) throw runtimeError("map", `the differentials are numbered 1…${n}, got ${i}`);
      const A = bases[i - 1].map(() => bases[i].map(() => zero(R)));
      bases[i].forEach((T, q) => {
        T.forEach((t, k) => {
          const a = index[i - 1].get(T.filter((_, x) => x !== k).join(",")) as number;
          A[a][q] = k % 2 === 0 ? fs[t] : neg(R, fs[t]);
        });
      });
      return A;
    },
  });
}

/// Whether homogeneous f_1..f_c of positive degree form a regular sequence: in the polynomial
/// ring (Cohen–Macaulay) this holds exactly when codim (f_1..f_c) = c, and then the Koszul
/// complex K(f) is exact (common practice).
export function isRegularSequence(R: PolyRing, fs: readonly Poly[], opts?: ComputeOptions): boolean {
  fs.forEach((f, k) => {
    if (isZero(f) || !isHomogeneous(R, f) || degree(R, f) <= 0) {
      throw runtimeError("isRegularSequence", `element ${k + 1} is not a homogeneous form of positive degree`);
    }
  });
  return idealCodimension(ideal(R, [...fs]), opts) === fs.length;
}
