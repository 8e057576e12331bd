// The sparse semi-echelon basis (lib/algebra/graded/sparse-echelon.ts) against the dense one
// (graded/echelon.ts): inserting the same vectors, both must accept and refuse the same ones
// (a vector is refused exactly when it lies in the span so far), so their ranks agree after
// every step; and a refused vector's membership is checked independently by exact rank.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { coeffsOf, type Coeffs } from "@/lib/algebra/field/coeffs";
import { gf, QQ } from "@/lib/algebra/field/field";
import { Echelon, rankOf } from "@/lib/algebra/graded/echelon";
import { SparseEchelon } from "@/lib/algebra/graded/sparse-echelon";

describe("sparse echelon basis", () => {
  for (const field of [gf(2), gf(32003), gf(2147483647), QQ]) {
    const K = coeffsOf(field) as Coeffs<unknown>;
    it(`accepts exactly the vectors the dense basis accepts over ${field.kind === "Q" ? "Q" : `GF(${field.p})`}`, () => {
      const dim = 8;
      // Sparse vectors with small entries, often dependent on the ones before.
      const vec = fc.array(fc.tuple(fc.integer({ min: 0, max: dim - 1 }), fc.integer({ min: -3, max: 3 })), { maxLength: 4 });
      fc.assert(
        fc.property(fc.array(vec, { minLength: 1, maxLength: 14 }), (vs) => {
          const dense = new Echelon(K, dim),
            sparse = new SparseEchelon(K, dim);
          const seen: unknown[][] = [];
          for (const entries of vs) {
            const v = new Array(dim).fill(K.zero);
            for (const [i, a] of entries) v[i] = K.add(v[i], K.fromRational(BigInt(a), 1n));
            const d = dense.insert(v),
              s = sparse.insertDense(v);
            expect(s).toBe(d);
            // Independently: accepted exactly when the rank grows.
            expect(rankOf(K, dim, [...seen, v])).toBe(rankOf(K, dim, seen) + (d ? 1 : 0));
            seen.push(v);
            expect(sparse.rank).toBe(dense.rank);
          }
          for (const r of sparse.rows) expect(K.isOne(r.val[0])).toBe(true);
          // The pivots (first nonzero indices of an echelon basis) depend only on the span.
          expect([...sparse.pivots].sort((a, b) => a - b)).toEqual([...dense.pivots].sort((a, b) => a - b));
        }),
        { numRuns: 40 },
      );
    });

    it(`keeps an echelon basis of the span in larger dimensions over ${field.kind === "Q" ? "Q" : `GF(${field.p})`}`, () => {
      // Vectors of 1–3 entries in dimension 60, many dependent (the shape of products of
      // syzygies by variables): the rows start at their pivots with 1, the pivots are
      // distinct, every row is zero at the pivots of the rows stored before it, and the
      // rank is the exact rank of the vectors inserted.
      const dim = 60;
      const vec = fc.array(fc.tuple(fc.integer({ min: 0, max: dim - 1 }), fc.integer({ min: -2, max: 2 })), { minLength: 1, maxLength: 3 });
      fc.assert(
        fc.property(fc.array(vec, { minLength: 1, maxLength: 80 }), (vs) => {
          const sparse = new SparseEchelon(K, dim);
          const dense = new Echelon(K, dim);
          const seen: unknown[][] = [];
          for (const entries of vs) {
            const v = new Array(dim).fill(K.zero);
            for (const [i, a] of entries) v[i] = K.add(v[i], K.fromRational(BigInt(a), 1n));
            expect(sparse.insert({ idx: v.flatMap((a, i) => (K.isZero(a) ? [] : [i])), val: v.filter((a) => !K.isZero(a)) })).toBe(
              dense.insert(v),
            );
            seen.push(v);
          }
          expect(sparse.rank).toBe(rankOf(K, dim, seen));
          expect(new Set(sparse.pivots).size).toBe(sparse.rank);
          sparse.rows.forEach((r, k) => {
            expect(r.idx[0]).toBe(sparse.pivots[k]);
            expect(K.isOne(r.val[0])).toBe(true);
            for (let t = 1; t < r.idx.length; t++) expect(r.idx[t]).toBeGreaterThan(r.idx[t - 1]);
            for (let e = 0; e < k; e++) expect(r.idx.includes(sparse.pivots[e])).toBe(false);
          });
        }),
        { numRuns: 25 },
      );
    });
  }
});
