import { describe, expect, it } from "vitest";
import { formatPoly, ideal, isZero, parsePoly, QQ, type Poly, type PolyRing } from "@/lib/algebra";
import {
  det,
  isRegularSequence,
  koszulComplex,
  minors,
  pfaffians,
  serreMultiplicity,
  torLengths,
  torLengthsOf,
} from "@/lib/algebra/invariants";
import { bettiTotals, resolveCoker, resolveQuotient } from "@/lib/algebra/resolution/schreyer";
import { alternating, genericMatrix, GF, matMul, randomForm, ringOf, rng, vars } from "./resolution-helpers";

function idealOf(R: PolyRing, gens: string[]) {
  return ideal(
    R,
    gens.map((s) => parsePoly(R, s)),
  );
}

describe("Tor lengths and Serre's intersection multiplicity", () => {
  it("Serre, Algèbre locale, multiplicités, 1965: two planes meeting at a point against a plane: ℓ(S/(I+J)) = 3, χ = 2", () => {
    // I = (xz, xw, yz, yw), J = (x − z, y − w) in k[x, y, z, w] (J.-P. Serre, Algèbre locale,
    // multiplicités, 1965, the classical example where ℓ(M ⊗ N) ≠ χ).
    for (const F of [GF, QQ]) {
      const R = ringOf(F, 4);
      const I = idealOf(R, ["x1*x3", "x1*x4", "x2*x3", "x2*x4"]);
      const J = idealOf(R, ["x1-x3", "x2-x4"]);
      const T = torLengths(I, J);
      expect(T[0]).toBe(3);
      expect(serreMultiplicity(I, J)).toBe(2);
      // Tor is balanced: computed from a resolution of either side (common practice).
      const U = torLengths(J, I);
      const n = Math.max(T.length, U.length);
      const pad = (x: number[]) => [...x, ...new Array<number>(n - x.length).fill(0)];
      expect(pad(U)).toEqual(pad(T));
    }
  });

  it("proper intersections of complete intersections: χ = ℓ(S/(I+J)) = product of degrees", () => {
    // For complete intersections meeting in finitely many points the higher Tor vanish and χ is
    // the Bézout number (Serre 1965, Ch. V; common practice).
    const R = ringOf(GF, 3);
    const I = idealOf(R, ["x1^2-x2*x3"]);
    const J = idealOf(R, ["x2^3-x1*x3^2", "x1+x2+x3"]);
    const T = torLengths(I, J);
    expect(T).toEqual([6, 0]);
    expect(serreMultiplicity(I, J)).toBe(6);
  });

  it("balance of Tor on random pairs", () => {
    const rand = rng(5);
    for (let t = 0; t < 3; t++) {
      const R = ringOf(GF, 3);
      const I = ideal(R, [randomForm(R, 2, 3, rand), randomForm(R, 2, 3, rand)]);
      const J = ideal(R, [randomForm(R, 1, 3, rand), randomForm(R, 2, 2, rand)]);
      const a = torLengths(I, J),
        b = torLengths(J, I);
      const n = Math.max(a.length, b.length);
      const pad = (x: number[]) => [...x, ...new Array<number>(n - x.length).fill(0)];
      expect(pad(a)).toEqual(pad(b));
    }
  });

  it("an error names the problem when M ⊗ N is not of finite length", () => {
    const R = ringOf(GF, 3);
    expect(() => torLengths(idealOf(R, ["x1"]), idealOf(R, ["x2"]))).toThrow(/not of finite length/);
  });
});

describe("Koszul complexes", () => {
  it("on a regular sequence the Koszul complex is the minimal resolution", () => {
    // The Koszul complex on a regular sequence is exact (Eisenbud, Commutative Algebra, Cor. 17.5, from memory).
    const R = ringOf(GF, 3);
    const fs = ["x1^2", "x2^2+x1*x3", "x3^3"].map((s) => parsePoly(R, s));
    const K = koszulComplex(R, fs);
    expect(K.ranks).toEqual([1, 3, 3, 1]);
    for (let i = 1; i < K.length; i++) expect(matMul(R, K.map(i), K.map(i + 1)).every((r) => r.every(isZero))).toBe(true);
    const C = resolveQuotient(ideal(R, fs));
    const fromKoszul = K.degrees.flatMap((ds, i) => [...new Set(ds)].map((d) => [i, d, ds.filter((x) => x === d).length]));
    expect(C.betti.entries).toEqual(fromKoszul.sort((a, b) => a[0] - b[0] || a[1] - b[1]));
  });
});

