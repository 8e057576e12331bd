import { describe, expect, it } from "vitest";
import { add, ideal, idealEquals, idealHilbertSeries, monomial, parsePoly, polyRing, pow, QQ, variable } from "@/lib/algebra";
import { minors, pfaffians } from "@/lib/algebra/invariants";
import { bettiAlternatingSum, bettiNumber, bettiTotals, resolveQuotient } from "@/lib/algebra/resolution/schreyer";
import { alternating, binom, expectMinimalComplex, genericMatrix, GF, randomForm, ringOf, rng, vars } from "./resolution-helpers";

const FIELDS = [
  ["GF(32003)", GF],
  ["Q", QQ],
] as const;

describe.each(FIELDS)("minimal resolutions over %s", (_name, F) => {
  it("Koszul complex, common practice: the Koszul complex resolves k over k[x1..xn], β_i = C(n, i) in degree i", () => {
    // Koszul complex on the variables (Koszul complex, common practice).
    for (let n = 1; n <= 6; n++) {
      const R = ringOf(F, n);
      const C = resolveQuotient(ideal(R, vars(R)));
      expect(C.complete).toBe(true);
      expect(C.length).toBe(n);
      expect(C.betti.entries).toEqual(Array.from({ length: n + 1 }, (_, i) => [i, i, binom(n, i)]));
      expectMinimalComplex(R, C);
    }
  });

  it("Hilbert–Burch; Eagon–Northcott 1962: the twisted cubic has β_{0,0}=1, β_{1,2}=3, β_{2,3}=2", () => {
    // 2×2 minors of [x, y, z; y, z, w] (Hilbert–Burch; Eagon–Northcott 1962).
    const R = ringOf(F, 4);
    const [x, y, z, w] = vars(R);
    const C = resolveQuotient(
      ideal(
        R,
        minors(
          R,
          [
            [x, y, z],
            [y, z, w],
          ],
          2,
        ),
      ),
    );
    expect(C.betti.entries).toEqual([
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 2],
    ]);
    expect(C.ranks).toEqual([1, 3, 2]);
    expectMinimalComplex(R, C);
  });

  it("Eagon–Northcott, Proc. Roy. Soc. A 1962: rational normal curves of degree d have β_i = i·C(d, i+1), all in degree i+1", () => {
    // 2×2 minors of the 2×d Hankel matrix (J. Eagon, D. Northcott, Proc. Roy. Soc. A 1962).
    for (let d = 2; d <= (F === QQ ? 4 : 6); d++) {
      const R = ringOf(F, d + 1);
      const x = vars(R);
      const H = [x.slice(0, d), x.slice(1, d + 1)];
      const C = resolveQuotient(ideal(R, minors(R, H, 2)));
      const expected: number[][] = [[0, 0, 1]];
      for (let i = 1; i < d; i++) expected.push([i, i + 1, i * binom(d, i + 1)]);
      expect(C.betti.entries).toEqual(expected);
      expectMinimalComplex(R, C);
    }
    const R4 = ringOf(F, 5);
    const x = vars(R4);
    const C4 = resolveQuotient(ideal(R4, minors(R4, [x.slice(0, 4), x.slice(1, 5)], 2)));
    expect(bettiTotals(C4.betti)).toEqual([1, 6, 8, 3]); // Eagon–Northcott 1962, d = 4
  });

  it("Koszul complex on a regular sequence, common practice: complete intersections have the Koszul Betti numbers of their degrees", () => {
    // f_i = x_i^{d_i} + (a form in x_{i+1}..x_n): the lex leading terms x_i^{d_i} are pairwise
    // coprime, so f_1..f_c is a regular sequence and the Koszul complex on it is the minimal
    // resolution (Koszul complex on a regular sequence, common practice).
    const rand = rng(4);
    for (const [n, degs] of [
      [3, [2, 3]],
      [4, [2, 2, 3]],
      [4, [1, 2, 3, 2]],
      [5, [3, 2, 2]],
    ] as const) {
      const R = ringOf(F, n);
      const gens = degs.map((d, i) => {
        const later = Array.from({ length: n - i - 1 }, (_, k) => i + 1 + k);
        const power = pow(R, variable(R, i), d);
        return later.length === 0 ? power : add(R, power, randomForm(R, d, 3, rand, later));
      });
      const C = resolveQuotient(ideal(R, gens));
      const expected = new Map<string, number>();
      for (let mask = 0; mask < 1 << degs.length; mask++) {
        let i = 0,
          j = 0;
        degs.forEach((d, k) => {
          if (mask & (1 << k)) {
            i++;
            j += d;
          }
        });
        expected.set(`${i},${j}`, (expected.get(`${i},${j}`) ?? 0) + 1);
      }
      expect(new Map(C.betti.entries.map(([i, j, b]) => [`${i},${j}`, b]))).toEqual(expected);
      expectMinimalComplex(R, C);
    }
  });

  it("Buchsbaum–Eisenbud, Amer. J. Math. 1977: 4×4 Pfaffians of the generic 5×5 alternating matrix give 1, 5, 5, 1 in degrees 0, 2, 3, 5", () => {
    // D. Buchsbaum, D. Eisenbud, Amer. J. Math. 1977 (Gorenstein ideals of codimension 3).
    const R = ringOf(F, 10);
    const A = alternating(R, 5);
    const C = resolveQuotient(ideal(R, pfaffians(R, A, 4)));
    expect(C.betti.entries).toEqual([
      [0, 0, 1],
      [1, 2, 5],
      [2, 3, 5],
      [3, 5, 1],
    ]);
    expectMinimalComplex(R, C);
  });

  it("Hilbert–Burch: maximal minors of random (n+1)×n matrices of linear forms are resolved by 0 → S^n → S^{n+1} → S", () => {
    // The Hilbert–Burch theorem (D. Eisenbud, Commutative Algebra, Thm. 20.15, from memory): for a
    // codimension-2 ideal of maximal minors of an (n+1)×n matrix of linear forms the
    // resolution is 0 → S(−n−1)^n → S(−n)^{n+1} → S. Random linear forms in 4 variables give
    // codimension 2 for a generic choice.
    const rand = rng(15);
    for (const n of F === QQ ? [2, 3] : [2, 3, 4]) {
      const R = ringOf(F, 4);
      const A = Array.from({ length: n + 1 }, () => Array.from({ length: n }, () => randomForm(R, 1, 4, rand)));
      const C = resolveQuotient(ideal(R, minors(R, A, n)));
      expect(C.betti.entries).toEqual([
        [0, 0, 1],
        [1, n, n + 1],
        [2, n + 1, n],
      ]);
      expectMinimalComplex(R, C);
    }
  });
});

