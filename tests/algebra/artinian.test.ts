import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";
import { componentAtOrigin, FiniteAlgebra, localAlgebraAtOrigin, minimalGeneratorCount, minimalGeneratorPositions } from "../../lib/algebra/artinian/index";
import { binomial, maximal, ring, vars } from "./local-helpers";

describe("Artinian local rings as finite-dimensional algebras", () => {
  it("k[x1..xn]/m^p has length C(n+p−1, n) and socle m^{p−1}", () => {
    // checks.md row 12: dim R_d = C(n−1+d, n−1) for d < p; the socle of S/m^p is m^{p−1}
    // (common practice).
    for (const [n, p] of [[2, 3], [3, 2], [3, 3]] as const) {
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
