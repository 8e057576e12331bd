// The Schreyer frame's integer-key division (lib/algebra/resolution/schreyer/frame-division.ts,
// issue 17) against the general heap division (module/divide.ts, the old path): on every
// level of the frame both must give exactly the same syzygies — the same terms, basis
// elements and coefficients in the same order — over several fields and gradings, for
// ideals and for a presented module. Then the Betti table of the Plücker ideal of G(2,6)
// against its Hilbert function (the Euler characteristic of the resolution).
import { describe, expect, it } from "vitest";
import * as A from "@/lib/algebra";
import { ringCtx, type RingCtx } from "@/lib/algebra/poly/ring";
import { termOverPosition } from "@/lib/algebra/module/order";
import { vecFromPolys, type Vec } from "@/lib/algebra/module/vector";
import { moduleGroebner } from "@/lib/algebra/module/groebner";
import { pfaffians } from "@/lib/algebra/invariants/pfaffians";
import { frameDivider } from "@/lib/algebra/resolution/schreyer/frame-division";
import { schreyerResolution, type SchreyerResolution } from "@/lib/algebra/resolution/schreyer/frame";
import { resolveQuotient } from "@/lib/algebra/resolution/schreyer/resolve";
import { binom, randomForm, ringOf, rng, vars } from "./resolution-helpers";

const UNBOUNDED = { maxLevel: Infinity, maxDegree: Infinity };

function frames(I: A.Ideal): [SchreyerResolution<unknown>, SchreyerResolution<unknown>] {
  const C = ringCtx(I.ring) as RingCtx<unknown>;
  const O = termOverPosition(C.layout, 1);
  const basis = A.idealGroebnerBasis(I).map((g) => vecFromPolys(C, O, [g]));
  // grevlex and homogeneous: the integer-key division applies (else both runs are general)
  expect(frameDivider(C, O, basis, [])).not.toBeNull();
  const run = (generalDivision: boolean) => schreyerResolution(C, [0], O, basis, UNBOUNDED, undefined, () => {}, { generalDivision });
  return [run(false), run(true)];
}

/// A frame as plain data: per level, per column, its terms (exponents, basis element, coefficient).
function plain(S: SchreyerResolution<unknown>): unknown {
  return S.cols.map((level) => level.map((v: Vec<unknown>) => v.mono.map((m, k) => [Array.from(m), v.comp[k], v.coef[k]])));
}

function skew(R: A.PolyRing, n: number): A.Poly[][] {
  const x = vars(R);
  let k = 0;
  const M = Array.from({ length: n }, () => new Array<A.Poly>(n).fill(A.zero(R)));
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      M[i][j] = x[k];
      M[j][i] = A.neg(R, x[k]);
      k++;
    }
  return M;
}

