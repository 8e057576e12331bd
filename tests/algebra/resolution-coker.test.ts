import { describe, expect, it } from "vitest";
import {
  ideal,
  idealHilbertSeries,
  isZero,
  leadExponents,
  monomial,
  neg,
  parsePoly,
  QQ,
  type Poly,
  type PolyRing,
  zero,
} from "@/lib/algebra";
import { freeModule, moduleGroebnerBasis } from "@/lib/algebra/module";
import {
  bettiAlternatingSum,
  bettiNumber,
  resolutionHilbertSeries,
  resolveCoker,
  resolveQuotient,
  syzygyPresentation,
} from "@/lib/algebra/resolution/schreyer";
import { expectMinimalComplex, GF, randomForm, ringOf, rng, vars } from "./resolution-helpers";

describe("resolutions of cokernels of homogeneous matrices", () => {
  it("a presentation with a unit entry is minimised: coker [[1, x], [0, y]] ≅ S/(y)", () => {
    // S^2/⟨e1, x·e1 + y·e2⟩ = S^2/⟨e1, y·e2⟩ ≅ S/(y) (direct computation).
    for (const F of [GF, QQ]) {
      const R = ringOf(F, 2);
      const [x, y] = vars(R);
      const C = resolveCoker(R, [
        [parsePoly(R, "1"), x],
        [zero(R), y],
      ]);
      expect(C.betti.entries).toEqual([
        [0, 0, 1],
        [1, 1, 1],
      ]);
      expectMinimalComplex(R, C);
    }
  });

  it("coker of the second Koszul map on x, y, z is the maximal ideal: Betti 3, 3, 1 in degrees 1, 2, 3", () => {
    // The Koszul complex 0 → S(−3) → S(−2)^3 → S(−1)^3 → S is exact, so coker(d_2) ≅ image(d_1) = m
    // (Koszul complex; common practice).
    const R = ringOf(GF, 3);
    const [x, y, z] = vars(R);
    const d2 = [
      [neg(R, y), neg(R, z), zero(R)],
      [x, zero(R), neg(R, z)],
      [zero(R), x, y],
    ];
    const C = resolveCoker(R, d2, [1, 1, 1]);
    expect(C.betti.entries).toEqual([
      [0, 1, 3],
      [1, 2, 3],
      [2, 3, 1],
    ]);
    expectMinimalComplex(R, C);
  });

  it("the Betti table of a direct sum is the sum of the Betti tables, with the shifts of the rows", () => {
    // Tor is additive: Tor_i(M ⊕ N, k) = Tor_i(M, k) ⊕ Tor_i(N, k), and M(−d) shifts j by d
    // (common practice).
    const R = ringOf(GF, 4);
    const I = ["x1*x3-x2^2", "x1*x4-x2*x3", "x2*x4-x3^2"].map((s) => parsePoly(R, s));
    const J = ["x1^2", "x2^3"].map((s) => parsePoly(R, s));
    const rows: Poly[][] = [
      [...I, zero(R), zero(R)],
      [zero(R), zero(R), zero(R), ...J],
    ];
    const C = resolveCoker(R, rows, [0, 3]);
    const sum = new Map<string, number>();
    for (const [shift, gens] of [
      [0, I],
      [3, J],
    ] as const) {
      for (const [i, j, b] of resolveQuotient(ideal(R, [...gens])).betti.entries) {
        sum.set(`${i},${j + shift}`, (sum.get(`${i},${j + shift}`) ?? 0) + b);
      }
    }
    expect(new Map(C.betti.entries.map(([i, j, b]) => [`${i},${j}`, b]))).toEqual(sum);
    expectMinimalComplex(R, C);
  });

  it("coker of a 1×m matrix [f_1 … f_m] has the Betti table of S/(f_1, …, f_m) (module and ideal paths agree)", () => {
    for (let seed = 1; seed <= 8; seed++) {
      const rand = rng(300 + seed);
      const R = ringOf(seed % 2 === 0 ? QQ : GF, 3 + (seed % 2));
      const gens = Array.from({ length: 3 }, () => randomForm(R, 2 + Math.floor(rand() * 2), 3, rand));
      const C = resolveCoker(R, [gens]);
      expect(C.betti.entries).toEqual(resolveQuotient(ideal(R, gens)).betti.entries);
      expectMinimalComplex(R, C);
    }
  });

  it("random presentations by linear forms give minimal complexes", () => {
    const rand = rng(77);
    for (let t = 0; t < 4; t++) {
      const R = ringOf(GF, 4);
      const A = Array.from({ length: 2 }, () => Array.from({ length: 3 }, () => randomForm(R, 1, 3, rand)));
      const C = resolveCoker(R, A);
      expect(C.ranks[0]).toBe(2);
      expectMinimalComplex(R, C);
    }
  });

  it("rejects inhomogeneous input", () => {
    const R = ringOf(GF, 2);
    expect(() => resolveCoker(R, [[parsePoly(R, "x1^2+x2")]])).toThrow(/homogeneous/);
    expect(() => resolveQuotient(ideal(R, [parsePoly(R, "x1^2+x2")]))).toThrow(/homogeneous/);
  });
});

