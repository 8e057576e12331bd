import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as A from "@/lib/algebra";

const Q = A.polyRing(A.QQ, ["x", "y", "z"]);
const F7 = A.polyRing(A.gf(7), ["x", "y", "z"]);
const P = (R: A.PolyRing, s: string) => A.parsePoly(R, s);
const show = (R: A.PolyRing, s: string) => A.formatPoly(R, P(R, s));

describe("canonical printing (lib/notation/README.md, the JSON encoding)", () => {
  it("prints terms in decreasing order with * and ^, no spaces, coefficient 1 omitted", () => {
    expect(show(Q, "3 + x*y*x - 2 * x")).toBe("x^2*y-2*x+3");
    expect(show(Q, "3/4*x^2 - y")).toBe("3/4*x^2-y");
    expect(show(Q, "-x + 0*y")).toBe("-x");
    expect(show(Q, "x - x")).toBe("0");
    expect(show(Q, "-1")).toBe("-1");
    expect(show(Q, "(6/4)*x/3")).toBe("1/2*x");
  });

  it("prints GF(p) coefficients in the symmetric range −p/2 < c ≤ p/2", () => {
    expect(show(F7, "4*x + 3*y + 6")).toBe("-3*x+3*y-1");
    expect(show(F7, "x/2")).toBe("-3*x"); // 1/2 = 4 = −3 in GF(7)
    const F2 = A.polyRing(A.gf(2), ["x"]);
    expect(show(F2, "x^2 + 3*x + 2")).toBe("x^2+x"); // in GF(2): −1 = 1 prints as 1
    expect(A.terms(F7, P(F7, "6*x")).map((t) => t.num)).toEqual([-1n]);
  });

  it("reads back what it prints (round trip)", () => {
    const term = fc.record({
      num: fc.integer({ min: -50, max: 50 }),
      den: fc.integer({ min: 1, max: 9 }),
      exps: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 3, maxLength: 3 }),
    });
    for (const R of [Q, F7, A.polyRing(A.gf(32003), ["x", "y", "z"], { order: { kind: "lex" } })]) {
      fc.assert(
        fc.property(fc.array(term, { maxLength: 8 }), (ts) => {
          let f = A.zero(R);
          for (const t of ts) {
            if (R.field.kind === "gf" && t.den % 7 === 0) continue;
            f = A.add(R, f, A.monomial(R, t.exps, BigInt(t.num), BigInt(t.den)));
          }
          const text = A.formatPoly(R, f);
          expect(text).not.toMatch(/\s/);
          const g = A.parsePoly(R, text);
          expect(A.equals(R, f, g)).toBe(true);
          expect(A.formatPoly(R, g)).toBe(text);
        }),
      );
    }
  });

  it("lists terms in decreasing order with exact coefficients", () => {
    expect(A.terms(Q, P(Q, "y - 3/4*x^2"))).toEqual([
      { num: -3n, den: 4n, exps: [2, 0, 0] },
      { num: 1n, den: 1n, exps: [0, 1, 0] },
    ]);
    expect(A.leadExponents(Q, P(Q, "y+x*z"))).toEqual([1, 0, 1]);
    expect(A.degree(Q, A.zero(Q))).toBe(-1);
    expect(A.termCount(P(Q, "(x+y)^3"))).toBe(4);
  });
});

describe("polynomial arithmetic", () => {
  it("expands with binomial coefficients (the binomial theorem)", () => {
    expect(show(Q, "(x+y)^4")).toBe("x^4+4*x^3*y+6*x^2*y^2+4*x*y^3+y^4");
    // Frobenius in characteristic 7: (x+y)^7 = x^7 + y^7.
    expect(show(F7, "(x+y)^7")).toBe("x^7+y^7");
  });

  it("is a commutative ring (random checks of the axioms)", () => {
    const poly = fc
      .array(fc.tuple(fc.integer({ min: -5, max: 5 }), fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 3, maxLength: 3 })), {
        maxLength: 5,
      })
      .map((ts) => ts.reduce((f, [c, e]) => A.add(Q, f, A.monomial(Q, e, BigInt(c))), A.zero(Q)));
    fc.assert(
      fc.property(poly, poly, poly, (f, g, h) => {
        expect(A.equals(Q, A.mul(Q, f, g), A.mul(Q, g, f))).toBe(true);
        expect(A.equals(Q, A.mul(Q, f, A.add(Q, g, h)), A.add(Q, A.mul(Q, f, g), A.mul(Q, f, h)))).toBe(true);
        expect(A.isZero(A.sub(Q, A.add(Q, f, g), A.add(Q, g, f)))).toBe(true);
        expect(A.equals(Q, A.pow(Q, f, 3), A.mul(Q, f, A.mul(Q, f, f)))).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("scales, negates and builds constants", () => {
    expect(A.formatPoly(Q, A.scale(Q, P(Q, "x+2"), 3n, 4n))).toBe("3/4*x+3/2");
    expect(A.formatPoly(Q, A.neg(Q, P(Q, "x-1")))).toBe("-x+1");
    expect(A.formatPoly(F7, A.constant(F7, 10n))).toBe("3");
    expect(A.formatPoly(Q, A.variable(Q, 2))).toBe("z");
    expect(() => A.variable(Q, 3)).toThrow(/out of range/);
    expect(() => A.add(Q, P(Q, "x"), P(F7, "x"))).toThrow(/different ring/);
  });
});

describe("parser errors say where and why", () => {
  const err = (s: string) => {
    try {
      A.parsePoly(Q, s);
    } catch (e) {
      expect(e).toBeInstanceOf(A.AlgebraError);
      return (e as Error).message;
    }
    throw new Error(`expected ${s} to fail`);
  };
  it("rejects implicit multiplication, suggesting *", () => {
    expect(err("2x+1")).toMatch(/write 2\*x/);
    expect(err("x y")).toMatch(/column 3 .*missing operator/);
  });
  it("rejects unknown variables, bad exponents, decimals and unbalanced input", () => {
    expect(err("x+w")).toMatch(/column 3 .*unknown variable w.*x, y, z/);
    expect(err("x^-1")).toMatch(/non-negative integer/);
    expect(err("x^y")).toMatch(/integer exponent/);
    expect(err("1.5*x")).toMatch(/fraction/);
    expect(err("(x+y")).toMatch(/expected '\)'/);
    expect(err("x+y)")).toMatch(/unbalanced/);
    expect(err("x/y")).toMatch(/only by a non-zero number/);
    expect(err("x/0")).toMatch(/division by zero/);
    expect(err("")).toMatch(/empty/);
    expect(err("x+")).toMatch(/ends too early/);
    expect(err("x$")).toMatch(/unexpected character/);
    expect(err("x^99999999999")).toMatch(/too large/);
  });
  it("reports the offset of the problem", () => {
    try {
      A.parsePoly(Q, "x + y + q");
    } catch (e) {
      expect((e as A.AlgebraError).offset).toBe(8);
    }
  });
});