describe("Eagon–Northcott complexes", () => {
  it("maximal minors of generic p×q matrices: β_i = C(q, p+i−1)·C(p+i−2, i−1) in degree p+i−1", () => {
    // J. Eagon, D. Northcott, "Ideals defined by matrices and a certain complex associated with
    // them", Proc. Roy. Soc. A 269, 1962: the complex is the minimal resolution of S/I_p.
    for (const [p, q] of [
      [2, 3],
      [2, 4],
      [2, 5],
      [3, 4],
      [3, 5],
      [2, 6],
    ]) {
      const R = ringOf(GF, p * q);
      const C = resolveQuotient(ideal(R, minors(R, genericMatrix(R, p, q), p)));
      const expected: number[][] = [[0, 0, 1]];
      for (let i = 1; i <= q - p + 1; i++) expected.push([i, p + i - 1, binom(q, p + i - 1) * binom(p + i - 2, i - 1)]);
      expect(C.betti.entries).toEqual(expected);
      expectMinimalComplex(R, C);
    }
  });

  it("the first map of the minimal resolution generates the ideal", () => {
    const R = ringOf(QQ, 6);
    const I = ideal(R, minors(R, genericMatrix(R, 2, 3), 2));
    const C = resolveQuotient(I);
    expect(idealEquals(ideal(R, C.map(1)[0]), I)).toBe(true);
    expect(bettiNumber(C.betti, 1, 2)).toBe(3);
  });
});