describe("syzygy modules and minimal presentations", () => {
  it("Syz_p(M) is resolved by the tail of the resolution of M: β_{i,j}(Syz_p M) = β_{i+p,j}(M)", () => {
    // Truncating a minimal resolution at F_p gives a minimal resolution of the p-th syzygy module
    // (common practice; Eisenbud, The Geometry of Syzygies, Ch. 1).
    const R = ringOf(GF, 5);
    const M = resolveQuotient(
      ideal(
        R,
        ["x1*x3-x2^2", "x1*x4-x2*x3", "x2*x4-x3^2", "x5^2"].map((s) => parsePoly(R, s)),
      ),
    );
    for (let p = 0; p <= M.length; p++) {
      const { rows, rowDegrees } = syzygyPresentation(M, p);
      const S = resolveCoker(R, rows, rowDegrees);
      const shifted = M.betti.entries.filter(([i]) => i >= p).map(([i, j, b]) => [i - p, j, b]);
      expect(S.betti.entries).toEqual(shifted);
    }
  });
});

describe("Hilbert series of modules from their resolutions", () => {
  it("coker [f_1 … f_m] has the Hilbert series of S/(f_1, …, f_m); a direct sum adds them", () => {
    // The ideal's series comes from lib/algebra's initial-ideal computation (Macaulay), an
    // independent route; Hilbert series are additive on direct sums (common practice).
    const rand = rng(501);
    const R = ringOf(GF, 4);
    const f = Array.from({ length: 3 }, () => randomForm(R, 2, 3, rand));
    const g = [randomForm(R, 3, 4, rand)];
    const HI = idealHilbertSeries(ideal(R, f)),
      HJ = idealHilbertSeries(ideal(R, g));
    expect(resolutionHilbertSeries(resolveCoker(R, [f])).numerator).toEqual(HI.numerator);
    const rows = [
      [...f, zero(R)],
      [zero(R), zero(R), zero(R), ...g],
    ];
    const sum = resolutionHilbertSeries(resolveCoker(R, rows));
    const n = Math.max(HI.numerator.length, HJ.numerator.length);
    const add = Array.from({ length: n }, (_, k) => (HI.numerator[k] ?? 0n) + (HJ.numerator[k] ?? 0n));
    while (add.length > 0 && add[add.length - 1] === 0n) add.pop();
    expect(sum.numerator).toEqual(add);
    expect(sum.dimension).toBe(Math.max(HI.dimension, HJ.dimension));
  });
});

describe("Gröbner degeneration of modules", () => {
  it("β_{i,j}(coker A) ≤ β_{i,j}(F/in(image A)) and the alternating sums agree", () => {
    // F/U and F/in(U) have the same Hilbert function (Macaulay) and Betti numbers can only grow
    // under the flat degeneration to the initial module (common practice).
    const rand = rng(612);
    for (let t = 0; t < 4; t++) {
      const R = ringOf(GF, 3);
      const rowDegrees = [0, 0];
      const cols = Array.from({ length: 3 }, () => [randomForm(R, 2, 2, rand), randomForm(R, 2, 2, rand)]);
      const F = freeModule(R, rowDegrees);
      const G = moduleGroebnerBasis(F, cols);
      // the leading term of each basis vector, as a monomial vector
      const leads = G.map((v) => {
        const c = v.findIndex((f) => !isZero(f) && leadIsTop(R, v, f));
        return v.map((f, a) => (a === c ? monomial(R, leadExponents(R, f)) : zero(R)));
      });
      const C = resolveCoker(
        R,
        rowDegrees.map((_, a) => cols.map((c) => c[a])),
        rowDegrees,
      );
      const D = resolveCoker(
        R,
        rowDegrees.map((_, a) => leads.map((c) => c[a])),
        rowDegrees,
      );
      for (const [i, j, b] of C.betti.entries) expect(b).toBeLessThanOrEqual(bettiNumber(D.betti, i, j));
      expect(bettiAlternatingSum(C.betti)).toEqual(bettiAlternatingSum(D.betti));
    }
  });
});

/// Under term over position (e_1 > e_2 on ties) the leading term of v is the largest leading
/// monomial among its coordinates, the first coordinate winning ties.
function leadIsTop(R: PolyRing, v: Poly[], f: Poly): boolean {
  const cmp = (g: Poly, h: Poly) => sortPair(R, leadExponents(R, g), leadExponents(R, h));
  const k = v.indexOf(f);
  return v.every((g, a) => isZero(g) || a === k || (a < k ? cmp(f, g) > 0 : cmp(f, g) >= 0));
}

/// grevlex comparison of exponent vectors of equal degree (the ring's order; test rings are grevlex).
function sortPair(R: PolyRing, a: number[], b: number[]): number {
  const da = a.reduce((s, e) => s + e, 0),
    db = b.reduce((s, e) => s + e, 0);
  if (da !== db) return da - db;
  for (let i = R.vars.length - 1; i >= 0; i--) if (a[i] !== b[i]) return b[i] - a[i];
  return 0;
}
