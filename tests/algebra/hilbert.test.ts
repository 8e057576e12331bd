import { describe, expect, it } from "vitest";
import {
  AlgebraError,
  evaluateHilbertPolynomial,
  type Exponents,
  formatHilbertDenominator,
  formatUnivariate,
  hilbertFunctionAt,
  hilbertFunctionValues,
  hilbertPolynomial,
  hilbertSeriesOfMonomials,
} from "@/lib/algebra";

function binomial(n: number, k: number): bigint {
  if (k < 0 || n < k) return 0n;
  let r = 1n;
  for (let i = 0; i < k; i++) r = (r * BigInt(n - i)) / BigInt(i + 1);
  return r;
}

/// All exponent vectors of total degree p in n variables (the generators of m^p).
function monomialsOfDegree(n: number, p: number): number[][] {
  if (n === 1) return [[p]];
  const out: number[][] = [];
  for (let e = 0; e <= p; e++) for (const rest of monomialsOfDegree(n - 1, p - e)) out.push([e, ...rest]);
  return out;
}

/// Independent check: count the monomials of each weighted degree ≤ maxDeg outside the ideal.
function countStandardMonomials(gens: readonly Exponents[], weights: number[], maxDeg: number): bigint[] {
  const counts = new Array<bigint>(maxDeg + 1).fill(0n);
  const n = weights.length;
  const walk = (i: number, exps: number[], deg: number) => {
    if (i === n) {
      if (!gens.some((g) => g.every((e, j) => e <= exps[j]))) counts[deg]++;
      return;
    }
    for (let e = 0; deg + e * weights[i] <= maxDeg; e++) {
      exps[i] = e;
      walk(i + 1, exps, deg + e * weights[i]);
    }
    exps[i] = 0;
  };
  walk(0, new Array<number>(n).fill(0), 0);
  return counts;
}

