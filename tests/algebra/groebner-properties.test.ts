// Defining properties of a reduced Gröbner basis (B. Buchberger 1965; e.g. Cox–Little–O'Shea,
// "Ideals, Varieties, and Algorithms", Ch. 2 §7): every generator reduces to 0, no term of an
// element is divisible by another element's leading monomial, elements are monic, and the
// reduced basis is unique, so it cannot depend on the order of the generators.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as A from "@/lib/algebra";

const orders: A.OrderSpec[] = [{ kind: "grevlex" }, { kind: "lex" }, { kind: "glex" }, { kind: "weights", weights: [1, 0, 2] }];

const divides = (a: number[], b: number[]) => a.every((x, i) => x <= b[i]);

function arbSystem(R: A.PolyRing) {
  const term = fc.tuple(fc.integer({ min: -6, max: 6 }), fc.array(fc.integer({ min: 0, max: 2 }), { minLength: 3, maxLength: 3 }));
  const poly = fc
    .array(term, { minLength: 1, maxLength: 3 })
    .map((ts) => ts.reduce((f, [c, e]) => A.add(R, f, A.monomial(R, e, BigInt(c))), A.zero(R)));
  return fc.array(poly, { minLength: 1, maxLength: 3 });
}

function checkReduced(R: A.PolyRing, gens: A.Poly[], G: A.Poly[]) {
  for (const f of gens) expect(A.isZero(A.normalForm(R, f, G))).toBe(true);
  const lms = G.map((g) => A.leadExponents(R, g));
  G.forEach((g, i) => {
    expect(A.leadCoefficient(R, g)).toEqual({ num: 1n, den: 1n });
    for (const t of A.terms(R, g)) {
      lms.forEach((l, j) => {
        if (j !== i) expect(divides(l, t.exps)).toBe(false);
      });
    }
  });
  // Sorted by increasing leading monomial: each leading term is below the next one.
  for (let i = 1; i < G.length; i++) {
    const sum = A.add(R, G[i - 1], G[i]);
    expect(A.leadExponents(R, sum)).toEqual(lms[i]);
  }
}

describe("reduced Gröbner bases (properties)", () => {
  for (const order of orders) {
    for (const field of [A.gf(32003), A.QQ]) {
      const R = A.polyRing(field, ["x", "y", "z"], { order });
      it(`over ${A.fieldName(field)} in ${A.orderName(order)}: reduced, and independent of the generators' order`, () => {
        fc.assert(
          fc.property(arbSystem(R), (gens) => {
            const G = A.groebnerBasis(R, gens, { limits: { maxBasisSize: 500 } });
            checkReduced(R, gens, G);
            const H = A.groebnerBasis(
              R,
              [...gens].reverse().map((g) => A.scale(R, g, 3n)),
            );
            expect(H.map((h) => A.formatPoly(R, h))).toEqual(G.map((g) => A.formatPoly(R, g)));
          }),
          { numRuns: 25 },
        );
      });
    }
  }
});