describe("regular sequences", () => {
  it("x², y² + xz, z³ is regular; xy, xz is not; the variables are", () => {
    // (xy, xz) ⊂ (x) has codimension 1 < 2; x², y² + xz, z³ define the origin (codimension 3)
    // (common practice).
    const R = ringOf(GF, 3);
    const p = (xs: string[]) => xs.map((s) => parsePoly(R, s));
    expect(isRegularSequence(R, p(["x1^2", "x2^2+x1*x3", "x3^3"]))).toBe(true);
    expect(isRegularSequence(R, p(["x1*x2", "x1*x3"]))).toBe(false);
    expect(isRegularSequence(R, vars(R))).toBe(true);
  });
});

describe("minors, determinants and Pfaffians", () => {
  it("the generic 3×3 determinant has 6 terms; 2×2 minors of a generic 2×3 matrix are 3", () => {
    // Leibniz formula: n! terms for the generic n×n determinant (common practice).
    const R = ringOf(GF, 9);
    expect(det(R, genericMatrix(R, 3, 3)).m.length).toBe(6);
    const S = ringOf(QQ, 6);
    const m = minors(S, genericMatrix(S, 2, 3), 2).map((f) => formatPoly(S, f));
    expect(m).toEqual(["-x2*x4+x1*x5", "-x3*x4+x1*x6", "-x3*x5+x2*x6"]);
  });

  it("det is multiplicative on random matrices of linear forms", () => {
    // det(AB) = det(A)·det(B) (common practice).
    const rand = rng(3);
    const R = ringOf(GF, 3);
    const A = Array.from({ length: 3 }, () => Array.from({ length: 3 }, () => randomForm(R, 1, 2, rand)));
    const B = Array.from({ length: 3 }, () => Array.from({ length: 3 }, () => randomForm(R, 1, 2, rand)));
    const lhs = det(R, matMul(R, A, B));
    const rhs = matMul(R, [[det(R, A)]], [[det(R, B)]])[0][0];
    expect(formatPoly(R, lhs)).toBe(formatPoly(R, rhs));
  });

  it("Pf² = det for alternating matrices, and the 4×4 Pfaffian is a12·a34 − a13·a24 + a14·a23", () => {
    // Cayley's theorem det A = Pf(A)^2 (common practice).
    const R = ringOf(QQ, 6);
    const A = alternating(R, 4);
    const [pf] = pfaffians(R, A, 4);
    expect(formatPoly(R, pf)).toBe(formatPoly(R, parsePoly(R, "x1*x6-x2*x5+x3*x4")));
    const sq: Poly = matMul(R, [[pf]], [[pf]])[0][0];
    expect(formatPoly(R, det(R, A))).toBe(formatPoly(R, sq));
    expect(pfaffians(R, A, 2).length).toBe(6);
    expect(vars(R).length).toBe(6);
  });
});

describe("Tor of modules", () => {
  it("ℓ(Tor_i(k, M)) computed from the Koszul side equals the Betti numbers β_i(M) from M's resolution", () => {
    // Tor_i(k, M) ≅ Tor_i(M, k) has dimension β_i(M) (balance of Tor; Eisenbud, The Geometry of
    // Syzygies, Ch. 1). torLengthsOf resolves its first argument, so with k first the Koszul
    // complex on the variables is tensored with M: an independent route to M's Betti numbers.
    const R = ringOf(GF, 4);
    const k = { rows: [vars(R)], rowDegrees: [0] };
    const rand = rng(808);
    const cases = [
      { rows: [["x1*x3-x2^2", "x1*x4-x2*x3", "x2*x4-x3^2"].map((s) => parsePoly(R, s))], rowDegrees: [0] },
      { rows: Array.from({ length: 2 }, () => Array.from({ length: 3 }, () => randomForm(R, 1, 3, rand))), rowDegrees: [0, 0] },
    ];
    for (const M of cases) {
      const C = resolveCoker(R, M.rows, M.rowDegrees);
      const T = torLengthsOf(R, k, M);
      const betti = bettiTotals(C.betti);
      const n = Math.max(T.length, betti.length);
      const pad = (x: number[]) => [...x, ...new Array<number>(n - x.length).fill(0)];
      expect(pad(T)).toEqual(pad(betti));
    }
  });

  it("ℓ(Tor_i(k, k)) = C(n, i) (Koszul complex, common practice)", () => {
    const R = ringOf(GF, 3);
    const k = { rows: [vars(R)], rowDegrees: [0] };
    expect(torLengthsOf(R, k, k)).toEqual([1, 3, 3, 1]);
  });
});
