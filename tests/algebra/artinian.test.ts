import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";
import {
  componentAtOrigin,
  FiniteAlgebra,
  localAlgebraAtOrigin,
  minimalGeneratorCount,
  minimalGeneratorPositions,
} from "../../lib/algebra/artinian/index";
import { resolveLocalArtinian } from "../../lib/algebra/resolution/artinian/resolve";
import { resolveDegreewise } from "../../lib/algebra/resolution/graded-quotient/index";
import { binomial, maximal, ring, vars } from "./local-helpers";

describe("Artinian local rings as finite-dimensional algebras", () => {
  it("k[x1..xn]/m^p has length C(n+p−1, n) and socle m^{p−1}", () => {
    // counting monomials, common practice: dim R_d = C(n−1+d, n−1) for d < p; the socle of S/m^p is m^{p−1}
    // (common practice).
    for (const [n, p] of [
      [2, 3],
      [3, 2],
      [3, 3],
    ] as const) {
      const S = ring(n);
      const Al = new FiniteAlgebra(S, A.idealPower(maximal(S), p));
      expect(Al.dim).toBe(binomial(n + p - 1, n));
      expect(Al.socle().length).toBe(binomial(n + p - 2, n - 1));
    }
  });

  it("a complete intersection is Gorenstein: one-dimensional socle", () => {
    // Artinian complete intersections are Gorenstein (common practice); length = product of
    // the degrees (Bézout, common practice).
    const S = ring(3);
    const [x, y, z] = vars(S);
    const I = A.ideal(S, [A.add(S, A.mul(S, x, x), A.mul(S, y, z)), A.add(S, A.mul(S, y, y), A.mul(S, x, z)), A.pow(S, z, 3)]);
    const Al = new FiniteAlgebra(S, I);
    expect(Al.dim).toBe(12);
    expect(Al.socle().length).toBe(1);
  });

  it("keeps only the factor at the origin of a non-homogeneous ideal", () => {
    // By hand: V(x^2 − x^3, y^2 − xy) is the origin and the points (1, 0), (1, 1). At the
    // origin 1 − x is a unit, so the local ring is k[x,y]/(x^2, y^2 − xy) with basis 1, x, y,
    // xy (length 4); the other two points are reduced, so S/I has length 4 + 1 + 1.
    const S = ring(2);
    const [x, y] = vars(S);
    const I = A.ideal(S, [A.sub(S, A.mul(S, x, x), A.pow(S, x, 3)), A.sub(S, A.mul(S, y, y), A.mul(S, x, y))]);
    expect(new FiniteAlgebra(S, I).dim).toBe(6);
    const c = componentAtOrigin(I);
    expect(c.length).toBe(4);
    const local = localAlgebraAtOrigin(I);
    expect(local.dim).toBe(4);
    expect(local.socle().length).toBe(1);
    expect(() => componentAtOrigin(A.ideal(S, [A.sub(S, x, A.one(S)), y]))).toThrow(/not a zero/);
  });

  it("minimal generators by Nakayama", () => {
    // In k[x,y]/m^4 the ideal (x^2, xy, x^3, x^2 + y^3) needs 3 generators: x^3 = x·x^2
    // lies in m·I (by hand).
    const S = ring(2);
    const [x, y] = vars(S);
    const Al = new FiniteAlgebra(S, A.idealPower(maximal(S), 4));
    const gens = [A.mul(S, x, x), A.mul(S, x, y), A.pow(S, x, 3), A.add(S, A.mul(S, x, x), A.pow(S, y, 3))];
    expect(minimalGeneratorCount(Al, gens)).toBe(3);
    expect(minimalGeneratorPositions(Al, gens)).toEqual([0, 1, 3]);
  });
});

