import { describe, expect, it } from "vitest";
import * as A from "../../lib/algebra/index";
import { burchIdeal, burchIndexOfIdeal, burchIndexOfRing } from "../../lib/algebra/burch/index";
import { residueSplitsFromSyzygy } from "../../lib/algebra/resolution/graded-quotient/index";
import { maximal, ring, vars } from "./local-helpers";

describe("Burch ideal and index", () => {
  it("m^p: B = m^2 and index n", () => {
    // Dao–Kobayashi–Takahashi, Algebra & Number Theory 2020: I : m = m^{p−1}, B(I) = (m^{p+1}) : m^{p−1} = m^2.
    for (const [n, p] of [
      [2, 2],
      [3, 2],
      [3, 3],
      [2, 4],
    ] as const) {
      const S = ring(n);
      const m = maximal(S);
      const I = A.idealPower(m, p);
      expect(A.idealEquals(A.idealColon(I, m), A.idealPower(m, p - 1))).toBe(true);
      expect(A.idealEquals(burchIdeal(I), A.idealPower(m, 2))).toBe(true);
      expect(burchIndexOfIdeal(I)).toBe(n);
      expect(burchIndexOfRing(I)).toMatchObject({ index: n, isBurch: true, depth: 0, random: null });
    }
  });

  it("ideals computed by hand from the definition, depth 0", () => {
    // By hand from B(I) = (m·I) : (I : m):
    // (x^2, y^2): I : m = (x^2, xy, y^2), and every linear form times xy lies in mI, so
    // B = m, index 0: not Burch (a complete intersection of codimension 2 is not Burch).
    const S = ring(2);
    const [x, y] = vars(S);
    expect(burchIndexOfIdeal(A.ideal(S, [A.mul(S, x, x), A.mul(S, y, y)]))).toBe(0);
    // (x^2, xy): I : m = (x), m(I : m) = (x^2, xy) = I ⊄ mI; B = mI : (x) = (x^2, xy, y^2) = m^2,
    // index 2.
    expect(burchIndexOfIdeal(A.ideal(S, [A.mul(S, x, x), A.mul(S, x, y)]))).toBe(2);
    // (x^2, y^3): I : m = (x^2, xy^2, y^3); xy^2·x = x^2y^2 ∈ mI, xy^2·y = xy^3 ∈ mI, so
    // B = m and the index is 0.
    expect(burchIndexOfIdeal(A.ideal(S, [A.mul(S, x, x), A.pow(S, y, 3)]))).toBe(0);
    // (x^3, x^2y, y^2): I : m = (x^2, xy, y^2); B ∋ y? y·x^2 = x^2y ∈ I but mI = (x^4, x^3y,
    // x^2y^2, xy^2, y^3): x^2y ∉ mI, so y ∉ B; x·xy = x^2y ∉ mI, so x ∉ B; x − cy: (x − cy)·x^2
    // = x^3 − c x^2y ∉ mI. Index 2.
    expect(burchIndexOfIdeal(A.ideal(S, [A.pow(S, x, 3), A.mul(S, A.mul(S, x, x), y), A.mul(S, y, y)]))).toBe(2);
  });

  it("the Burch condition mI ≠ m(I : m) agrees with index ≥ 1", () => {
    // Dao–Kobayashi–Takahashi 2020, Definition 2.1 (from memory): I is Burch iff mI ≠ m(I : m).
    const S = ring(3);
    const [x, y, z] = vars(S);
    const m = maximal(S);
    const ideals = [
      A.ideal(S, [A.mul(S, x, x), A.mul(S, y, y), A.mul(S, z, z)]),
      A.ideal(S, [A.mul(S, x, x), A.mul(S, x, y), A.mul(S, y, z), A.pow(S, z, 3), A.pow(S, y, 3)]),
      A.idealPower(m, 3),
      A.ideal(S, [A.mul(S, x, y), A.mul(S, y, z), A.mul(S, x, z), A.pow(S, x, 2), A.sub(S, A.pow(S, y, 2), A.pow(S, z, 2))]),
    ];
    for (const I of ideals) {
      const burch = !A.idealEquals(A.idealProduct(m, I), A.idealProduct(m, A.idealColon(I, m)));
      expect(burchIndexOfIdeal(I) >= 1).toBe(burch);
    }
  });

  it("positive depth: a general linear form is factored out and the choice is recorded", () => {
    // (x^2, xy, y^2) in k[x,y,z] has depth 1 (z is regular); modulo a general linear form it
    // becomes m^2 in two variables, index 2 by Dao–Kobayashi–Takahashi, Algebra & Number Theory 2020.
    const S = ring(3);
    const [x, y] = vars(S);
    const I = A.ideal(S, [A.mul(S, x, x), A.mul(S, x, y), A.mul(S, y, y)]);
    for (const seed of [1, 2, 3]) {
      const r = burchIndexOfRing(I, { seed });
      expect(r.index).toBe(2);
      expect(r.depth).toBe(1);
      expect(r.random?.seed).toBe(seed);
      expect(r.random?.forms.length).toBe(1);
    }
    // (x^2, y^2) in k[x,y,z]: depth 1, modulo a general form a complete intersection of two
    // quadrics in two variables, index 0 (by hand above).
    expect(burchIndexOfRing(A.ideal(S, [A.mul(S, x, x), A.mul(S, y, y)])).index).toBe(0);
    // x^2 in k[x,y]: depth 1; k[x]/(x^2) has B = (x^3) : (x) = (x^2), index 1 (a hypersurface).
    const T = ring(2);
    expect(burchIndexOfRing(A.ideal(T, [A.pow(T, A.variable(T, 0), 2)]))).toMatchObject({ index: 1, isBurch: true, depth: 1 });
  });

  it("a presentation that is not minimal is made minimal first (issue 16: one rule)", () => {
    // k[x,y]/(x, y^2) ≅ k[y]/(y^2): n = (y), I = (y^2), B(I) = (y^3) : (y) = (y^2), index 1 (by hand)
    const S = ring(2);
    const [x, y] = vars(S);
    expect(burchIndexOfRing(A.ideal(S, [x, A.pow(S, y, 2)])).index).toBe(1);
    // an order-1 element whose variable cannot be solved for polynomially is still refused
    expect(() => burchIndexOfRing(A.ideal(S, [A.add(S, x, A.pow(S, x, 2)), A.pow(S, y, 3)]))).toThrow(/power series/);
  });

  it("depth 0: k is a summand of the second syzygy of k exactly for Burch rings", () => {
    // Dao–Kobayashi–Takahashi 2020 (Burch rings of depth 0: k is a direct summand of Ω^2 k,
    // and not otherwise; from memory).
    const S = ring(2);
    const [x, y] = vars(S);
    const m = maximal(S);
    const cases = [
      A.idealPower(m, 2),
      A.idealPower(m, 3),
      A.ideal(S, [A.mul(S, x, x), A.mul(S, x, y), A.pow(S, y, 3)]),
      A.ideal(S, [A.mul(S, x, x), A.mul(S, y, y)]),
      A.ideal(S, [A.mul(S, x, x), A.pow(S, y, 3)]),
      A.ideal(S, [A.pow(S, x, 3), A.mul(S, A.mul(S, x, x), y), A.mul(S, y, y)]),
    ];
    const seen = new Set<boolean>();
    for (const I of cases) {
      const burch = burchIndexOfIdeal(I) >= 1;
      seen.add(burch);
      expect(residueSplitsFromSyzygy(I, 2)).toBe(burch);
    }
    expect(seen.size).toBe(2);
  });

  it("non-homogeneous ideals are read at the origin", () => {
    // (x^2 − x^3, y^2) = (x^2, y^2) ∩ (x − 1, y^2): at the origin the ring is k[x,y]/(x^2, y^2),
    // index 0; (x^2(1 − x), xy, y^2) is m^2 at the origin, index 2.
    const S = ring(2);
    const [x, y] = vars(S);
    const x2 = A.mul(S, x, x);
    const u = A.sub(S, x2, A.pow(S, x, 3));
    expect(burchIndexOfIdeal(A.ideal(S, [u, A.mul(S, y, y)]))).toBe(0);
    expect(burchIndexOfRing(A.ideal(S, [u, A.mul(S, x, y), A.mul(S, y, y)])).index).toBe(2);
  });
});
