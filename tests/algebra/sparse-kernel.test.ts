// The sparse kernel basis (lib/algebra/graded/sparse-kernel.ts) against the dense one
// (graded/echelon.ts kernelBasis): the same dimension (rank–nullity, common practice), every
// vector returned lies in the kernel (checked by applying the map), and they are
// independent (exact rank).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { coeffsOf, type Coeffs } from "@/lib/algebra/field/coeffs";
import { gf, QQ } from "@/lib/algebra/field/field";
import { kernelBasis, rankOf } from "@/lib/algebra/graded/echelon";
import { sparseKernelBasis } from "@/lib/algebra/graded/sparse-kernel";

describe("sparse kernel basis", () => {
  for (const field of [gf(2), gf(32003), QQ]) {
    const K = coeffsOf(field) as Coeffs<unknown>;
    it(`agrees with the dense kernel over ${field.kind === "Q" ? "Q" : `GF(${field.p})`}`, () => {
      const tgt = 6;
      const col = fc.array(fc.tuple(fc.integer({ min: 0, max: tgt - 1 }), fc.integer({ min: -2, max: 2 })), { maxLength: 3 });
      fc.assert(
        fc.property(fc.array(col, { minLength: 1, maxLength: 12 }), (cols) => {
          const dense = cols.map((entries) => {
            const v = new Array(tgt).fill(K.zero);
            for (const [i, a] of entries) v[i] = K.add(v[i], K.fromRational(BigInt(a), 1n));
            return v;
          });
          const sparse = dense.map((v) => {
            const idx: number[] = [],
              val: unknown[] = [];
            v.forEach((a, i) => {
              if (!K.isZero(a)) {
                idx.push(i);
                val.push(a);
              }
            });
            return { idx, val };
          });
          const src = cols.length;
          const want = kernelBasis(K, tgt, dense);
          const got = sparseKernelBasis(K, tgt, src, sparse);
          expect(got.length).toBe(want.length);
          const asDense = got.map((z) => {
            const d = new Array(src).fill(K.zero);
            z.idx.forEach((k, t) => (d[k] = z.val[t]));
            return d;
          });
          for (const d of asDense) {
            // A·z = Σ_j z_j · image_j must vanish.
            const image = new Array(tgt).fill(K.zero);
            d.forEach((a, j) => dense[j].forEach((b, i) => (image[i] = K.add(image[i], K.mul(a, b)))));
            expect(image.every((x) => K.isZero(x))).toBe(true);
          }
          expect(rankOf(K, src, asDense)).toBe(got.length);
        }),
        { numRuns: 60 },
      );
    });
  }
});
