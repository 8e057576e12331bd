import { describe, expect, it } from "vitest";
import {
  ambientRing,
  definingIdeal,
  formatPoly,
  gf,
  ideal,
  idealEquals,
  idealIntersection,
  idealIsSubset,
  liftIdeal,
  parsePoly,
  polyRing,
  QQ,
  quotientAdd,
  quotientDegree,
  quotientDimension,
  quotientEquals,
  quotientHilbertSeries,
  quotientIsZero,
  quotientIsZeroRing,
  quotientMul,
  quotientNormalForm,
  quotientPow,
  quotientRing,
} from "@/lib/algebra";

describe("quotient rings", () => {
  const S = polyRing(QQ, ["x", "y"]);
  const P = (s: string) => parsePoly(S, s);

  it("computes in k[x, y]/(x^2, y^2) by normal forms", () => {
    const A = quotientRing(S, [P("x^2"), P("y^2")]);
    // by hand: (x + y)^2 = x^2 + 2xy + y^2 ≡ 2xy and (x + y)^3 ≡ 3x^2y + 3xy^2 ≡ 0
    expect(formatPoly(S, quotientPow(A, P("x+y"), 2))).toBe("2*x*y");
    expect(quotientIsZero(A, quotientPow(A, P("x+y"), 3))).toBe(true);
    expect(formatPoly(S, quotientMul(A, P("x+1"), P("x-1")))).toBe("-1");
    expect(formatPoly(S, quotientAdd(A, P("x^2+y"), P("y^2-y")))).toBe("0");
    expect(quotientEquals(A, P("x^3+y"), P("y"))).toBe(true);
    expect(quotientEquals(A, P("x*y"), P("y*x+x"))).toBe(false);
    // S/(x^2, y^2) has basis 1, x, y, xy: Hilbert series 1 + 2t + t^2, dimension 0, length 4
    const hs = quotientHilbertSeries(A);
    expect(hs.reducedNumerator).toEqual([1n, 2n, 1n]);
    expect(quotientDimension(A)).toBe(0);
    expect(quotientDegree(A)).toEqual({ n: 4n, d: 1n });
  });

  it("a quotient of a quotient is the quotient by the sum: (S/J)/I = S/(J + I)", () => {
    const A = quotientRing(S, [P("x^2")]);
    const B = quotientRing(A, [P("y^2")]);
    expect(ambientRing(B)).toBe(S);
    expect(idealEquals(definingIdeal(B), ideal(S, [P("x^2"), P("y^2")]))).toBe(true);
    expect(quotientIsZero(A, P("y^2"))).toBe(false);
    expect(quotientIsZero(B, P("x*y^2+x^2"))).toBe(true);
    // equal elements have equal normal forms, and the normal form is a representative
    const f = P("x^3*y+x*y^3+x*y+3");
    expect(formatPoly(S, quotientNormalForm(B, f))).toBe("x*y+3");
    expect(quotientEquals(B, f, quotientNormalForm(B, f))).toBe(true);
  });

  it("over GF(p), a quotient by the unit ideal is the zero ring and a polynomial ring is its own quotient by 0", () => {
    const R = polyRing(gf(7), ["x", "y", "z"]);
    const Z = quotientRing(R, [parsePoly(R, "x*y-1"), parsePoly(R, "x")]);
    expect(quotientIsZeroRing(Z)).toBe(true);
    expect(quotientDimension(Z)).toBe(-1);
    expect(quotientIsZeroRing(R)).toBe(false);
    expect(quotientDimension(R)).toBe(3);
    // 8x ≡ x over GF(7)
    expect(quotientEquals(R, parsePoly(R, "8*x"), parsePoly(R, "x"))).toBe(true);
    // a twisted cubic quotient: dimension 2 and degree 3 (common practice)
    const T = polyRing(gf(7), ["a", "b", "c", "d"]);
    const C = quotientRing(
      T,
      ["a*c-b^2", "a*d-b*c", "b*d-c^2"].map((s) => parsePoly(T, s)),
    );
    expect(quotientDimension(C)).toBe(2);
    expect(quotientDegree(C)).toEqual({ n: 3n, d: 1n });
  });

  it("ideals of a quotient are lifted to ideals of S containing J", () => {
    // in A = k[x, y]/(x^2): (y) ∩ (x + y) lifts to (x^2, y) ∩ (x^2, x + y) = (x^2, xy, y^2)
    // (by hand: modulo (x^2, xy, y^2) the only candidate left in (x^2, y) is y, and y ↦ −x
    // under y = −x is not in (x^2))
    const A = quotientRing(S, [P("x^2")]);
    const Y = liftIdeal(A, ideal(S, [P("y")]));
    const XY = liftIdeal(A, ideal(S, [P("x+y")]));
    expect(idealEquals(idealIntersection(Y, XY), ideal(S, [P("x^2"), P("x*y"), P("y^2")]))).toBe(true);
    expect(idealIsSubset(definingIdeal(A), Y)).toBe(true);
  });

  it("rejects an ideal of another ring", () => {
    const T = polyRing(QQ, ["u"]);
    expect(() => quotientRing(S, ideal(T, [parsePoly(T, "u")]))).toThrow(/not in the ambient ring/);
  });
});
