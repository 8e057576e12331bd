// Kernels, subquotients, Tor and Ext as modules (lib/algebra/module/kernel.ts,
// resolution/presentation.ts, invariants/homology.ts), checked against theorems with known
// answers and against the independent degree-by-degree Tor lengths of invariants/tor.ts.
import { describe, expect, it } from "vitest";
import {
  QQ,
  extModule,
  formatPoly,
  isRegularSequence,
  koszulComplex,
  mul,
  subquotientPresentation,
  freeModule,
  hilbertFunctionValues,
  ideal,
  idealCodimension,
  isZero,
  minors,
  moduleHilbertSeries,
  moduleKernel,
  quotientPresentation,
  torLengthsOf,
  torModule,
  type Poly,
  type PolyRing,
  type Presentation,
} from "@/lib/algebra";
import { GF, binom, genericMatrix, matMul, randomForm, ringOf, rng, vars } from "./resolution-helpers";

/// dim_k M_d for d = lo…hi of a graded module given by a presentation (any generator degrees).
function hilbertValues(R: PolyRing, P: Presentation, lo: number, hi: number): number[] {
  const shift = -Math.min(0, lo, ...P.rowDegrees);
  const cols = P.rows[0]?.length ?? 0;
  const hs = moduleHilbertSeries(
    freeModule(
      R,
      P.rowDegrees.map((d) => d + shift),
    ),
    Array.from({ length: cols }, (_, q) => P.rows.map((row) => row[q])),
  );
  const v = P.rowDegrees.length === 0 ? [] : hilbertFunctionValues(hs, hi + shift);
  return Array.from({ length: hi - lo + 1 }, (_, k) => Number(v[lo + k + shift] ?? 0n));
}

const S3 = ringOf(GF, 3);
const residue = (R: PolyRing): Presentation => ({ rows: [vars(R)], rowDegrees: [0] });

describe("moduleKernel", () => {
  it("gives the Koszul relations as the kernel of (x1 x2 x3) (common practice: the first syzygies of a regular sequence)", () => {
    const [x1, x2, x3] = vars(S3);
    const K = moduleKernel(S3, [[x1, x2, x3]], [1, 1, 1], [0]);
    // every generator is a syzygy, and a Gröbner basis of the Koszul relations has 3 elements
    const product = matMul(
      S3,
      [[x1, x2, x3]],
      Array.from({ length: 3 }, (_, b) => K.map((v) => v[b])),
    );
    expect(product[0].every((f) => isZero(f))).toBe(true);
    expect(K.length).toBe(3);
  });
});

describe("Tor modules", () => {
  it("Tor_i(k, k) is k^C(n,i) in degree i (Koszul complex; common practice)", () => {
    for (let i = 0; i <= 3; i++) {
      const T = torModule(S3, i, residue(S3), residue(S3));
      const h = hilbertValues(S3, T, 0, 5);
      expect(h, `i = ${i}`).toEqual([0, 1, 2, 3, 4, 5].map((d) => (d === i ? binom(3, i) : 0)));
    }
    expect(torModule(S3, 4, residue(S3), residue(S3)).rowDegrees).toEqual([]);
  });

  it("Tor_1(S/(x), S/(x)) ≅ (x)/(x^2) ≅ S/(x)(−1) (Tor_1(S/I, S/J) = (I ∩ J)/IJ, common practice)", () => {
    const [x1] = vars(S3);
    const M = quotientPresentation(ideal(S3, [x1]));
    const T = torModule(S3, 1, M, M);
    expect(T.rowDegrees).toEqual([1]);
    // S/(x1)(−1) in 3 variables: dim of degree d is d (d ≥ 1)
    expect(hilbertValues(S3, T, 0, 4)).toEqual([0, 1, 2, 3, 4]);
  });

  it("is balanced: Tor_i(M, N) and Tor_i(N, M) have the same Hilbert function (balance of Tor; random seeds)", () => {
    for (const seed of [3, 11]) {
      const rand = rng(seed);
      const R = ringOf(GF, 3);
      const M = quotientPresentation(ideal(R, [randomForm(R, 2, 3, rand), randomForm(R, 2, 3, rand)]));
      const N: Presentation = { rows: [[randomForm(R, 1, 2, rand), randomForm(R, 2, 3, rand)]], rowDegrees: [0] };
      for (let i = 0; i <= 3; i++) {
        expect(hilbertValues(R, torModule(R, i, M, N), 0, 7), `seed ${seed}, i = ${i}`).toEqual(
          hilbertValues(R, torModule(R, i, N, M), 0, 7),
        );
      }
    }
  });

  it("has the lengths the degree-by-degree linear algebra of torLengthsOf finds (two independent computations)", () => {
    const rand = rng(5);
    const R = ringOf(GF, 3);
    const I = ideal(R, [randomForm(R, 2, 4, rand), randomForm(R, 2, 4, rand)]);
    const J = ideal(R, [randomForm(R, 1, 3, rand), randomForm(R, 3, 4, rand)]);
    const lengths = torLengthsOf(R, quotientPresentation(I), quotientPresentation(J));
    const fromModules = lengths.map((_, i) =>
      hilbertValues(R, torModule(R, i, quotientPresentation(I), quotientPresentation(J)), 0, 12).reduce((s, x) => s + x, 0),
    );
    expect(fromModules).toEqual(lengths);
  });
});