describe("Schreyer frame: integer-key division against the general division", () => {
  it("the Plücker ideal of G(2,5) over GF(32003) and Q: the same frame", () => {
    for (const F of [A.gf(32003), A.QQ]) {
      const R = ringOf(F, 10, "p");
      const [fast, general] = frames(A.ideal(R, pfaffians(R, skew(R, 5), 4)));
      expect(fast.cols.length).toBeGreaterThan(3);
      expect(plain(fast)).toEqual(plain(general));
    }
  });

  it("random quadrics and cubics over several primes and Q: the same frame", () => {
    const rand = rng(2026);
    for (const F of [A.gf(2), A.gf(7), A.gf(32003), A.gf(2147483647), A.QQ]) {
      for (let trial = 0; trial < 3; trial++) {
        const R = ringOf(F, 5);
        const gens = [randomForm(R, 2, 4, rand), randomForm(R, 2, 4, rand), randomForm(R, 2, 3, rand), randomForm(R, 3, 5, rand)];
        const [fast, general] = frames(A.ideal(R, gens));
        expect(plain(fast)).toEqual(plain(general));
      }
    }
  });

  it("a weighted grading (degrees 1, 2, 3) and a ring of many variables: the same frame", () => {
    const W = A.polyRing(A.gf(32003), ["x", "y", "z"], { degrees: [1, 2, 3] });
    const [x, y, z] = vars(W);
    const f = A.add(W, A.mul(W, x, x), y),
      g = A.add(W, A.mul(W, x, y), z),
      h = A.sub(W, A.mul(W, y, y), A.mul(W, x, z));
    const [a, b] = frames(A.ideal(W, [f, g, h]));
    expect(plain(a)).toEqual(plain(b));
    // 24 variables: the keys split into hi and lo digits of base 3 (the squares x_i^2)
    const R = ringOf(A.gf(32003), 24);
    const [c, d] = frames(
      A.ideal(
        R,
        vars(R)
          .slice(0, 6)
          .map((v, i) => A.add(R, A.mul(R, v, v), A.mul(R, vars(R)[23 - i], vars(R)[12]))),
      ),
    );
    expect(plain(c)).toEqual(plain(d));
  });

  it("a presented module with row degrees: the same frame", () => {
    const R = ringOf(A.gf(32003), 4);
    const [x1, x2, x3, x4] = vars(R);
    const C = ringCtx(R) as RingCtx<unknown>;
    const O = termOverPosition(C.layout, 2);
    const degs = [0, 1];
    // columns of degree 2: (x1^2, x3), (x2^2, x4), (x1x2, x1 + x2), (x3x4, x2 − x3)
    const cols = [
      [A.mul(R, x1, x1), x3],
      [A.mul(R, x2, x2), x4],
      [A.mul(R, x1, x2), A.add(R, x1, x2)],
      [A.mul(R, x3, x4), A.sub(R, x2, x3)],
    ].map((c) => vecFromPolys(C, O, c));
    const basis = moduleGroebner(C, O, degs, cols);
    // terms of different degrees in one vector (row degrees 0 and 1): still the integer keys
    expect(frameDivider(C, O, basis, [])).not.toBeNull();
    const run = (generalDivision: boolean) => schreyerResolution(C, degs, O, basis, UNBOUNDED, undefined, () => {}, { generalDivision });
    const fast = run(false);
    expect(fast.cols.length).toBeGreaterThan(3);
    expect(plain(fast)).toEqual(plain(run(true)));
  });

  it("the Plücker ideal of G(2,6): its Betti table gives the Hilbert function of the Plücker algebra", () => {
    // dim_k of degree d of the homogeneous coordinate ring of G(2,n) is
    // C(n+d−1, d)·C(n+d−2, d)/(d+1) (the number of semistandard tableaux of shape (d, d)
    // with entries ≤ n: Hodge's standard monomial theory; the count from memory, checked
    // here at d = 1: n(n−1)/2 coordinates, and d = 2: C(n(n−1)/2 + 1, 2) − C(n, 4) quadrics).
    const n = 6;
    const R = ringOf(A.gf(32003), binom(n, 2), "p");
    const res = resolveQuotient(A.ideal(R, pfaffians(R, skew(R, n), 4)));
    expect(res.complete).toBe(true);
    const N = binom(n, 2);
    for (let d = 0; d <= 8; d++) {
      // Σ_i (−1)^i Σ_j β_{i,j} dim S_{d−j}
      let chi = 0;
      for (const [i, j, b] of res.betti.entries) if (j <= d) chi += (i % 2 === 0 ? 1 : -1) * b * binom(N + d - j - 1, d - j);
      expect(chi).toBe((binom(n + d - 1, d) * binom(n + d - 2, d)) / (d + 1));
    }
    // Gorenstein of codimension 6 (dimension 2(n − 2) + 1 = 9 in 15 variables): symmetric totals
    const totals = A.bettiTotals(res.betti);
    expect(totals.length - 1).toBe(N - (2 * (n - 2) + 1));
    expect(totals).toEqual([...totals].reverse());
  });
});
