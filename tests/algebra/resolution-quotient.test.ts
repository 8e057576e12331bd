import { describe, expect, it } from "vitest";
import { ideal, parsePoly, type PolyRing } from "@/lib/algebra";
import { pfaffians } from "@/lib/algebra/invariants";
import { quotientProperties } from "@/lib/algebra/resolution/schreyer";
import { alternating, GF, ringOf } from "./resolution-helpers";

function I(R: PolyRing, gens: string[]) {
  return ideal(
    R,
    gens.map((s) => parsePoly(R, s)),
  );
}

describe("Cohen–Macaulay, Gorenstein and complete intersection quotients", () => {
  it("the twisted cubic is Cohen–Macaulay, not Gorenstein, not a complete intersection", () => {
    // Arithmetically Cohen–Macaulay of codimension 2 with last Betti number 2 (Hilbert–Burch;
    // common practice).
    const R = ringOf(GF, 4);
    const P = quotientProperties(I(R, ["x1*x3-x2^2", "x1*x4-x2*x3", "x2*x4-x3^2"]));
    expect([P.dim, P.depth, P.pd]).toEqual([2, 2, 2]);
    expect([P.cohenMacaulay, P.gorenstein, P.completeIntersection]).toEqual([true, false, false]);
  });

  it("two planes in 4-space meeting at a point are not Cohen–Macaulay (depth 1, dimension 2)", () => {
    // (xz, xw, yz, yw) = (x, y) ∩ (z, w): the classical non-Cohen–Macaulay example (Hartshorne's
    // connectedness; common practice), the same ideal as Serre, Algèbre locale, multiplicités, 1965.
    const R = ringOf(GF, 4);
    const P = quotientProperties(I(R, ["x1*x3", "x1*x4", "x2*x3", "x2*x4"]));
    expect([P.dim, P.depth, P.pd]).toEqual([2, 1, 3]);
    expect(P.cohenMacaulay).toBe(false);
  });

  it("Pfaffians of the generic 5×5 alternating matrix are Gorenstein, not a complete intersection", () => {
    // Buchsbaum–Eisenbud, Amer. J. Math. 1977: codimension 3, 5 generators.
    const R = ringOf(GF, 10);
    const P = quotientProperties(ideal(R, pfaffians(R, alternating(R, 5), 4)));
    expect([P.cohenMacaulay, P.gorenstein, P.completeIntersection]).toEqual([true, true, false]);
  });

  it("a complete intersection is Gorenstein and a complete intersection", () => {
    // Koszul complex on a regular sequence, common practice: complete intersections are Gorenstein (common practice).
    const R = ringOf(GF, 3);
    const P = quotientProperties(I(R, ["x1^2", "x2^3+x1*x3^2"]));
    expect([P.cohenMacaulay, P.gorenstein, P.completeIntersection]).toEqual([true, true, true]);
  });
});
