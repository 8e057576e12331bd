import { describe, expect, it } from "vitest";
import { ideal, parsePoly, QQ } from "@/lib/algebra";
import { depthByAuslanderBuchsbaum, projectiveDimension, resolveCoker, resolveQuotient } from "@/lib/algebra/resolution/schreyer";
import { expectMinimalComplex, GF, ringOf } from "./resolution-helpers";

describe("edge cases", () => {
  it("S/0 = S is free: one generator in degree 0, pd 0, depth n", () => {
    // A free module is its own minimal resolution (common practice).
    const R = ringOf(GF, 3);
    const C = resolveQuotient(ideal(R, []));
    expect(C.betti.entries).toEqual([[0, 0, 1]]);
    expect(C.ranks).toEqual([1]);
    expect(projectiveDimension(C)).toBe(0);
    expect(depthByAuslanderBuchsbaum(C)).toBe(3);
  });

  it("S/S = 0 has the empty Betti table", () => {
    const R = ringOf(QQ, 2);
    const C = resolveQuotient(ideal(R, [parsePoly(R, "x1^2"), parsePoly(R, "3")]));
    expect(C.betti.entries).toEqual([]);
    expect(C.ranks).toEqual([0]);
    expect(projectiveDimension(C)).toBe(-Infinity);
  });

  it("redundant generators do not change the answer", () => {
    const R = ringOf(GF, 3);
    const a = resolveQuotient(
      ideal(
        R,
        ["x1^2", "x1*x2", "x1^2+x1*x2", "x1^3*x3"].map((s) => parsePoly(R, s)),
      ),
    );
    const b = resolveQuotient(
      ideal(
        R,
        ["x1^2", "x1*x2"].map((s) => parsePoly(R, s)),
      ),
    );
    expect(a.betti.entries).toEqual(b.betti.entries);
    expectMinimalComplex(R, a);
  });

  it("the zero matrix presents a free module; a free module with shifts keeps them", () => {
    const R = ringOf(GF, 2);
    const z = parsePoly(R, "0");
    const C = resolveCoker(R, [[z], [z]], [1, 3]);
    expect(C.betti.entries).toEqual([
      [0, 1, 1],
      [0, 3, 1],
    ]);
    const E = resolveCoker(R, [], []);
    expect(E.betti.entries).toEqual([]);
  });

  it("a principal ideal: 0 → S(−d) → S", () => {
    const R = ringOf(QQ, 3);
    const C = resolveQuotient(ideal(R, [parsePoly(R, "x1^3-1/2*x2*x3^2")]));
    expect(C.betti.entries).toEqual([
      [0, 0, 1],
      [1, 3, 1],
    ]);
    expectMinimalComplex(R, C);
  });
});
