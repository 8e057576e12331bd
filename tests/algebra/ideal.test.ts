import { describe, expect, it } from "vitest";
import {
  AlgebraError,
  formatPoly,
  gf,
  groebnerBasis,
  ideal,
  type Ideal,
  idealColon,
  idealColonElement,
  idealContains,
  idealEliminate,
  idealEquals,
  idealGroebnerBasis,
  idealIntersection,
  idealIsHomogeneous,
  idealIsSubset,
  idealPower,
  idealProduct,
  idealSaturation,
  idealSum,
  initialIdeal,
  monomial,
  parsePoly,
  polyRing,
  type PolyRing,
  QQ,
  terms,
} from "@/lib/algebra";

const GF = gf(32003);

function parseIdeal(R: PolyRing, gens: string[]): Ideal {
  return ideal(
    R,
    gens.map((s) => parsePoly(R, s)),
  );
}

function texts(I: Ideal): string[] {
  return idealGroebnerBasis(I).map((g) => formatPoly(I.ring, g));
}

/// mulberry32: reproducible pseudo-random numbers.
function rng(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function monomialIdeal(R: PolyRing, exps: number[][]): Ideal {
  return ideal(
    R,
    exps.map((e) => monomial(R, e)),
  );
}

describe("ideal operations on hand-checkable examples", () => {
  const R = polyRing(GF, ["x", "y", "z"]);

  it("intersection and colon of monomial ideals", () => {
    // by hand: (x^2, xy) ∩ (y^2) = (lcm(x^2, y^2), lcm(xy, y^2)) = (x^2 y^2, x y^2) = (x y^2)
    expect(texts(idealIntersection(parseIdeal(R, ["x^2", "x*y"]), parseIdeal(R, ["y^2"])))).toEqual(["x*y^2"]);
    // (x^2, y^3) : xy = (x^2/gcd, y^3/gcd) = (x, y^2)
    expect(idealEquals(idealColonElement(parseIdeal(R, ["x^2", "y^3"]), parsePoly(R, "x*y")), parseIdeal(R, ["x", "y^2"]))).toBe(true);
    // (xy, xz) : x = (y, z); (x^2, xy) : (x, y) = (x^2, xy) : x ∩ (x^2, xy) : y = (x, y) ∩ (x) = (x)
    expect(idealEquals(idealColonElement(parseIdeal(R, ["x*y", "x*z"]), parsePoly(R, "x")), parseIdeal(R, ["y", "z"]))).toBe(true);
    expect(texts(idealColon(parseIdeal(R, ["x^2", "x*y"]), parseIdeal(R, ["x", "y"])))).toEqual(["x"]);
  });

  it("intersections and colons of random monomial ideals agree with lcms and monomial quotients", () => {
    // For monomial ideals (m_i) ∩ (n_j) = (lcm(m_i, n_j)) and (m_i) : n = (m_i / gcd(m_i, n))
    // (D. Cox, J. Little, D. O'Shea, Ideals, Varieties, and Algorithms, Ch. 4 §3–4)
    const rand = rng(34);
    const randomExps = () => Array.from({ length: 1 + Math.floor(rand() * 3) }, () => [0, 1, 2].map(() => Math.floor(rand() * 4)));
    for (let trial = 0; trial < 12; trial++) {
      const a = randomExps(),
        b = randomExps();
      const I = monomialIdeal(R, a),
        J = monomialIdeal(R, b);
      const lcms = a.flatMap((m) => b.map((n) => m.map((e, i) => Math.max(e, n[i]))));
      expect(idealEquals(idealIntersection(I, J), monomialIdeal(R, lcms))).toBe(true);
      const n = b[0];
      const quotients = a.map((m) => m.map((e, i) => Math.max(0, e - n[i])));
      expect(idealEquals(idealColonElement(I, monomial(R, n)), monomialIdeal(R, quotients))).toBe(true);
    }
  });

  it("sum, product, power, membership, containment and equality", () => {
    const X = parseIdeal(R, ["x"]),
      Y = parseIdeal(R, ["y"]);
    expect(texts(idealProduct(X, Y))).toEqual(["x*y"]);
    expect(texts(idealSum(X, Y))).toEqual(["y", "x"]);
    // (x, y)^3 = (x^3, x^2 y, x y^2, y^3) by expanding
    const m3 = idealPower(idealSum(X, Y), 3);
    expect(idealEquals(m3, parseIdeal(R, ["x^3", "x^2*y", "x*y^2", "y^3"]))).toBe(true);
    expect(idealContains(m3, parsePoly(R, "(x+y)^3-z*x^3"))).toBe(true);
    expect(idealContains(m3, parsePoly(R, "x^2*z"))).toBe(false);
    expect(idealIsSubset(m3, idealPower(idealSum(X, Y), 2))).toBe(true);
    expect(idealIsSubset(idealPower(idealSum(X, Y), 2), m3)).toBe(false);
    expect(texts(idealPower(X, 0))).toEqual(["1"]);
  });

  it("saturation removes the components at the maximal ideal", () => {
    // k[x, y]: (x^2, xy) = (x) ∩ (x^2, y), so (x^2, xy) : (x, y)^∞ = (x) (by hand)
    const S = polyRing(QQ, ["x", "y"]);
    expect(texts(idealSaturation(parseIdeal(S, ["x^2", "x*y"]), parseIdeal(S, ["x", "y"])))).toEqual(["x"]);
    // (x, y) ∩ m^3 in k[x, y, z] saturates to (x, y); colon by m only to (x, y) ∩ m^2
    const m = parseIdeal(R, ["x", "y", "z"]);
    const I = idealIntersection(parseIdeal(R, ["x", "y"]), idealPower(m, 3));
    expect(texts(idealSaturation(I, m))).toEqual(["y", "x"]);
    expect(idealEquals(idealColon(I, m), idealIntersection(parseIdeal(R, ["x", "y"]), idealPower(m, 2)))).toBe(true);
  });

  it("elimination gives the implicit equations of the twisted cubic", () => {
    // (s^3, s^2 t, s t^2, t^3) parametrises the twisted cubic xz − y^2, xw − yz, yw − z^2
    // (D. Cox, J. Little, D. O'Shea, Ideals, Varieties, and Algorithms, Ch. 3 §3)
    const T = polyRing(QQ, ["s", "t", "x", "y", "z", "w"]);
    const E = idealEliminate(parseIdeal(T, ["x-s^3", "y-s^2*t", "z-s*t^2", "w-t^3"]), ["s", "t"]);
    expect(idealEquals(E, parseIdeal(T, ["x*z-y^2", "x*w-y*z", "y*w-z^2"]))).toBe(true);
    for (const g of E.gens) for (const t of terms(T, g)) expect(t.exps[0] + t.exps[1]).toBe(0);
  });

  it("the initial ideal of the twisted cubic in grevlex is (y^2, yz, z^2)", () => {
    // by hand: the grevlex leading terms of xz − y^2, xw − yz, yw − z^2 are y^2, yz, z^2,
    // and these three already form a Gröbner basis (common practice for this example)
    const S = polyRing(GF, ["x", "y", "z", "w"]);
    const I = parseIdeal(S, ["x*z-y^2", "x*w-y*z", "y*w-z^2"]);
    expect(idealEquals(initialIdeal(I), parseIdeal(S, ["y^2", "y*z", "z^2"]))).toBe(true);
  });

  it("results of elimination in a grevlex ring carry their reduced Gröbner basis, as a fresh computation confirms", () => {
    // uniqueness of reduced Gröbner bases (common practice): the cached basis must equal a recomputed one
    for (const S of [R, polyRing(GF, ["x", "y", "z"], { degrees: [1, 2, 3] })]) {
      const I = parseIdeal(S, ["x^3-y*z+x", "y^2-x*z"]);
      const J = parseIdeal(S, ["x*y-z^2", "z-x^2"]);
      for (const K of [idealIntersection(I, J), idealSaturation(I, parseIdeal(S, ["x"])), idealEliminate(I, ["x"])]) {
        expect(texts(K)).toEqual(groebnerBasis(S, [...K.gens]).map((g) => formatPoly(S, g)));
      }
    }
  });

  it("homogeneity is a property of the ideal, not of its generators", () => {
    expect(idealIsHomogeneous(parseIdeal(R, ["x^2+y", "z"]))).toBe(false);
    // (x + y^2, y^2) = (x, y^2)
    expect(idealIsHomogeneous(parseIdeal(R, ["x+y^2", "y^2"]))).toBe(true);
    const W = polyRing(GF, ["x", "y"], { degrees: [1, 2] });
    expect(idealIsHomogeneous(parseIdeal(W, ["x^2+y"]))).toBe(true);
  });

  it("bad input gives clear errors; options reach the Gröbner basis computations", () => {
    const other = polyRing(GF, ["a", "b"]);
    expect(() => idealSum(parseIdeal(R, ["x"]), parseIdeal(other, ["a"]))).toThrow(/different ring/);
    expect(() => idealEliminate(parseIdeal(R, ["x"]), ["q"])).toThrow(/q is not a variable/);
    expect(() => idealPower(parseIdeal(R, ["x"]), -1)).toThrow(/non-negative integer/);
    expect(() => ideal(R, [parsePoly(other, "a")])).toThrow(/another number of variables/);
    const controller = new AbortController();
    controller.abort();
    const cyclicLike = parseIdeal(R, ["x+y+z", "x*y+y*z+z*x", "x*y*z-1"]);
    let error: unknown;
    try {
      idealIntersection(cyclicLike, parseIdeal(R, ["x^2-y"]), { signal: controller.signal });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(AlgebraError);
    expect((error as AlgebraError).kind).toBe("cancelled");
    expect(() => idealPower(parseIdeal(R, ["x", "y", "z"]), 4, { limits: { maxBasisSize: 10 } })).toThrow(/maxBasisSize/);
  });
});
