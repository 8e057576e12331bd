import { describe, expect, it } from "vitest";
import {
  add,
  type Field,
  formatHilbertDenominator,
  formatUnivariate,
  gf,
  hilbertFunctionValues,
  hilbertPolynomial,
  hilbertSeriesOfMonomials,
  ideal,
  idealCodimension,
  idealDegree,
  idealDimension,
  idealHilbertSeries,
  idealPower,
  initialIdeal,
  monomial,
  parsePoly,
  type Poly,
  polyRing,
  type PolyRing,
  QQ,
  terms,
} from "@/lib/algebra";

/// mulberry32: reproducible pseudo-random numbers.
function rng(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/// Exponent vectors of weighted degree d.
function monomialsOfDegree(weights: readonly number[], d: number): number[][] {
  if (weights.length === 0) return d === 0 ? [[]] : [];
  const out: number[][] = [];
  for (let e = 0; e * weights[0] <= d; e++) {
    for (const rest of monomialsOfDegree(weights.slice(1), d - e * weights[0])) out.push([e, ...rest]);
  }
  return out;
}

/// A random (weighted) homogeneous polynomial of degree d with every monomial present
/// with coefficient in 1..99.
function randomForm(R: PolyRing, d: number, rand: () => number): Poly {
  return monomialsOfDegree(R.degrees, d).reduce(
    (f, e) => add(R, f, monomial(R, e, BigInt(1 + Math.floor(rand() * 99)))),
    monomial(R, new Array(R.vars.length).fill(0), 0n),
  );
}

function tpolyProduct(factors: number[]): bigint[] {
  let out: bigint[] = [1n];
  for (const d of factors) {
    const next = new Array<bigint>(out.length + d).fill(0n);
    out.forEach((c, i) => {
      next[i] += c;
      next[i + d] -= c;
    });
    out = next;
  }
  while (out.length > 0 && out[out.length - 1] === 0n) out.pop();
  return out;
}

function binomial(n: number, k: number): bigint {
  if (k < 0 || n < k) return 0n;
  let r = 1n;
  for (let i = 0; i < k; i++) r = (r * BigInt(n - i)) / BigInt(i + 1);
  return r;
}

/// Independent of Gröbner bases: dim_k I_d is the rank of the products m·g (m a monomial,
/// g a generator, deg m·g = d), by Gaussian elimination mod p on their coefficient vectors.
function idealDimensionInDegree(R: PolyRing, gens: Poly[], d: number): number {
  if (R.field.kind !== "gf") throw new Error("idealDimensionInDegree works over GF(p)");
  const p = BigInt(R.field.p);
  const rows: Map<string, bigint>[] = [];
  for (const g of gens) {
    const tg = terms(R, g);
    const dg = tg[0].exps.reduce((s, e, i) => s + e * R.degrees[i], 0);
    if (dg > d) continue;
    for (const m of monomialsOfDegree(R.degrees, d - dg)) {
      const row = new Map<string, bigint>();
      for (const t of tg) row.set(t.exps.map((e, i) => e + m[i]).join(","), ((t.num % p) + p) % p);
      rows.push(row);
    }
  }
  const pivots = new Map<string, Map<string, bigint>>();
  const inv = (a: bigint) => {
    let [r0, r1, s0, s1] = [a, p, 1n, 0n];
    while (r1 !== 0n) {
      const q = r0 / r1;
      [r0, r1, s0, s1] = [r1, r0 - q * r1, s1, s0 - q * s1];
    }
    return ((s0 % p) + p) % p;
  };
  for (const row of rows) {
    for (;;) {
      const keys = [...row.keys()].filter((k) => row.get(k) !== 0n).sort();
      if (keys.length === 0) break;
      const lead = keys[0];
      const piv = pivots.get(lead);
      if (!piv) {
        const s = inv(row.get(lead)!);
        for (const k of keys) row.set(k, (row.get(k)! * s) % p);
        pivots.set(lead, row);
        break;
      }
      const s = row.get(lead)!;
      for (const [k, v] of piv) row.set(k, ((((row.get(k) ?? 0n) - s * v) % p) + p) % p);
    }
  }
  return pivots.size;
}

const GF = gf(32003);

describe("Hilbert series of ideals, from their initial ideals", () => {
  it("random regular sequences of mixed degrees: HS = ∏(1 − t^{d_i}) / (1 − t)^n", () => {
    // Koszul complex on a regular sequence, common practice (generic forms of any degrees d_1..d_c, c ≤ n, form a
    // regular sequence, and the Koszul complex gives the series)
    const rand = rng(4);
    const cases: [Field, number, number[]][] = [
      [GF, 3, [2, 3]],
      [GF, 4, [1, 2, 2]],
      [GF, 4, [2, 2, 3, 2]],
      [GF, 5, [3, 2, 2]],
      [QQ, 3, [2, 2, 1]],
    ];
    for (const [field, n, degs] of cases) {
      const R = polyRing(
        field,
        Array.from({ length: n }, (_, i) => `x${i}`),
      );
      const I = ideal(
        R,
        degs.map((d) => randomForm(R, d, rand)),
      );
      const hs = idealHilbertSeries(I);
      expect(hs.numerator).toEqual(tpolyProduct(degs));
      expect(hs.dimension).toBe(n - degs.length);
      expect(idealCodimension(I)).toBe(degs.length);
      // Bézout: the degree of a complete intersection is ∏ d_i
      expect(idealDegree(I)).toEqual({ n: BigInt(degs.reduce((a, b) => a * b, 1)), d: 1n });
    }
  });

  it("a weighted complete intersection in k[x, y, z] with degrees (1, 2, 3)", () => {
    // Koszul complex on a regular sequence, common practice, for a positive grading: HS = (1 − t^4)(1 − t^6) / ((1 − t)(1 − t^2)(1 − t^3))
    const R = polyRing(GF, ["x", "y", "z"], { degrees: [1, 2, 3] });
    const rand = rng(46);
    const I = ideal(R, [randomForm(R, 4, rand), randomForm(R, 6, rand)]);
    const hs = idealHilbertSeries(I);
    expect(hs.numerator).toEqual(tpolyProduct([4, 6]));
    expect(formatHilbertDenominator(hs.weights)).toBe("(1-t)*(1-t^2)*(1-t^3)");
    // dimension 1 and degree 4·6/(1·2·3) = 4 (lim (1 − t)·HS at t = 1)
    expect(hs.dimension).toBe(1);
    expect(hs.degree).toEqual({ n: 4n, d: 1n });
  });

  it("k[x1..xn]/m^p, m generated by n random linear forms: H(d) = C(n−1+d, n−1) for d < p, then 0", () => {
    // counting monomials, common practice); the linear forms hide the monomial structure
    const rand = rng(12);
    for (const [n, p] of [
      [3, 3],
      [4, 2],
      [2, 4],
    ]) {
      const R = polyRing(
        GF,
        Array.from({ length: n }, (_, i) => `x${i}`),
      );
      const m = ideal(
        R,
        Array.from({ length: n }, () => randomForm(R, 1, rand)),
      );
      const values = hilbertFunctionValues(idealHilbertSeries(idealPower(m, p)), p + 3);
      values.forEach((v, d) => expect(v).toBe(d < p ? binomial(n - 1 + d, n - 1) : 0n));
    }
  });

  it("the twisted cubic has degree 3 and Hilbert polynomial 3d + 1", () => {
    // common practice: the rational normal curve of degree 3 in P^3
    for (const field of [GF, QQ]) {
      const R = polyRing(field, ["x", "y", "z", "w"]);
      const I = ideal(
        R,
        ["x*z-y^2", "x*w-y*z", "y*w-z^2"].map((s) => parsePoly(R, s)),
      );
      const hs = idealHilbertSeries(I);
      expect(formatUnivariate(hilbertPolynomial(hs), "d")).toBe("3*d+1");
      expect(idealDegree(I)).toEqual({ n: 3n, d: 1n });
      expect(idealDimension(I)).toBe(2);
      expect(hs.reducedNumerator).toEqual([1n, 2n]);
    }
  });

  it("cyclic-5 and cyclic-6 have degrees 70 and 156", () => {
    // Björck–Fröberg, J. Symbolic Comput. 1991: G. Björck, R. Fröberg, "A faster way to count the solutions of
    // inhomogeneous systems of algebraic equations", J. Symbolic Comput. 12 (1991)
    for (const [n, expected] of [
      [5, 70n],
      [6, 156n],
    ] as const) {
      const vars = Array.from({ length: n }, (_, i) => `x${i}`);
      const R = polyRing(GF, vars);
      const eqs: string[] = [];
      for (let k = 1; k < n; k++) {
        eqs.push(vars.map((_, i) => Array.from({ length: k }, (_, j) => vars[(i + j) % n]).join("*")).join("+"));
      }
      eqs.push(`${vars.join("*")}-1`);
      const I = ideal(
        R,
        eqs.map((s) => parsePoly(R, s)),
      );
      expect(idealDimension(I)).toBe(0);
      expect(idealDegree(I)).toEqual({ n: expected, d: 1n });
    }
  });

  it("katsura-n has degree 2^n", () => {
    // common practice (the Bézout bound is attained for this family)
    for (let n = 2; n <= 6; n++) {
      const vars = Array.from({ length: n + 1 }, (_, i) => `u${i}`);
      const u = (i: number) => (Math.abs(i) <= n ? vars[Math.abs(i)] : null);
      const eqs: string[] = [];
      for (let m = 0; m < n; m++) {
        const products: string[] = [];
        for (let l = -n; l <= n; l++) {
          const a = u(l),
            b = u(m - l);
          if (a && b) products.push(`${a}*${b}`);
        }
        eqs.push(`${products.join("+")}-${vars[m]}`);
      }
      const linear: string[] = [];
      for (let l = -n; l <= n; l++) linear.push(u(l)!);
      eqs.push(`${linear.join("+")}-1`);
      const R = polyRing(GF, vars);
      expect(
        idealDegree(
          ideal(
            R,
            eqs.map((s) => parsePoly(R, s)),
          ),
        ),
      ).toEqual({ n: 2n ** BigInt(n), d: 1n });
    }
  });

  it("I and in(I) have the same Hilbert function, and it matches linear algebra on I_d", () => {
    // F. S. Macaulay, "Some properties of enumeration in the theory of modular systems",
    // Proc. London Math. Soc. 26 (1927); the degree-d check counts dim_k I_d directly.
    const rand = rng(1927);
    for (let trial = 0; trial < 4; trial++) {
      const R = polyRing(GF, ["x", "y", "z", "w"], { order: trial % 2 === 0 ? { kind: "grevlex" } : { kind: "lex" } });
      const gens = [2, 2, 3].map((d) => randomForm(R, d, rand));
      const I = ideal(R, gens);
      const maxDeg = 6;
      const values = hilbertFunctionValues(idealHilbertSeries(I), maxDeg);
      const exps = initialIdeal(I).gens.map((g) => terms(R, g)[0].exps);
      expect(hilbertFunctionValues(hilbertSeriesOfMonomials(exps, R.degrees), maxDeg)).toEqual(values);
      for (let d = 0; d <= maxDeg; d++) {
        expect(values[d]).toBe(binomial(d + 3, 3) - BigInt(idealDimensionInDegree(R, gens, d)));
      }
    }
  });

  it("an inhomogeneous ideal in a lex ring: degree counts the solutions", () => {
    // x^2 = −y, y^3 = 1: over the algebraic closure of GF(32003) three distinct values of y
    // (p ≠ 3), each nonzero with two square roots (p ≠ 2): 6 simple points (by hand)
    const R = polyRing(GF, ["x", "y"], { order: { kind: "lex" } });
    const I = ideal(
      R,
      ["x^2+y", "y^3-1"].map((s) => parsePoly(R, s)),
    );
    expect(idealDimension(I)).toBe(0);
    expect(idealDegree(I)).toEqual({ n: 6n, d: 1n });
  });

  it("the zero ideal and the unit ideal", () => {
    const R = polyRing(QQ, ["x", "y", "z"]);
    const zero = ideal(R, []);
    expect(idealHilbertSeries(zero).numerator).toEqual([1n]);
    expect(idealDimension(zero)).toBe(3);
    expect(idealCodimension(zero)).toBe(0);
    const unit = ideal(R, [parsePoly(R, "x*y-1"), parsePoly(R, "x")]);
    expect(idealHilbertSeries(unit).numerator).toEqual([]);
    expect(idealDimension(unit)).toBe(-1);
    expect(idealDegree(unit).n).toBe(0n);
  });
});
