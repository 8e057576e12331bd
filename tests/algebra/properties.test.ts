import { describe, it } from "vitest";
import fc from "fast-check";
import {
  add,
  formatPoly,
  gf,
  hilbertFunctionValues,
  hilbertSeriesOfMonomials,
  ideal,
  type Ideal,
  idealColon,
  idealEliminate,
  idealHilbertSeries,
  idealIntersection,
  idealIsSubset,
  idealProduct,
  idealSaturation,
  initialIdeal,
  monomial,
  parsePoly,
  type Poly,
  polyRing,
  type PolyRing,
  terms,
} from "@/lib/algebra";

const GF = gf(32003);
const R = polyRing(GF, ["x", "y", "z"]);
const RUNS = { numRuns: 40, seed: 20261201 };

type TermSpec = { c: number; e: [number, number, number] };

function polyOf(S: PolyRing, spec: TermSpec[]): Poly {
  return spec.reduce((f, t) => add(S, f, monomial(S, t.e, BigInt(t.c))), monomial(S, [0, 0, 0], 0n));
}

const termArb = fc.record({
  c: fc.integer({ min: -9, max: 9 }),
  e: fc.tuple(fc.nat(2), fc.nat(2), fc.nat(2)),
});
const polyArb = fc.array(termArb, { minLength: 1, maxLength: 3 });
const idealArb = fc.array(polyArb, { minLength: 1, maxLength: 3 }).map((gens) =>
  ideal(
    R,
    gens.map((g) => polyOf(R, g)),
  ),
);

/// Exponent vectors of degree d in three variables.
const ofDegree = (d: number): [number, number, number][] => {
  const out: [number, number, number][] = [];
  for (let a = 0; a <= d; a++) for (let b = 0; a + b <= d; b++) out.push([a, b, d - a - b]);
  return out;
};
const formArb = fc
  .integer({ min: 1, max: 3 })
  .chain((d) =>
    fc.array(fc.record({ c: fc.integer({ min: 1, max: 50 }), e: fc.constantFrom(...ofDegree(d)) }), { minLength: 1, maxLength: 4 }),
  );

function moveTo(S: PolyRing, I: Ideal): Ideal {
  return ideal(
    S,
    I.gens.map((g) => parsePoly(S, formatPoly(I.ring, g))),
  );
}

describe("properties of ideal operations on random small ideals of GF(32003)[x, y, z]", () => {
  it("(I : J)·J ⊆ I", () => {
    // definition of the colon ideal (common practice)
    fc.assert(
      fc.property(idealArb, idealArb, (I, J) => idealIsSubset(idealProduct(idealColon(I, J), J), I)),
      RUNS,
    );
  });

  it("I ∩ J ⊆ I, I ∩ J ⊆ J and I·J ⊆ I ∩ J", () => {
    // common practice
    fc.assert(
      fc.property(idealArb, idealArb, (I, J) => {
        const meet = idealIntersection(I, J);
        return idealIsSubset(meet, I) && idealIsSubset(meet, J) && idealIsSubset(idealProduct(I, J), meet);
      }),
      RUNS,
    );
  });

  it("I : J^∞ contains I and I : J", () => {
    // I ⊆ I : J ⊆ I : J^∞ (common practice)
    fc.assert(
      fc.property(idealArb, idealArb, (I, J) => {
        const sat = idealSaturation(I, J);
        return idealIsSubset(I, sat) && idealIsSubset(idealColon(I, J), sat);
      }),
      RUNS,
    );
  });

  it("elimination ideals involve no eliminated variable and lie in I", () => {
    // elimination theorem (D. Cox, J. Little, D. O'Shea, Ideals, Varieties, and Algorithms, Ch. 3 §1)
    fc.assert(
      fc.property(idealArb, fc.subarray(["x", "y", "z"], { minLength: 1, maxLength: 2 }), (I, vars) => {
        const E = idealEliminate(I, vars);
        const idx = vars.map((v) => R.vars.indexOf(v));
        const free = E.gens.every((g) => terms(R, g).every((t) => idx.every((i) => t.exps[i] === 0)));
        return free && idealIsSubset(E, I);
      }),
      RUNS,
    );
  });

  it("I and in_lex(I) have the Hilbert function of I computed in grevlex", () => {
    // F. S. Macaulay, Proc. London Math. Soc. 26 (1927): S/I and S/in(I) have the same
    // Hilbert function for every monomial order (I homogeneous)
    const lex = polyRing(GF, ["x", "y", "z"], { order: { kind: "lex" } });
    fc.assert(
      fc.property(fc.array(formArb, { minLength: 1, maxLength: 3 }), (forms) => {
        const I = ideal(
          R,
          forms.map((f) => polyOf(R, f)),
        );
        const expected = hilbertFunctionValues(idealHilbertSeries(I), 8);
        const inLex = initialIdeal(moveTo(lex, I)).gens.map((g) => terms(lex, g)[0].exps);
        const got = hilbertFunctionValues(hilbertSeriesOfMonomials(inLex, [1, 1, 1]), 8);
        return got.every((v, d) => v === expected[d]);
      }),
      RUNS,
    );
  });
});
