import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as A from "@/lib/algebra";
import { gfCoeffs, qCoeffs } from "@/lib/algebra/field/coeffs";
import { mulModLarge } from "@/lib/algebra/field/gfp";
import { bigGcd, parseRat, rat, ratAdd, ratCompare, ratDiv, ratMul, ratOf, ratSub, ratToString } from "@/lib/algebra/field/rational";

describe("coefficient fields", () => {
  it("accepts primes below 2^31 and rejects everything else with a clear message", () => {
    expect(A.gf(2)).toEqual({ kind: "gf", p: 2 });
    expect(A.gf(2147483647).p).toBe(2147483647); // 2^31 − 1 is a Mersenne prime (common practice)
    expect(() => A.gf(12)).toThrow(/12 is not prime/);
    expect(() => A.gf(1)).toThrow(/2 <= p < 2\^31/);
    expect(() => A.gf(2 ** 31 + 11)).toThrow(/2 <= p < 2\^31/);
    expect(() => A.gf(7.5)).toThrow(/integer/);
    try {
      A.gf(91); // 91 = 7·13
    } catch (e) {
      expect(e).toBeInstanceOf(A.AlgebraError);
      expect((e as A.AlgebraError).kind).toBe("runtime");
    }
  });

  it("multiplies exactly modulo primes above 2^26 (checked against BigInt)", () => {
    const p = 2147483629; // a prime below 2^31 (checked by isPrime below)
    expect(A.isPrime(p)).toBe(true);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: p - 1 }), fc.integer({ min: 0, max: p - 1 }), (a, b) => {
        expect(mulModLarge(a, b, p)).toBe(Number((BigInt(a) * BigInt(b)) % BigInt(p)));
      }),
    );
    const K = gfCoeffs({ kind: "gf", p });
    expect(K.mul(p - 1, p - 1)).toBe(1); // (−1)² = 1
  });

  it("inverts every non-zero residue (a · a⁻¹ = 1)", () => {
    for (const p of [2, 3, 32003, 65537, 2147483647]) {
      const K = gfCoeffs({ kind: "gf", p });
      fc.assert(
        fc.property(fc.integer({ min: 1, max: p - 1 }), (a) => {
          expect(K.mul(a, K.inv(a))).toBe(1);
        }),
        { numRuns: 50 },
      );
    }
  });

  it("satisfies Fermat's little theorem a^(p−1) = 1 in GF(p)", () => {
    const R = A.polyRing(A.gf(32003), []);
    expect(A.formatPoly(R, A.pow(R, A.constant(R, 5n), 32002))).toBe("1");
    expect(A.formatPoly(R, A.pow(R, A.constant(R, 5n), 16001))).toMatch(/^-?1$/); // Euler's criterion: ±1
  });

  it("computes exactly over Q and maps rationals into GF(p)", () => {
    const K = qCoeffs;
    const s = K.add(K.fromRational(1n, 2n), K.fromRational(1n, 3n));
    expect(K.toRational(s)).toEqual({ num: 5n, den: 6n });
    expect(K.toRational(K.fromRational(6n, -4n))).toEqual({ num: -3n, den: 2n });
    const G = gfCoeffs({ kind: "gf", p: 7 });
    expect(G.fromRational(1n, 2n)).toBe(4); // 2·4 = 8 ≡ 1 (mod 7)
    expect(() => G.fromRational(1n, 14n)).toThrow(/denominator 14 is 0 in GF\(7\)/);
    expect(() => K.fromRational(1n, 0n)).toThrow(/division by zero/);
  });
});

describe("rational arithmetic (Lehmer gcd, Henrici's sums and products)", () => {
  const euclid = (a: bigint, b: bigint): bigint => {
    a = a < 0n ? -a : a;
    b = b < 0n ? -b : b;
    while (b !== 0n) [a, b] = [b, a % b];
    return a;
  };
  // numbers of up to ~600 bits, often sharing a large common factor
  const big = fc.bigInt({ min: -(2n ** 600n), max: 2n ** 600n });
  const factor = fc.bigInt({ min: 1n, max: 2n ** 200n });

  it("bigGcd agrees with the plain Euclidean algorithm (Knuth vol. 2, §4.5.2: both compute the gcd)", () => {
    fc.assert(
      fc.property(big, big, factor, (a, b, g) => {
        expect(bigGcd(a * g, b * g)).toBe(euclid(a * g, b * g));
        expect(bigGcd(a, b)).toBe(euclid(a, b));
      }),
      { numRuns: 2000 },
    );
    for (const [a, b] of [
      [0n, 0n],
      [0n, 7n],
      [2n ** 53n, 2n ** 53n + 1n],
      [2n ** 64n, 2n ** 32n],
      [3n ** 300n, 3n ** 299n * 2n],
      [3n ** 700n * 5n + 1n, 3n ** 699n * 7n],
    ] as const) {
      expect(bigGcd(a, b)).toBe(euclid(a, b));
    }
  });

  it("sums, differences and products are the reduced fractions of the schoolbook formulas (common practice)", () => {
    const reduced = (n: bigint, d: bigint) => {
      const g = euclid(n, d) || 1n;
      return d < 0n ? { n: -n / g, d: -d / g } : { n: n / g, d: d / g };
    };
    const frac = fc.tuple(big, fc.bigInt({ min: 1n, max: 2n ** 300n }), factor).map(([n, d, g]) => rat(n * g, d * g));
    fc.assert(
      fc.property(frac, frac, (a, b) => {
        expect(ratAdd(a, b)).toEqual(reduced(a.n * b.d + b.n * a.d, a.d * b.d));
        expect(ratSub(a, b)).toEqual(reduced(a.n * b.d - b.n * a.d, a.d * b.d));
        expect(ratMul(a, b)).toEqual(reduced(a.n * b.n, a.d * b.d));
      }),
      { numRuns: 2000 },
    );
  });

  it("quotients, order and text of the operations the Hilbert code and the evaluator use (common practice)", () => {
    const small = fc.tuple(fc.bigInt({ min: -1000n, max: 1000n }), fc.bigInt({ min: 1n, max: 1000n })).map(([n, d]) => rat(n, d));
    fc.assert(
      fc.property(small, small, (a, b) => {
        if (b.n !== 0n) expect(ratMul(ratDiv(a, b), b)).toEqual(a);
        // distinct fractions with denominators ≤ 1000 differ by ≥ 10^-6: floating point orders them exactly
        const x = Number(a.n) / Number(a.d);
        const y = Number(b.n) / Number(b.d);
        expect(ratCompare(a, b)).toBe(x < y ? -1 : x > y ? 1 : 0);
        expect(parseRat(ratToString(a))).toEqual(a);
      }),
      { numRuns: 2000 },
    );
    const thrown = (f: () => unknown): unknown => {
      try {
        f();
      } catch (e) {
        return e;
      }
      return null;
    };
    const e = thrown(() => ratDiv(rat(1n, 2n), rat(0n)));
    expect(e).toBeInstanceOf(A.AlgebraError);
    expect(e).toMatchObject({ kind: "runtime", message: "division by zero" });
    expect(() => ratOf(1n, 0n)).toThrow(/division by zero/);
    expect(ratOf(6n, -4n)).toEqual({ n: -3n, d: 2n });
    expect(parseRat("-6/4")).toEqual({ n: -3n, d: 2n });
    expect([parseRat("1/0"), parseRat("6/-4"), parseRat("1.5"), parseRat("")]).toEqual([null, null, null, null]);
  });
});
