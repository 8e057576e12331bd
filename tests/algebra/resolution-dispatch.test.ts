// The resolution dispatcher (lib/algebra/resolution/dispatch.ts): which method it chooses by
// the rule written beside it, and that each chosen method gives the known answer.
import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";

const F = A.gf(32003);
const S2 = A.polyRing(F, ["x", "y"]);
const S1 = A.polyRing(F, ["x"]);
const p = (R: A.PolyRing, text: string) => A.parsePoly(R, text);
const I = (R: A.PolyRing, ...gens: string[]) =>
  A.ideal(
    R,
    gens.map((g) => p(R, g)),
  );

describe("the resolution dispatcher", () => {
  it("over S itself (J given by no generators) uses Schreyer's method: k over k[x,y] is the Koszul complex 1, 2, 1", () => {
    // Koszul complex of a regular sequence (Eisenbud, Commutative Algebra, §17.2; from memory)
    const input = { ring: I(S2), module: { ideal: I(S2, "x", "y") } };
    expect(A.resolutionMethod(input)).toBe("schreyer");
    const r = A.minimalResolution(input);
    expect(r.method).toBe("schreyer");
    if (r.method === "schreyer") expect(r.resolution.ranks).toEqual([1, 2, 1]);
  });

  it("over a graded quotient goes degree by degree: k over k[x,y]/(x²) has β_i = 1, 2, 2, 2, …", () => {
    // P(t) = (1 + t)/(1 − t): the Poincaré series of k[x]/(x²) times that of k[y]
    // (Poincaré series of a tensor product of local algebras multiply; common practice)
    const input = { ring: I(S2, "x^2"), module: { ideal: I(S2, "x", "y") } };
    expect(A.resolutionMethod(input)).toBe("graded-quotient");
    const r = A.minimalResolution({ ...input, length: 4 });
    expect(r.method).toBe("graded-quotient");
    if (r.method === "graded-quotient") expect(r.resolution.columns.map((c) => c.total)).toEqual([1, 2, 2, 2, 2]);
  });

  it("over a non-homogeneous J resolves at the origin: k over k[x]/(x² + x³) is periodic, β_i = 1", () => {
    // at the origin 1 + x is a unit, so the local ring is k[x]/(x²), over which k has the
    // periodic resolution … → R —x→ R —x→ R → k (common practice)
    const input = { ring: I(S1, "x^2 + x^3"), module: { ideal: I(S1, "x") } };
    expect(A.resolutionMethod(input)).toBe("artinian");
    const r = A.minimalResolution({ ...input, length: 3 });
    expect(r.method).toBe("artinian");
    if (r.method === "artinian") {
      expect(r.resolution.ranks).toEqual([1, 1, 1, 1]);
      expect(r.resolution.complete).toBe(false);
      // the local ring is k[x]/(x²), not the given ring: the maps are not maps over it
      expect(r.overGivenRing).toBe(false);
    }
  });

  it("reads a non-homogeneous module over a graded ring at the origin too", () => {
    expect(A.resolutionMethod({ ring: I(S2, "x^2"), module: { ideal: I(S2, "x", "y - y^2") } })).toBe("artinian");
    expect(A.resolutionMethod({ ring: I(S2, "x^2"), module: { presentation: { rows: [[p(S2, "x")]], degrees: [0] } } })).toBe(
      "graded-quotient",
    );
  });

  it("refuses what no method can do: no length over a quotient, a module with two generators at the origin", () => {
    expect(() => A.minimalResolution({ ring: I(S2, "x^2"), module: { ideal: I(S2, "x", "y") } })).toThrow(/length/);
    const two = { presentation: { rows: [[p(S1, "x")], [p(S1, "x")]], degrees: [0, 0] } };
    expect(() => A.minimalResolution({ ring: I(S1, "x^2 + x^3"), module: two, length: 2 })).toThrow(/cyclic/);
  });
});
