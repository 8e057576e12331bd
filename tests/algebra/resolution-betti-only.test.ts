// Betti-only resolutions (issue 17, item 3): a caller that reads only Betti numbers
// (`bettiOnly`, used by poincare and by resolve(…).betti in the notation) gets the same Betti
// table, ranks and degrees as a full resolution, while the frame's levels are released as
// it goes and no differential is kept. The degrees of the full resolution come from its
// Betti table; they are checked here against its minimised differentials (each nonzero
// entry of d_i homogeneous of degree deg e_b − deg e_a, common practice for graded maps).
import { describe, expect, it } from "vitest";
import * as A from "@/lib/algebra";
import { resolveQuotient, type Resolution } from "@/lib/algebra/resolution/schreyer/resolve";
import { minimalResolution } from "@/lib/algebra/resolution/dispatch";
import { binom, randomForm, ringOf, rng, vars } from "./resolution-helpers";

function cases(): { name: string; I: A.Ideal }[] {
  const R = ringOf(A.gf(32003), 4);
  const [x, y, z, w] = vars(R);
  const m = (a: A.Poly, b: A.Poly) => A.mul(R, a, b);
  const rand = rng(7);
  const T = ringOf(A.QQ, 5);
  return [
    // the twisted cubic: 2×2 minors of [x y z; y z w] (Eagon–Northcott 1962), β = 1, 3, 2
    { name: "twisted cubic", I: A.ideal(R, [A.sub(R, m(x, z), m(y, y)), A.sub(R, m(x, w), m(y, z)), A.sub(R, m(y, w), m(z, z))]) },
    // the Koszul complex on 4 variables: β_i = C(4, i)
    { name: "maximal ideal", I: A.ideal(R, vars(R)) },
    { name: "random forms over Q", I: A.ideal(T, [randomForm(T, 2, 4, rand), randomForm(T, 2, 4, rand), randomForm(T, 3, 5, rand)]) },
  ];
}

function summary(r: Resolution) {
  return { betti: r.betti, ranks: r.ranks, degrees: r.degrees, length: r.length, complete: r.complete };
}

describe("Betti-only resolutions over S", () => {
  it("give the same Betti table, ranks and degrees as the full resolution", () => {
    for (const { I } of cases()) {
      const full = resolveQuotient(I);
      const only = resolveQuotient(I, { bettiOnly: true });
      expect(summary(only)).toEqual(summary(full));
    }
    const koszul = resolveQuotient(cases()[1].I, { bettiOnly: true });
    expect(koszul.ranks).toEqual([0, 1, 2, 3, 4].map((i) => binom(4, i)));
    expect(resolveQuotient(cases()[0].I, { bettiOnly: true }).ranks).toEqual([1, 3, 2]);
  });

  it("refuse the differentials with a clear error", () => {
    const only = resolveQuotient(cases()[0].I, { bettiOnly: true });
    expect(() => only.map(1)).toThrow(/Betti numbers only/);
  });

  it("the degrees read from the Betti table are those of the minimised differentials", () => {
    for (const { I } of cases()) {
      const full = resolveQuotient(I);
      const S = I.ring;
      for (let i = 1; i <= full.length; i++) {
        const M = full.map(i);
        expect(M.length).toBe(full.ranks[i - 1]);
        M.forEach((row, a) =>
          row.forEach((f, b) => {
            if (A.isZero(f)) return;
            expect(A.isHomogeneous(S, f)).toBe(true);
            expect(A.degree(S, f)).toBe(full.degrees[i][b] - full.degrees[i - 1][a]);
          }),
        );
      }
    }
  });

  it("through the dispatcher: no maps kept over a quotient ring either", () => {
    const R = ringOf(A.gf(32003), 3);
    const [x, y, z] = vars(R);
    const J = A.ideal(R, [A.mul(R, x, x), A.mul(R, y, z)]);
    const input = { ring: J, module: { ideal: A.ideal(R, vars(R)) }, length: 3, keepMaps: 10_000 };
    const kept = minimalResolution(input);
    const only = minimalResolution({ ...input, bettiOnly: true });
    if (kept.method !== "graded-quotient" || only.method !== "graded-quotient") throw new Error("expected the graded-quotient method");
    expect(kept.resolution.maps).toBeDefined();
    expect(only.resolution.maps).toBeUndefined();
    expect(only.resolution.columns).toEqual(kept.resolution.columns);
  });
});