/// A small deterministic generator (mulberry32) so that the random cases are reproducible.
function rng(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe("Hilbert series of monomial ideals", () => {
  it("k[x1..xn]/m^p has H(d) = C(n−1+d, n−1) for d < p and 0 from p on", () => {
    // counting monomials, common practice)
    for (const [n, p] of [
      [2, 5],
      [3, 4],
      [4, 3],
      [5, 2],
      [1, 6],
    ]) {
      const hs = hilbertSeriesOfMonomials(monomialsOfDegree(n, p), new Array(n).fill(1));
      const values = hilbertFunctionValues(hs, p + 4);
      values.forEach((v, d) => expect(v).toBe(d < p ? binomial(n - 1 + d, n - 1) : 0n));
      // Artinian: dimension 0, degree = length = C(n − 1 + p, n)
      expect(hs.dimension).toBe(0);
      expect(hs.degree).toEqual({ n: binomial(n - 1 + p, n), d: 1n });
      expect(hilbertPolynomial(hs)).toEqual([]);
    }
  });

  it("the zero ideal gives 1/(1−t)^n, dimension n, degree 1, polynomial C(d+n−1, n−1)", () => {
    // HS(k[x1..xn]) = 1/(1 − t)^n (common practice)
    const hs = hilbertSeriesOfMonomials([], [1, 1, 1]);
    expect(hs.numerator).toEqual([1n]);
    expect(hs.dimension).toBe(3);
    expect(hs.degree).toEqual({ n: 1n, d: 1n });
    // (d + 2)(d + 1)/2 = 1 + 3/2 d + 1/2 d^2
    expect(hilbertPolynomial(hs)).toEqual([
      { n: 1n, d: 1n },
      { n: 3n, d: 2n },
      { n: 1n, d: 2n },
    ]);
    expect(formatUnivariate(hilbertPolynomial(hs), "d")).toBe("1/2*d^2+3/2*d+1");
    expect(formatHilbertDenominator(hs.weights)).toBe("(1-t)^3");
    expect(hilbertFunctionAt(hs, 4)).toBe(15n);
    expect(hilbertFunctionAt(hs, -1)).toBe(0n);
  });

  it("the unit ideal gives the zero series and dimension −1", () => {
    const hs = hilbertSeriesOfMonomials(
      [
        [0, 0],
        [1, 0],
      ],
      [1, 1],
    );
    expect(hs.numerator).toEqual([]);
    expect(hs.dimension).toBe(-1);
    expect(hs.degree.n).toBe(0n);
    expect(hilbertFunctionValues(hs, 3)).toEqual([0n, 0n, 0n, 0n]);
  });

  it("redundant and repeated generators do not change the series", () => {
    const minimal = hilbertSeriesOfMonomials(
      [
        [2, 0, 0],
        [1, 1, 0],
        [0, 0, 3],
      ],
      [1, 1, 1],
    );
    const redundant = hilbertSeriesOfMonomials(
      [
        [2, 1, 0],
        [2, 0, 0],
        [1, 1, 0],
        [0, 0, 3],
        [1, 1, 0],
        [3, 3, 3],
        [0, 1, 4],
      ],
      [1, 1, 1],
    );
    expect(redundant.numerator).toEqual(minimal.numerator);
  });

  it("a monomial complete intersection has numerator ∏(1 − t^{d_i})", () => {
    // Koszul complex on a regular sequence, common practice: x^2, y^3, z^4 is a regular sequence
    const hs = hilbertSeriesOfMonomials(
      [
        [2, 0, 0],
        [0, 3, 0],
        [0, 0, 4],
      ],
      [1, 1, 1],
    );
    // (1 − t^2)(1 − t^3)(1 − t^4) = 1 − t^2 − t^3 + t^5 + t^6 − t^7 ... expanded by hand:
    // (1 − t^2 − t^3 + t^5)(1 − t^4) = 1 − t^2 − t^3 − t^4 + t^5 + t^6 + t^7 − t^9
    expect(hs.numerator).toEqual([1n, 0n, -1n, -1n, -1n, 1n, 1n, 1n, 0n, -1n]);
    expect(hs.degree).toEqual({ n: 24n, d: 1n });
  });

  it("hand-checked dimension and degree: (xy) and (xy, xz) in k[x, y, z]", () => {
    // (xy): a quadric surface, dimension 2, degree 2 (common practice)
    const quadric = hilbertSeriesOfMonomials([[1, 1, 0]], [1, 1, 1]);
    expect([quadric.dimension, quadric.degree.n]).toEqual([2, 2n]);
    // (xy, xz) = (x) ∩ (y, z): a plane and a line, dimension 2, degree 1;
    // numerator 1 − 2t^2 + t^3 = (1 − t)(1 + t − t^2)
    const planeLine = hilbertSeriesOfMonomials(
      [
        [1, 1, 0],
        [1, 0, 1],
      ],
      [1, 1, 1],
    );
    expect(planeLine.numerator).toEqual([1n, 0n, -2n, 1n]);
    expect(planeLine.reducedNumerator).toEqual([1n, 1n, -1n]);
    expect([planeLine.dimension, planeLine.degree.n]).toEqual([2, 1n]);
    // P(d) = (d + 1) + 1 for d ≥ 1: plane d + 1 monomials of degree d in y, z plus x^d
    expect(hilbertPolynomial(planeLine)).toEqual([
      { n: 2n, d: 1n },
      { n: 1n, d: 1n },
    ]);
  });

  it("the series agrees with counting standard monomials on random ideals, standard and weighted", () => {
    // Independent check: H(d) is the number of monomials of degree d outside I (Macaulay).
    const rand = rng(20240611);
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + Math.floor(rand() * 4);
      const weights = trial % 2 === 0 ? new Array(n).fill(1) : Array.from({ length: n }, () => 1 + Math.floor(rand() * 3));
      const gens = Array.from({ length: Math.floor(rand() * 6) }, () => Array.from({ length: n }, () => Math.floor(rand() * 4)));
      const maxDeg = 14;
      const hs = hilbertSeriesOfMonomials(gens, weights);
      expect(hilbertFunctionValues(hs, maxDeg)).toEqual(countStandardMonomials(gens, weights, maxDeg));
    }
  });

  it("the Hilbert polynomial agrees with the Hilbert function from some degree on", () => {
    // Hilbert's theorem: H(d) = P(d) for d large; a regularity bound is deg(numerator) (common practice)
    const rand = rng(7);
    for (let trial = 0; trial < 30; trial++) {
      const n = 2 + Math.floor(rand() * 3);
      const gens = Array.from({ length: 1 + Math.floor(rand() * 4) }, () => Array.from({ length: n }, () => Math.floor(rand() * 3)));
      const hs = hilbertSeriesOfMonomials(gens, new Array(n).fill(1));
      const P = hilbertPolynomial(hs);
      const from = hs.numerator.length;
      const values = hilbertFunctionValues(hs, from + 5);
      for (let d = from; d <= from + 5; d++) {
        expect(evaluateHilbertPolynomial(P, BigInt(d))).toEqual({ n: values[d], d: 1n });
      }
    }
  });

  it("k[x, y] with deg y = 2: H(d) = ⌊d/2⌋ + 1 and no Hilbert polynomial", () => {
    // monomials x^a y^b with a + 2b = d (counting, common practice)
    const hs = hilbertSeriesOfMonomials([], [1, 2]);
    expect(hilbertFunctionValues(hs, 7)).toEqual([1n, 1n, 2n, 2n, 3n, 3n, 4n, 4n]);
    expect(hs.dimension).toBe(2);
    expect(hs.degree).toEqual({ n: 1n, d: 2n });
    expect(formatHilbertDenominator(hs.weights)).toBe("(1-t)*(1-t^2)");
    expect(() => hilbertPolynomial(hs)).toThrow(/quasi-polynomial/);
  });

  it("rejects bad input with errors that say where and why", () => {
    expect(() => hilbertSeriesOfMonomials([[1, 2]], [1, 0])).toThrow(/degree 0 of variable 2/);
    expect(() => hilbertSeriesOfMonomials([[1]], [1, 1])).toThrow(/generator 1 has 1 exponents/);
    expect(() => hilbertSeriesOfMonomials([[1, -1]], [1, 1])).toThrow(/exponent -1/);
    const hs = hilbertSeriesOfMonomials([], [1]);
    expect(() => hilbertFunctionValues(hs, 2.5)).toThrow(/not a non-negative integer/);
    expect(() => hilbertFunctionValues(hs, 50, { limits: { maxDegree: 10 } })).toThrow(AlgebraError);
  });

  it("reports progress while the recursion runs", () => {
    const rand = rng(3);
    const gens = Array.from({ length: 60 }, () => Array.from({ length: 8 }, () => Math.floor(rand() * 4)));
    const stages: string[] = [];
    hilbertSeriesOfMonomials(gens, new Array(8).fill(1), { progress: (p) => stages.push(p.stage) });
    expect(stages.length).toBeGreaterThan(0);
    expect(stages[0]).toBe("Hilbert series");
  });

  it("stops with kind 'cancelled' when the signal is aborted", () => {
    const controller = new AbortController();
    controller.abort();
    const rand = rng(3);
    const gens = Array.from({ length: 60 }, () => Array.from({ length: 8 }, () => Math.floor(rand() * 4)));
    try {
      hilbertSeriesOfMonomials(gens, new Array(8).fill(1), { signal: controller.signal });
      expect.unreachable("an aborted computation must throw");
    } catch (e) {
      expect(e).toBeInstanceOf(AlgebraError);
      expect((e as AlgebraError).kind).toBe("cancelled");
    }
  });
});
