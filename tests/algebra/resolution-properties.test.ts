import { describe, expect, it } from "vitest";
import {
  add,
  ideal,
  type Ideal,
  idealColonElement,
  idealEquals,
  idealHilbertSeries,
  idealIsUnit,
  idealSum,
  initialIdeal,
  monomial,
  parsePoly,
  zero,
  QQ,
} from "@/lib/algebra";
import {
  bettiAlternatingSum,
  bettiNumber,
  depthByAuslanderBuchsbaum,
  projectiveDimension,
  regularity,
  resolveQuotient,
} from "@/lib/algebra/resolution/schreyer";
import { expectMinimalComplex, GF, randomForm, ringOf, rng } from "./resolution-helpers";

/// Random homogeneous ideals: a few sparse forms of degrees 2–3.
function randomIdeal(seed: number, F = GF): Ideal {
  const rand = rng(seed);
  const n = 3 + (seed % 3);
  const R = ringOf(F, n);
  const count = 2 + Math.floor(rand() * 3);
  return ideal(
    R,
    Array.from({ length: count }, () => randomForm(R, 2 + Math.floor(rand() * 2), 2 + Math.floor(rand() * 3), rand)),
  );
}

/// depth S/I as the length of a maximal regular sequence of random linear forms: over a large
/// field a general linear form is a nonzerodivisor on a graded module of positive depth
/// (common practice). Independent of any resolution.
function depthByRegularSequence(I: Ideal, seed: number): number {
  const R = I.ring;
  const rand = rng(seed);
  let J = I,
    depth = 0;
  for (;;) {
    if (idealIsUnit(J)) return depth;
    const l = R.vars.reduce(
      (f, _, i) =>
        add(
          R,
          f,
          monomial(
            R,
            R.vars.map((_, k) => (k === i ? 1 : 0)),
            BigInt(1 + Math.floor(rand() * 30000)),
          ),
        ),
      zero(R),
    );
    if (!idealEquals(idealColonElement(J, l), J)) return depth;
    J = idealSum(J, ideal(R, [l]));
    depth++;
  }
}

describe("internal consistency of minimal resolutions on random ideals", () => {
  it("Σ_i (−1)^i Σ_j β_{i,j} t^j is the Hilbert series numerator", () => {
    // The Hilbert series of S/I is Σ (−1)^i β_{i,j} t^j / ∏ (1 − t^{deg x_k}) (Hilbert's syzygy
    // theorem; D. Eisenbud, The Geometry of Syzygies, Ch. 1, from memory). The numerator comes from
    // lib/algebra's Hilbert series of the initial ideal, an independent computation.
    for (let seed = 1; seed <= 12; seed++) {
      const I = randomIdeal(seed);
      const C = resolveQuotient(I);
      expect(bettiAlternatingSum(C.betti)).toEqual([...idealHilbertSeries(I).numerator]);
      expectMinimalComplex(I.ring, C);
    }
  });

  it("pd + depth = number of variables (Auslander–Buchsbaum), depth computed from a regular sequence", () => {
    // M. Auslander, D. Buchsbaum, Trans. AMS 85, 1957.
    for (let seed = 20; seed <= 25; seed++) {
      const I = randomIdeal(seed);
      const C = resolveQuotient(I);
      expect(projectiveDimension(C) + depthByRegularSequence(I, seed)).toBe(I.ring.vars.length);
      expect(depthByAuslanderBuchsbaum(C)).toBe(depthByRegularSequence(I, seed + 1));
    }
  });

  it("β_{i,j}(S/I) ≤ β_{i,j}(S/in(I)) (upper semicontinuity under Gröbner degeneration)", () => {
    // Gröbner degeneration is a flat family and Betti numbers are upper semicontinuous (common practice).
    for (let seed = 40; seed <= 47; seed++) {
      const I = randomIdeal(seed);
      const C = resolveQuotient(I);
      const D = resolveQuotient(initialIdeal(I));
      for (const [i, j, b] of C.betti.entries) expect(b).toBeLessThanOrEqual(bettiNumber(D.betti, i, j));
      expectMinimalComplex(I.ring, D);
      // Both have the same Hilbert series, so the alternating sums agree (Macaulay).
      expect(bettiAlternatingSum(C.betti)).toEqual(bettiAlternatingSum(D.betti));
    }
  });

  it("over Q the same properties hold (random quadrics)", () => {
    for (let seed = 60; seed <= 67; seed++) {
      const rand = rng(seed);
      const R = ringOf(QQ, 3 + (seed % 2));
      const I = ideal(
        R,
        Array.from({ length: 2 + (seed % 3) }, () => randomForm(R, 2, 3, rand)),
      );
      const C = resolveQuotient(I);
      expect(bettiAlternatingSum(C.betti)).toEqual([...idealHilbertSeries(I).numerator]);
      expectMinimalComplex(I.ring, C);
    }
  });

  it("regularity of the twisted cubic is 1 and of a complete intersection of degrees 2, 3 is 3", () => {
    // reg S/I = max(j − i); a complete intersection of degrees d_i has reg Σ(d_i − 1), and the
    // twisted cubic has a linear resolution after the first step (Eisenbud, The Geometry of
    // Syzygies, Ch. 4 and Ch. 6; common practice).
    const R = ringOf(GF, 4);
    const tc = resolveQuotient(
      ideal(
        R,
        ["x1*x3-x2^2", "x1*x4-x2*x3", "x2*x4-x3^2"].map((s) => parsePoly(R, s)),
      ),
    );
    expect(regularity(tc)).toBe(1);
    const ci = resolveQuotient(
      ideal(
        R,
        ["x1^2", "x2^3"].map((s) => parsePoly(R, s)),
      ),
    );
    expect(regularity(ci)).toBe(3);
  });
});
