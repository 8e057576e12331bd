// F4 (matrix reduction with delayed modular reduction, lib/algebra/groebner/f4*.ts) against
// pair-by-pair Buchberger with geobuckets (lib/algebra/groebner/reduce-pairwise.ts): the
// reduced Gröbner basis is unique (B. Buchberger 1965; Cox–Little–O'Shea, "Ideals, Varieties,
// and Algorithms", Ch. 2 §7, Prop. 6), so the two independent paths must agree term for term.
// The primes include 2 and 3 (where almost every product vanishes), primes on both sides of
// 2^23 (where the TypeScript accumulators switch to the split multiplier) and of 2^24 (where
// the WebAssembly kernel, which the engine runs, switches from unreduced 64-bit sums to
// subtract-and-correct), and primes near 2^31, where a product of two residues is far beyond
// the 53 bits of a double and near 2^62.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as A from "@/lib/algebra";
import { buchberger, f4Strategy, pairwiseStrategy } from "@/lib/algebra/groebner/index";
import { ringCtx, type RingCtx } from "@/lib/algebra/poly/ring";
import { cyclic, katsura } from "../bench/families";

const PRIMES = [2, 3, 32003, 8388593, 8388617, 16777213, 16777259, 2147483629, 2147483647];
const ORDERS: A.OrderSpec[] = [{ kind: "grevlex" }, { kind: "glex" }];

function arbSystem(R: A.PolyRing, p: number) {
  const n = R.vars.length;
  const coeff = fc.oneof(fc.integer({ min: 1, max: Math.min(p - 1, 9) }), fc.integer({ min: 1, max: p - 1 }));
  const term = fc.tuple(coeff, fc.array(fc.integer({ min: 0, max: 2 }), { minLength: n, maxLength: n }));
  const poly = fc
    .array(term, { minLength: 1, maxLength: 5 })
    .map((ts) => ts.reduce((f, [c, e]) => A.add(R, f, A.monomial(R, e, BigInt(c))), A.zero(R)));
  return fc.array(poly, { minLength: 1, maxLength: 4 });
}

const text = (R: A.PolyRing, G: A.Poly[]) => G.map((g) => A.formatPoly(R, g));

function bothWays(R: A.PolyRing, gens: A.Poly[]): { f4: string[]; pairwise: string[] } {
  const ctx = ringCtx(R) as RingCtx<number>;
  const limits = { limits: { maxBasisSize: 400 } };
  return { f4: text(R, buchberger(ctx, gens, limits, f4Strategy)), pairwise: text(R, buchberger(ctx, gens, limits, pairwiseStrategy)) };
}

describe("F4 and pair-by-pair Buchberger give the same reduced basis", () => {
  for (const p of PRIMES) {
    for (const order of ORDERS) {
      const R = A.polyRing(A.gf(p), ["x", "y", "z", "w"], { order });
      it(`random systems over GF(${p}) in ${A.orderName(order)}`, () => {
        fc.assert(
          fc.property(arbSystem(R, p), (gens) => {
            const { f4, pairwise } = bothWays(R, gens);
            expect(f4).toEqual(pairwise);
          }),
          { numRuns: 30 },
        );
      });
    }
  }

  // Larger matrices (hundreds of rows): every accumulator has to wrap around many times.
  for (const p of [32003, 16777213, 2147483629, 2147483647]) {
    it(`cyclic-5 and katsura-5 over GF(${p})`, () => {
      for (const { R, gens } of [cyclic(A.gf(p), 5), katsura(A.gf(p), 5)]) {
        const { f4, pairwise } = bothWays(R, gens);
        expect(f4.length).toBeGreaterThan(5);
        expect(f4).toEqual(pairwise);
      }
    });
  }
});
