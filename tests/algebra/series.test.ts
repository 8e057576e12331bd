import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";
import { bettiTotalsOf, residueFieldResolution } from "../../lib/algebra/resolution/graded-quotient/index";
import {
  eventualPeriod,
  guessRational,
  poincareSeries,
  polyPowZ,
  sameRationalFunction,
  seriesAt,
  truncatedSeries,
} from "../../lib/algebra/series/index";
import { maximal, randomForm, ring, seeded } from "./local-helpers";

describe("rational guess of a Poincaré series", () => {
  it("reproduces Tate's closed form from computed Betti numbers", () => {
    // J. Tate, Illinois J. Math. 1957: P_k(t) = (1+t)^n/(1−t^2)^c for a complete intersection.
    const S = ring(3);
    const next = seeded(3);
    const J = A.ideal(S, [randomForm(S, 2, next), randomForm(S, 3, next)]);
    const P = poincareSeries(bettiTotalsOf(residueFieldResolution(J, 8)));
    expect(P.rational).not.toBeNull();
    expect(sameRationalFunction(P.rational!.numerator, P.rational!.denominator, polyPowZ([1n, 1n], 3), polyPowZ([1n, 0n, -1n], 2))).toBe(
      true,
    );
    expect(P.rational!.checkedOn).toBe(9);
    expect(seriesAt(P.series, 8)).toBe(BigInt(bettiTotalsOf(residueFieldResolution(J, 8))[8]));
  });

  it("reproduces Golod's closed form for k[x,y]/m^3", () => {
    // E. Golod 1962: P_k(t) = (1+t)^2/(1 − t(4t + 3t^2)), with β_i^S(S/m^3) = 4, 3 (the
    // Eagon–Northcott numbers, checked in local-residue.test.ts). In lowest terms
    // (1+t)/(1 − t − 3t^2), a recurrence of length 2: 4 terms determine it, 2 more confirm it.
    const S = ring(2);
    const golodNum = polyPowZ([1n, 1n], 2),
      golodDen = [1n, 0n, -4n, -3n];
    const betti = bettiTotalsOf(residueFieldResolution(A.idealPower(maximal(S), 3), 7));
    const P = poincareSeries(betti);
    expect(P.rational).not.toBeNull();
    expect(sameRationalFunction(P.rational!.numerator, P.rational!.denominator, golodNum, golodDen)).toBe(true);
    expect(P.rational!.checkedOn).toBe(8);
    // Every shorter prefix gives the right function or none, never a wrong one; too few
    // terms give none.
    for (let k = 1; k <= betti.length; k++) {
      const g = guessRational(truncatedSeries(betti.slice(0, k)));
      if (k < 6) expect(g).toBeNull();
      else expect(sameRationalFunction(g!.numerator, g!.denominator, golodNum, golodDen)).toBe(true);
    }
  });

  it("answers none rather than a wrong function on prefixes of Tate's series", () => {
    // Tate 1957: k[x,y,z]/(x^2, y^2, z^2) has P = (1+t)^3/(1−t^2)^3 = 1/(1−t)^3.
    const S = ring(3);
    const [x, y, z] = S.vars.map((_, i) => A.variable(S, i));
    const betti = bettiTotalsOf(residueFieldResolution(A.ideal(S, [A.mul(S, x, x), A.mul(S, y, y), A.mul(S, z, z)]), 7));
    for (let k = 1; k <= betti.length; k++) {
      const g = guessRational(truncatedSeries(betti.slice(0, k)));
      if (g) expect(sameRationalFunction(g.numerator, g.denominator, [1n], polyPowZ([1n, -1n], 3))).toBe(true);
      else expect(k).toBeLessThan(8);
    }
    expect(guessRational(truncatedSeries([1, 2]))).toBeNull();
  });

  it("finds simple closed forms and checks every term", () => {
    // 1/(1−3t) (common practice).
    const g = guessRational(truncatedSeries([1, 3, 9, 27, 81, 243]));
    expect(g).toEqual({ numerator: [1n], denominator: [1n, -3n], checkedOn: 6, determinedBy: 2 });
    // A sequence that breaks the pattern at the end is not forced into it.
    expect(guessRational(truncatedSeries([1, 3, 9, 27, 81, 244]))).toBeNull();
  });
});

describe("eventual period", () => {
  it("detects stabilisation and periodicity", () => {
    expect(eventualPeriod([7, 4, 4, 4, 4])).toEqual({ start: 1, period: 1 });
    expect(eventualPeriod([5, 1, 2, 1, 2, 1, 2])).toEqual({ start: 1, period: 2 });
    expect(eventualPeriod([1, 2, 3, 4])).toBeNull();
    expect(eventualPeriod(["a", "b", "c", "a", "b", "c"])).toEqual({ start: 0, period: 3 });
  });

  it("sees the period-2 resolution of k over a hypersurface", () => {
    // Over a hypersurface k[x]/(x^3) the minimal resolution of k is periodic of period 2 from
    // the start (Eisenbud, "Homological algebra on a complete intersection", Trans. AMS 1980):
    // the degree gaps between consecutive generators alternate 1, 2.
    const S = ring(1);
    const C = residueFieldResolution(A.ideal(S, [A.pow(S, A.variable(S, 0), 3)]), 8);
    const degs = C.columns.map((c) => c.entries[0].degree);
    const gaps = degs.slice(1).map((d, i) => d - degs[i]);
    expect(eventualPeriod(gaps)).toEqual({ start: 0, period: 2 });
  });
});
