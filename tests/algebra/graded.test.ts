import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";
import { Echelon, gradedQuotient, kernelBasis } from "../../lib/algebra/graded/index";
import { coeffsOf } from "../../lib/algebra/field/coeffs";
import { binomial, maximal, randomForm, ring, seeded, vars } from "./local-helpers";

describe("graded pieces of S/J", () => {
  it("dimensions of the pieces of k[x1..xn]/m^p", () => {
    // counting monomials, common practice: C(n−1+d, n−1) for d < p, 0 from p on.
    const S = ring(3);
    const R = gradedQuotient(A.idealPower(maximal(S), 3));
    expect([0, 1, 2, 3, 4].map((d) => R.dim(d))).toEqual([0, 1, 2, 3, 4].map((d) => (d < 3 ? binomial(2 + d, 2) : 0)));
    expect(R.isArtinian).toBe(true);
    expect(R.topDegree()).toBe(2);
  });

  it("a complete intersection has Hilbert series ∏(1 − t^{d_i})/(1 − t)^n", () => {
    // Koszul complex on a regular sequence, common practice: degrees 2, 2, 3 in 3 variables: (1+t)^2 (1+t+t^2) = 1 + 3t + 4t^2 + 3t^3 + t^4.
    const S = ring(3);
    const next = seeded(5);
    const R = gradedQuotient(A.ideal(S, [randomForm(S, 2, next), randomForm(S, 2, next), randomForm(S, 3, next)]));
    expect([0, 1, 2, 3, 4, 5].map((d) => R.dim(d))).toEqual([1, 3, 4, 3, 1, 0]);
    expect(R.topDegree()).toBe(4);
  });

  it("multiplication by variables commutes and agrees with normal forms", () => {
    // R is commutative: x·(y·u) = y·(x·u) for every basis monomial u (common practice).
    const S = ring(3);
    const [x, y] = vars(S);
    const R = gradedQuotient(A.ideal(S, [A.sub(S, A.mul(S, x, x), A.mul(S, y, y)), A.mul(S, x, y)]));
    const K = R.K;
    for (const d of [1, 2, 3]) {
      for (let k = 0; k < R.dim(d); k++) {
        const u = new Array(R.dim(d)).fill(K.zero);
        u[k] = K.one;
        const apply = (v: number, w: unknown[], e: number) => {
          const out = new Array(R.dim(e + 1)).fill(K.zero);
          R.mulVarInto(v, e, w, 0, out, 0);
          return out;
        };
        expect(apply(0, apply(1, u, d), d + 1)).toEqual(apply(1, apply(0, u, d), d + 1));
      }
    }
  });

  it("echelon forms and kernels over GF(p) and Q", () => {
    // The map (a, b, c) ↦ (a + b, b + c) has a one-dimensional kernel spanned by (1, −1, 1).
    for (const field of [A.gf(7), A.QQ]) {
      const K = coeffsOf(field);
      const e = (n: number) => K.fromRational(BigInt(n), 1n);
      const ker = kernelBasis(K, 2, [
        [e(1), e(0)],
        [e(1), e(1)],
        [e(0), e(1)],
      ]);
      expect(ker.length).toBe(1);
      const E = new Echelon(K, 3);
      expect(E.insert([e(1), e(2), e(3)])).toBe(true);
      expect(E.insert([e(2), e(4), e(6)])).toBe(false);
      expect(E.rank).toBe(1);
      expect(ker[0].map((c) => K.toRational(c).num)).toEqual([1n, -1n, 1n]);
    }
  });
});
