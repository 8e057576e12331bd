import { describe, expect, it } from "vitest";
import {
  add,
  ideal,
  idealEquals,
  idealGroebnerBasis,
  idealIntersection,
  isZero,
  leadExponents,
  mul,
  parsePoly,
  QQ,
  type Poly,
  zero,
} from "@/lib/algebra";
import { freeModule, moduleGroebnerBasis, moduleHilbertSeries, moduleSyzygies } from "@/lib/algebra/module";
import { resolutionHilbertSeries, resolveCoker } from "@/lib/algebra/resolution/schreyer";
import { GF, randomForm, ringOf, rng, vars } from "./resolution-helpers";

describe("Gröbner bases of submodules", () => {
  it("rank 1: the leading monomials of a minimal basis are the minimal generators of in(I)", () => {
    // A minimal Gröbner basis has the minimal generators of the initial ideal as leading
    // monomials, so it agrees with lib/algebra's reduced basis there (common practice).
    for (let seed = 1; seed <= 6; seed++) {
      const rand = rng(seed);
      const R = ringOf(seed % 2 ? GF : QQ, 4);
      const gens = Array.from({ length: 3 }, () => randomForm(R, 2 + (seed % 2), 3, rand));
      const G = moduleGroebnerBasis(
        freeModule(R, [0]),
        gens.map((g) => [g]),
      );
      const ours = G.map((v) => leadExponents(R, v[0]).join(",")).sort();
      const theirs = idealGroebnerBasis(ideal(R, gens))
        .map((g) => leadExponents(R, g).join(","))
        .sort();
      expect(ours).toEqual(theirs);
    }
  });

  it("position over term eliminates the first coordinate: I ∩ J from ⟨(f_i, 0), (g_j, g_j)⟩", () => {
    // In N = ⟨(f_i, 0), (g_j, g_j)⟩ ⊂ S^2 the vectors with first coordinate 0 are 0 ⊕ (I ∩ J); under
    // position over term with e_1 > e_2 the basis elements with leading term on e_2 generate them
    // (elimination of a module coordinate; common practice). lib/algebra computes I ∩ J by a
    // tag variable instead.
    for (const F of [GF, QQ]) {
      const R = ringOf(F, 3);
      const I = ["x1^2", "x2*x3"].map((s) => parsePoly(R, s));
      const J = ["x1*x2", "x3^2-x1*x2"].map((s) => parsePoly(R, s));
      const gens = [...I.map((f) => [f, zero(R)]), ...J.map((g) => [g, g])];
      const G = moduleGroebnerBasis(freeModule(R, [0, 0]), gens, "pot");
      const second = G.filter((v) => isZero(v[0])).map((v) => v[1]);
      expect(idealEquals(ideal(R, second), idealIntersection(ideal(R, I), ideal(R, J)))).toBe(true);
    }
  });

  it("Schreyer syzygies are syzygies; for the variables they are the Koszul relations", () => {
    // Schreyer's theorem (Eisenbud, Thm. 15.10); for x, y, z the syzygies are the three Koszul
    // relations y·e_x − x·e_y, … (common practice).
    const R = ringOf(GF, 3);
    const { basis, syzygies } = moduleSyzygies(
      freeModule(R, [0]),
      vars(R).map((v) => [v]),
    );
    expect(basis.length).toBe(3);
    expect(syzygies.length).toBe(3);
    for (const tau of syzygies) expect(tau.filter((f) => !isZero(f)).length).toBe(2);
    const rand = rng(9);
    for (const kind of ["top", "pot"] as const) {
      const S = ringOf(QQ, 3);
      const gens = Array.from({ length: 3 }, () => [randomForm(S, 2, 2, rand), randomForm(S, 2, 2, rand)]);
      const { basis: B, syzygies: Z } = moduleSyzygies(freeModule(S, [0, 0]), gens, kind);
      expect(Z.length).toBeGreaterThan(0);
      for (const tau of Z) {
        for (const c of [0, 1]) {
          const s = tau.reduce((acc: Poly, t, l) => add(S, acc, mul(S, t, B[l][c])), zero(S));
          expect(isZero(s)).toBe(true);
        }
      }
    }
  });
});

describe("Hilbert series of modules", () => {
  it("from the leading terms of a Gröbner basis equals the alternating Betti sum of the resolution", () => {
    // Two routes: Macaulay's theorem for F/U versus Hilbert's syzygy theorem on the minimal
    // resolution (Eisenbud, The Geometry of Syzygies, Ch. 1, from memory).
    const rand = rng(44);
    for (let t = 0; t < 4; t++) {
      const R = ringOf(t % 2 ? QQ : GF, 3);
      const rowDegrees = [0, 1];
      const cols = Array.from({ length: 3 }, () => [randomForm(R, 2, 2, rand), randomForm(R, 1, 2, rand)]);
      const H = moduleHilbertSeries(freeModule(R, rowDegrees), cols);
      const C = resolveCoker(
        R,
        rowDegrees.map((_, a) => cols.map((c) => c[a])),
        rowDegrees,
      );
      expect(H.numerator).toEqual(resolutionHilbertSeries(C).numerator);
    }
  });
});