describe("Ext modules", () => {
  it("Ext^i(S/I, S) vanishes below the grade of I and not at it (D. Rees, 'The grade of an ideal or module', Proc. Cambridge Philos. Soc. 1957)", () => {
    // the 2×2 minors of a generic 2×3 matrix: a determinantal ideal of grade 2
    const R = ringOf(QQ, 6);
    const I = ideal(R, minors(R, genericMatrix(R, 2, 3), 2));
    const grade = idealCodimension(I);
    expect(grade).toBe(2);
    const S: Presentation = { rows: [[]], rowDegrees: [0] };
    for (let i = 0; i < grade; i++) expect(extModule(R, i, quotientPresentation(I), S).rowDegrees, `Ext^${i}`).toEqual([]);
    // Ext^2(S/I, S) is presented by the transpose of the last map: 2 generators in degree −3
    // (Hilbert–Burch: F_2 = S(−3)^2; Eagon–Northcott 1962)
    expect(extModule(R, 2, quotientPresentation(I), S).rowDegrees).toEqual([-3, -3]);
    expect(extModule(R, 3, quotientPresentation(I), S).rowDegrees).toEqual([]);
  });

  it("Ext^c(S/(f_1..f_c), S) ≅ S/(f)(d_1 + … + d_c) for a complete intersection (Koszul self-duality; common practice)", () => {
    const rand = rng(7);
    const R = ringOf(GF, 4);
    const fs: Poly[] = [randomForm(R, 2, 4, rand), randomForm(R, 3, 5, rand)];
    const I = ideal(R, fs);
    expect(idealCodimension(I)).toBe(2);
    const E = extModule(R, 2, quotientPresentation(I), { rows: [[]], rowDegrees: [0] });
    expect(E.rowDegrees).toEqual([-5]);
    // same Hilbert function as S/I shifted by 5
    expect(hilbertValues(R, E, -5, 4)).toEqual(hilbertValues(R, quotientPresentation(I), 0, 9));
    expect(extModule(R, 1, quotientPresentation(I), { rows: [[]], rowDegrees: [0] }).rowDegrees).toEqual([]);
  });

  it("Ext^i(k, S) is 0 for i < n and k(n) for i = n (S Gorenstein of dimension n; common practice)", () => {
    const S: Presentation = { rows: [[]], rowDegrees: [0] };
    for (let i = 0; i < 3; i++) expect(extModule(S3, i, residue(S3), S).rowDegrees).toEqual([]);
    const E = extModule(S3, 3, residue(S3), S);
    expect(E.rowDegrees).toEqual([-3]);
    expect(hilbertValues(S3, E, -4, 0)).toEqual([0, 1, 0, 0, 0]);
  });

  it("Hom(M, N) = Ext^0: Hom(S/(x), S/(x)) ≅ S/(x) (common practice)", () => {
    const [x1] = vars(S3);
    const M = quotientPresentation(ideal(S3, [x1]));
    const E = extModule(S3, 0, M, M);
    expect(hilbertValues(S3, E, 0, 4)).toEqual(hilbertValues(S3, M, 0, 4));
  });
});

describe("Koszul homology", () => {
  /// The number of minimal generators of H_i(K(f)) = ker d_i / im d_{i+1} (0 exactly when it vanishes).
  function homologySize(R: PolyRing, fs: Poly[], i: number): number {
    const K = koszulComplex(R, fs);
    const Z = moduleKernel(R, K.map(i), [...K.degrees[i]], [...K.degrees[i - 1]]);
    const Zcols = Array.from({ length: K.ranks[i] }, (_, a) => Z.map((v) => v[a]));
    const B = i < K.length ? K.map(i + 1) : K.degrees[i].map(() => []);
    const H = subquotientPresentation(R, Zcols, B, K.degrees[i]);
    return H.rowDegrees.length;
  }

  it("K(f) is exact in positive degrees exactly when f is a regular sequence (D. Eisenbud, Commutative Algebra, Cor. 17.5, from memory; random seeds)", () => {
    const R = ringOf(GF, 4);
    const [x1, x2, x3] = vars(R);
    const cases: Poly[][] = [
      [mul(R, x1, x2), mul(R, x1, x3)],
      [x1, mul(R, x1, x2), x3],
    ];
    for (const seed of [2, 9, 13]) {
      const rand = rng(seed);
      cases.push([randomForm(R, 2, 4, rand), randomForm(R, 2, 4, rand), randomForm(R, 1, 3, rand)]);
    }
    let regular = 0;
    for (const fs of cases) {
      const exact = [1, 2, 3].slice(0, fs.length).every((i) => homologySize(R, fs, i) === 0);
      expect(exact, fs.map((f) => formatPoly(R, f)).join(", ")).toBe(isRegularSequence(R, fs));
      if (exact) regular++;
    }
    // both kinds occur among the cases
    expect(regular).toBeGreaterThan(0);
    expect(regular).toBeLessThan(cases.length);
  });
});
