import { describe, expect, it } from "vitest";
import * as A from "@/lib/algebra";
import { countStandardMonomials, cyclic, katsura } from "../bench/families";

const F = A.gf(32003);
const texts = (R: A.PolyRing, G: A.Poly[]) => G.map((g) => A.formatPoly(R, g));

describe("Gröbner bases: published examples", () => {
  // D. Cox, J. Little, D. O'Shea, "Ideals, Varieties, and Algorithms", Ch. 2 §7–§8:
  // I = <x^3 − 2xy, x^2 y − 2y^2 + x> in graded lex order has reduced basis
  // {x^2, xy, y^2 − x/2} (from memory).
  it("computes the textbook example over Q and over GF(32003)", () => {
    const Q = A.polyRing(A.QQ, ["x", "y"], { order: { kind: "glex" } });
    const gens = ["x^3-2*x*y", "x^2*y-2*y^2+x"];
    expect(
      texts(
        Q,
        A.groebnerBasis(
          Q,
          gens.map((s) => A.parsePoly(Q, s)),
        ),
      ),
    ).toEqual(["y^2-1/2*x", "x*y", "x^2"]);
    const R = A.polyRing(F, ["x", "y"], { order: { kind: "glex" } });
    expect(
      texts(
        R,
        A.groebnerBasis(
          R,
          gens.map((s) => A.parsePoly(R, s)),
        ),
      ),
    ).toEqual(["y^2+16001*x", "x*y", "x^2"]);
  });

  // Björck–Fröberg, J. Symbolic Comput. 1991: cyclic-5 and cyclic-6 have 70 and 156 solutions counted with
  // multiplicity (G. Björck, R. Fröberg, J. Symbolic Comput. 1991).
  it("cyclic-5 has degree 70 and cyclic-6 degree 156", () => {
    for (const [n, deg] of [
      [5, 70],
      [6, 156],
    ]) {
      const { R, gens } = cyclic(F, n);
      expect(countStandardMonomials(R, A.groebnerBasis(R, gens))).toBe(deg);
    }
  });

  // common practice: katsura-n has degree 2^n (common practice: the Bézout bound is attained).
  it("katsura-n has degree 2^n", () => {
    for (const n of [2, 3, 4, 5, 6]) {
      const { R, gens } = katsura(F, n);
      expect(countStandardMonomials(R, A.groebnerBasis(R, gens))).toBe(2 ** n);
    }
  });

  it("katsura-4 over Q by the modular method has degree 16 and lifts exactly", () => {
    const { R, gens } = katsura(A.QQ, 4);
    const G = A.groebnerBasis(R, gens);
    expect(countStandardMonomials(R, G)).toBe(16);
    for (const f of gens) expect(A.isZero(A.normalForm(R, f, G))).toBe(true);
  });

  it("returns <1> for an inconsistent system and [] for the zero ideal", () => {
    const R = A.polyRing(A.QQ, ["x", "y"]);
    expect(
      texts(
        R,
        A.groebnerBasis(
          R,
          ["x*y-1", "x"].map((s) => A.parsePoly(R, s)),
        ),
      ),
    ).toEqual(["1"]);
    expect(A.groebnerBasis(R, [A.zero(R)])).toEqual([]);
    expect(A.groebnerBasis(R, [])).toEqual([]);
  });

  it("works in weighted orders and gradings", () => {
    // In a weighted grading the twisted-cubic parametrisation x = t, y = t^2, z = t^3 gives a
    // homogeneous ideal when deg x = 1, deg y = 2, deg z = 3 (from the definition).
    const R = A.polyRing(F, ["x", "y", "z"], { degrees: [1, 2, 3] });
    const G = A.groebnerBasis(
      R,
      ["y-x^2", "z-x*y"].map((s) => A.parsePoly(R, s)),
    );
    expect(G.every((g) => A.isHomogeneous(R, g))).toBe(true);
    expect(A.isZero(A.normalForm(R, A.parsePoly(R, "x*z-y^2"), G))).toBe(true);
    const W = A.polyRing(F, ["x", "y", "z"], { order: { kind: "weights", weights: [1, 1, 0] } });
    const H = A.groebnerBasis(
      W,
      ["y-x^2", "z-x*y"].map((s) => A.parsePoly(W, s)),
    );
    expect(H.length).toBeGreaterThan(0);
    expect(A.isZero(A.normalForm(W, A.parsePoly(W, "x*z-y^2"), H))).toBe(true);
  });
});

describe("normal forms", () => {
  it("reduces members of the ideal to 0 and others to their remainder", () => {
    const R = A.polyRing(A.QQ, ["x", "y"], { order: { kind: "lex" } });
    const G = A.groebnerBasis(
      R,
      ["x^2-y", "y^2-1"].map((s) => A.parsePoly(R, s)),
    );
    expect(A.isZero(A.normalForm(R, A.parsePoly(R, "(x^2-y)*(x+3*y)+(y^2-1)*x^5"), G))).toBe(true);
    // x^4 = y^2 = 1 modulo the ideal.
    expect(A.formatPoly(R, A.normalForm(R, A.parsePoly(R, "x^4+x"), G))).toBe("x+1");
  });
});

describe("computations are bounded and cancellable", () => {
  const { R, gens } = cyclic(F, 6);
  const fail = (opts: A.ComputeOptions) => {
    try {
      A.groebnerBasis(R, gens, opts);
    } catch (e) {
      expect(e).toBeInstanceOf(A.AlgebraError);
      return e as A.AlgebraError;
    }
    throw new Error("expected the computation to stop");
  };

  it("stops with a named limit", () => {
    const e1 = fail({ limits: { maxBasisSize: 10 } });
    expect([e1.kind, e1.limit]).toEqual(["limit", "maxBasisSize"]);
    const e2 = fail({ limits: { maxDegree: 4 } });
    expect([e2.kind, e2.limit]).toEqual(["limit", "maxDegree"]);
    const e3 = fail({ limits: { maxTerms: 20 } });
    expect([e3.kind, e3.limit]).toEqual(["limit", "maxTerms"]);
  });

  it("stops when the signal is aborted, also from the progress callback", () => {
    const c = new AbortController();
    c.abort();
    expect(fail({ signal: c.signal }).kind).toBe("cancelled");
    const d = new AbortController();
    const seen: string[] = [];
    const e = fail({
      signal: d.signal,
      progress: (p) => {
        seen.push(p.stage);
        d.abort();
      },
    });
    expect(e.kind).toBe("cancelled");
    expect(seen).toContain("groebner");
  });
});