describe("Eliahou–Kervaire resolutions of strongly stable ideals", () => {
  it("β_{i,i+j}(I) = Σ_{u ∈ G(I), deg u = j} C(max(u) − 1, i) on random strongly stable ideals", () => {
    // S. Eliahou, M. Kervaire, "Minimal resolutions of some monomial ideals", J. Algebra 129,
    // 1990. β_{i+1, i+1+j}(S/I) = β_{i, i+j}(I).
    for (let seed = 1; seed <= 8; seed++) {
      const rand = rng(100 + seed);
      const n = 3 + (seed % 3);
      const R = ringOf(GF, n);
      const seeds = Array.from({ length: 2 + (seed % 3) }, () => randomExponents(n, 2 + Math.floor(rand() * 3), rand));
      const G = minimalGenerators(borelClosure(seeds));
      const C = resolveQuotient(
        ideal(
          R,
          G.map((e) => monomial(R, e)),
        ),
      );
      const expected = new Map<string, number>([["0,0", 1]]);
      for (const u of G) {
        const d = u.reduce((s, e) => s + e, 0);
        let max = 0;
        u.forEach((e, v) => e > 0 && (max = v + 1));
        for (let i = 0; i <= max - 1; i++) {
          const key = `${i + 1},${i + d}`;
          expected.set(key, (expected.get(key) ?? 0) + binom(max - 1, i));
        }
      }
      expect(new Map(C.betti.entries.map(([i, j, b]) => [`${i},${j}`, b]))).toEqual(expected);
      expectMinimalComplex(R, C);
    }
  });
});

function randomExponents(n: number, d: number, rand: () => number): number[] {
  const e = new Array<number>(n).fill(0);
  for (let k = 0; k < d; k++) e[Math.floor(rand() * n)]++;
  return e;
}

/// The smallest strongly stable set of monomials containing `seeds` (closed under
/// replacing x_j by x_i for i < j), all degrees kept.
function borelClosure(seeds: number[][]): number[][] {
  const seen = new Map<string, number[]>();
  const stack = [...seeds];
  while (stack.length > 0) {
    const u = stack.pop() as number[];
    const key = u.join(",");
    if (seen.has(key)) continue;
    seen.set(key, u);
    for (let j = 0; j < u.length; j++) {
      if (u[j] === 0) continue;
      for (let i = 0; i < j; i++) {
        const v = [...u];
        v[j]--;
        v[i]++;
        stack.push(v);
      }
    }
  }
  return [...seen.values()];
}

function minimalGenerators(mons: number[][]): number[][] {
  const divides = (a: number[], b: number[]) => a.every((e, i) => e <= b[i]);
  return mons.filter((u, x) => !mons.some((v, y) => y !== x && divides(v, u) && !(divides(u, v) && y > x)));
}

describe("parsing round trip", () => {
  it("resolves an ideal given as text", () => {
    const R = ringOf(GF, 3);
    const C = resolveQuotient(
      ideal(
        R,
        ["x1^2", "x1*x2", "x2^3"].map((s) => parsePoly(R, s)),
      ),
    );
    expect(C.betti.entries).toEqual([
      [0, 0, 1],
      [1, 2, 2],
      [1, 3, 1],
      [2, 3, 1],
      [2, 4, 1],
    ]);
    expectMinimalComplex(R, C);
  });
});

describe("weighted gradings", () => {
  it("a complete intersection in k[x, y, z] with degrees 1, 2, 3 has Koszul Betti numbers in weighted degrees", () => {
    // x^2 − y (degree 2) and y^3 − z^2 (degree 6) have coprime lex leading terms x^2, y^3, so they
    // form a regular sequence (Koszul complex on a regular sequence, common practice); the alternating Betti sum is
    // the weighted Hilbert series numerator (1 − t^2)(1 − t^6).
    const R = polyRing(GF, ["x", "y", "z"], { degrees: [1, 2, 3] });
    const I = ideal(
      R,
      ["x^2-y", "y^3-z^2"].map((s) => parsePoly(R, s)),
    );
    const C = resolveQuotient(I);
    expect(C.betti.entries).toEqual([
      [0, 0, 1],
      [1, 2, 1],
      [1, 6, 1],
      [2, 8, 1],
    ]);
    expect(bettiAlternatingSum(C.betti)).toEqual([...idealHilbertSeries(I).numerator]);
    expectMinimalComplex(R, C);
  });
});