describe("minimal resolutions over local Artinian rings (ungraded, by linear algebra)", () => {
  const totals = (J: A.Ideal, I: A.Ideal, n: number) => resolveDegreewise({ ring: J, module: I, length: n }).columns.map((c) => c.total);

  it("agrees with the degree-by-degree resolution on graded Artinian rings", () => {
    // Two methods on the same graded rings: k over k[x,y,z]/m^3 (Golod 1962),
    // k and R/(x) over k[x,y]/(x^2, y^2) (Tate, Illinois J. Math. 1957).
    const S3 = ring(3),
      S2 = ring(2);
    const [x, y] = vars(S2);
    const cases: [A.Ideal, A.Ideal, number][] = [
      [A.idealPower(maximal(S3), 3), maximal(S3), 4],
      [A.ideal(S2, [A.mul(S2, x, x), A.mul(S2, y, y)]), maximal(S2), 6],
      [A.ideal(S2, [A.mul(S2, x, x), A.mul(S2, y, y)]), A.ideal(S2, [x]), 5],
    ];
    for (const [J, I, n] of cases) expect(resolveLocalArtinian(J, I, n).ranks).toEqual(totals(J, I, n));
  });

  it("non-homogeneous complete intersections follow Tate's series (1+t)^n/(1−t^2)^n", () => {
    // J. Tate, Illinois J. Math. 1957: for a complete intersection in m^2 with c = n equations,
    // P_k(t) = (1+t)^n/(1−t^2)^n = 1/(1−t)^n, so β_i = C(n+i−1, i).
    const S2 = ring(2, A.QQ);
    const [u, v] = vars(S2);
    const L = A.ideal(S2, [A.add(S2, A.mul(S2, u, u), A.mul(S2, v, A.mul(S2, v, v))), A.mul(S2, u, v)]);
    expect(resolveLocalArtinian(L, maximal(S2), 6).ranks).toEqual([1, 2, 3, 4, 5, 6, 7]);
    const S3 = ring(3);
    const [x, y, z] = vars(S3);
    const cube = (a: A.Poly) => A.mul(S3, a, A.mul(S3, a, a));
    const T = A.ideal(S3, [A.add(S3, A.mul(S3, x, x), cube(y)), A.add(S3, A.mul(S3, y, y), cube(z)), A.add(S3, A.mul(S3, z, z), cube(x))]);
    const Q = componentAtOrigin(T).ideal;
    expect(resolveLocalArtinian(Q, maximal(S3), 5).ranks).toEqual([0, 1, 2, 3, 4, 5].map((i) => binomial(i + 2, i)));
  });

  it("reads only the factor at the origin: (x(x−1), y^2) is k[y]/(y^2) there, so β_i(k) = 1", () => {
    // At the origin x − 1 is a unit, so the local ring is k[x,y]/(x, y^2) (common practice);
    // over k[y]/(y^2) the resolution of k is periodic: ← A ←y− A ←y− … (every β_i = 1).
    const S2 = ring(2);
    const [x, y] = vars(S2);
    const I = A.ideal(S2, [A.mul(S2, x, A.sub(S2, x, A.one(S2))), A.mul(S2, y, y)]);
    const Q = componentAtOrigin(I).ideal;
    const r = resolveLocalArtinian(Q, maximal(S2), 4);
    expect(r.ranks).toEqual([1, 1, 1, 1, 1]);
    expect(r.complete).toBe(false);
  });

  it("keeps differentials whose composites vanish in A (common practice: a complex)", () => {
    const S2 = ring(2, A.QQ);
    const [u, v] = vars(S2);
    const L = A.ideal(S2, [A.add(S2, A.mul(S2, u, u), A.mul(S2, v, A.mul(S2, v, v))), A.mul(S2, u, v)]);
    const r = resolveLocalArtinian(L, maximal(S2), 4);
    for (let i = 0; i + 1 < r.maps.length; i++) {
      const a = r.maps[i],
        b = r.maps[i + 1];
      for (let p = 0; p < a.length; p++)
        for (let q = 0; q < (b[0]?.length ?? 0); q++) {
          let s = A.zero(S2);
          for (let k = 0; k < b.length; k++) s = A.add(S2, s, A.mul(S2, a[p][k], b[k][q]));
          expect(A.idealContains(L, s)).toBe(true);
        }
    }
  });
});
