// Standard bases for a local degree order (lib/algebra/standard, Lazard's homogenisation) and
// invariants of local rings (lib/algebra/localring), each checked against a named source.
import { beforeAll, describe, expect, it } from "vitest";
import {
  formatPoly,
  gf,
  ideal,
  initialIdeal,
  parsePoly,
  polyRing,
  QQ,
  terms,
  type Poly,
  type PolyRing,
  idealHilbertSeries,
} from "@/lib/algebra";
import { homogenisation, homogenise, standardBasis } from "@/lib/algebra/standard";
import {
  localAnalysis,
  localDimension,
  localEmbeddingDimension,
  localLength,
  localMultiplicity,
  milnorNumber,
  samuelValues,
  tjurinaNumber,
} from "@/lib/algebra/localring";
import { assertSympyAvailable, runSympyBatch, type SympyResult } from "./sympy/sympy";

const P = 32003;
const S2 = polyRing(QQ, ["x", "y"]);
const S3 = polyRing(QQ, ["x", "y", "z"]);
const p = (R: PolyRing, s: string) => parsePoly(R, s);
const mu = (R: PolyRing, f: string) => Number(milnorNumber(R, p(R, f), null));
const tau = (R: PolyRing, f: string) => Number(tjurinaNumber(R, p(R, f), null));
const local = (R: PolyRing, gens: string[], at: bigint[] | null = null) =>
  localAnalysis(
    R,
    gens.map((g) => p(R, g)),
    at ? at.map((n) => ({ n, d: 1n })) : null,
  );

describe("Milnor and Tjurina numbers", () => {
  // The simple singularities and their normal forms: V. I. Arnold, "Normal forms of functions
  // near degenerate critical points, the Weyl groups A_k, D_k, E_k and Lagrangian
  // singularities", Funct. Anal. Appl. 6 (1972) — μ equals the index (from memory).
  it("A_k: x^(k+1) + y^2 has μ = k", () => {
    for (const k of [1, 2, 3, 5, 8]) expect(mu(S2, `x^${k + 1}+y^2`)).toBe(k);
  });
  it("D_k: x^2*y + y^(k−1) has μ = k", () => {
    for (const k of [4, 5, 6, 9]) expect(mu(S2, `x^2*y+y^${k - 1}`)).toBe(k);
  });
  it("E_6, E_7, E_8: x^3 + y^4, x^3 + x*y^3, x^3 + y^5", () => {
    expect([mu(S2, "x^3+y^4"), mu(S2, "x^3+x*y^3"), mu(S2, "x^3+y^5")]).toEqual([6, 7, 8]);
  });
  it("in three variables, adding squares (stabilisation) keeps μ: A_3 + z^2, E_8 + z^2", () => {
    expect([mu(S3, "x^4+y^2+z^2"), mu(S3, "x^3+y^5+z^2")]).toEqual([3, 8]);
  });
  it("τ = μ for quasi-homogeneous f (K. Saito, Invent. Math. 14, 1971: f ∈ (∂f) exactly then)", () => {
    for (const f of ["x^4+y^2", "x^2*y+y^5", "x^3+y^4", "x^3+x*y^3", "x^3+y^5", "x^5+y^5"]) expect(tau(S2, f)).toBe(mu(S2, f));
  });
  it("τ < μ for E_12 with a nonzero modulus: x^3 + y^7 + x*y^5 has μ = 12, τ = 11", () => {
    // Arnold 1972 (above): E_12 = x^3 + y^7 + a·x·y^5, unimodal; for a ≠ 0 the term x·y^5 (weighted
    // degree 22 > 21 for weights 7, 3) is the top of the Milnor algebra and τ = μ − 1 (from memory)
    expect(mu(S2, "x^3+y^7+x*y^5")).toBe(12);
    expect(tau(S2, "x^3+y^7+x*y^5")).toBe(11);
    expect(tau(S2, "x^3+y^7")).toBe(12);
  });
  it("at another point: the cusp moved to (1, −2) keeps μ = τ = 2; a smooth point gives 0", () => {
    const f = "(x-1)^3+(y+2)^2";
    const at = [
      { n: 1n, d: 1n },
      { n: -2n, d: 1n },
    ];
    expect(Number(milnorNumber(S2, p(S2, f), at))).toBe(2);
    expect(Number(tjurinaNumber(S2, p(S2, f), at))).toBe(2);
    expect(Number(milnorNumber(S2, p(S2, "x+y^2"), null))).toBe(0);
  });
  it("a non-isolated singularity is an error: x^2*y^2 (singular along both axes)", () => {
    expect(() => milnorNumber(S2, p(S2, "x^2*y^2"), null)).toThrow(/not isolated/);
  });
  it("works over GF(p) as well", () => {
    const R = polyRing(gf(P), ["x", "y"]);
    expect(Number(milnorNumber(R, p(R, "x^3+x*y^3"), null))).toBe(7);
  });
});

describe("Hilbert–Samuel function and multiplicity at the origin", () => {
  // e(m, R) is the degree of the tangent cone; for a hypersurface it is the order of f
  // (D. Eisenbud, Commutative Algebra, §12.1 and Ex. 12.? on the tangent cone; common practice).
  it("node y^2 − x^2 − x^3: e = 2, ℓ(R/m^(d+1)) = 2d + 1", () => {
    const L = local(S2, ["y^2-x^2-x^3"]);
    expect(localMultiplicity(L)).toBe(2n);
    expect(samuelValues(L, 4).map(Number)).toEqual([1, 3, 5, 7, 9]);
    expect(localDimension(L)).toBe(1);
    expect(localEmbeddingDimension(L)).toBe(2);
  });
  it("cusp y^2 − x^3: e = 2", () => {
    expect(localMultiplicity(local(S2, ["y^2-x^3"]))).toBe(2n);
  });
  it("surfaces: A_1 x^2+y^2+z^2 (e = 2), D_4 x^2*y + y^3 + z^2 (e = 2), E_6 x^3+y^4+z^2 (e = 2), x^3+y^3+z^3+x*y*z^2 (cone over a cubic, e = 3)", () => {
    expect(["x^2+y^2+z^2", "x^2*y+y^3+z^2", "x^3+y^4+z^2", "x^3+y^3+z^3+x^2*y*z"].map((f) => localMultiplicity(local(S3, [f])))).toEqual([
      2n,
      2n,
      2n,
      3n,
    ]);
  });
  it("the space curve (t^3, t^4, t^5): e = 3 (the smallest exponent; from memory)", () => {
    expect(localMultiplicity(local(S3, ["x^3-y*z", "y^2-x*z", "z^2-x^2*y"]))).toBe(3n);
  });
  it("a point that is not on V(I): the local ring is zero", () => {
    const L = local(S2, ["x-1"]);
    expect(L.zero).toBe(true);
    expect(localLength(L)).toBe(0n);
  });
  it("the tangency y = x^2 with y = 0: ℓ = 2 at the origin, 1 at a transversal point (W. Fulton, Algebraic Curves, §3.3)", () => {
    expect(localLength(local(S2, ["y-x^2", "y"]))).toBe(2n);
    // y − x^2 and y − 1 meet transversally at (1, 1)
    expect(localLength(local(S2, ["y-x^2", "y-1"], [1n, 1n]))).toBe(1n);
    // globally y − x^2, y − 1 has length 2 (two points); locally at the origin nothing
    expect(local(S2, ["y-x^2", "y-1"]).zero).toBe(true);
  });
});

describe("standard bases agree with graded results on homogeneous input", () => {
  // For homogeneous I the local degree order agrees with grevlex degree by degree, so the
  // leading ideal is the grevlex initial ideal and the tangent cone is S/I itself.
  const cases = [
    ["x^2*y-z^3", "x*y^2-z^2*x"],
    ["x*z-y^2", "y*w-z^2", "x*w-y*z"],
    ["x^3", "y^3", "z^3", "x*y*z"],
  ];
  for (const gens of cases) {
    it(`<${gens.join(", ")}>`, () => {
      const R = polyRing(QQ, ["x", "y", "z", "w"]);
      const I = ideal(
        R,
        gens.map((g) => p(R, g)),
      );
      const sb = standardBasis(R, I.gens);
      const graded = initialIdeal(I)
        .gens.map((g) => terms(R, g)[0].exps.join(","))
        .sort();
      expect(sb.leadIdeal.map((e) => e.join(",")).sort()).toEqual(graded);
      const L = localAnalysis(R, I.gens, null);
      const hs = idealHilbertSeries(I);
      expect(L.tangentSeries.numerator).toEqual(hs.numerator);
      expect(L.tangentSeries.dimension).toBe(hs.dimension);
    });
  }
});

describe("standard bases agree with SymPy via Lazard's homogenisation", () => {
  // SymPy's reduced Gröbner basis of ⟨f^h⟩ in the product order (lex on h, then grevlex),
  // which agrees with ours on forms of one degree; dehomogenised, both are the same standard basis.
  const R = polyRing(gf(P), ["x", "y", "z"]);
  const systems = [
    ["x^3+y^4+x*y*z", "y^2-x*z+z^5", "z^3-x^2+y^3"],
    ["x^2-y^3+x^4", "x*y-z^2+y^5"],
    ["x+y^2+z^3", "y-x*z+x^2"],
    ["x^4+y^5+x^2*y^3", "4*x^3+2*x*y^3", "5*y^4+3*x^2*y^2"],
  ];
  let results: SympyResult[] = [];
  beforeAll(() => {
    assertSympyAvailable();
    const Z = homogenisation(R);
    results = runSympyBatch(
      systems.map((gens) => ({
        vars: Z.H.vars as string[],
        gens: gens.map((g) => formatPoly(Z.H, homogenise(Z, p(R, g)))),
        order: "lazard" as const,
        modulus: P,
      })),
    );
  });
  systems.forEach((gens, k) => {
    it(`<${gens.join(", ")}>`, () => {
      const r = results[k];
      if ("error" in r) throw new Error(r.error);
      const norm = (ts: [string, string, number[]][]) => JSON.stringify(ts.map(([c, , e]) => [c, e.slice(1)]).sort());
      const theirs = r.basis.map(norm).sort();
      const ours = standardBasis(
        R,
        gens.map((g) => p(R, g)),
      )
        .basis.map((f: Poly) =>
          norm(
            terms(R, f).map(
              (t) => [String(((t.num % BigInt(P)) + BigInt(P)) % BigInt(P)), "1", [0, ...t.exps]] as [string, string, number[]],
            ),
          ),
        )
        .sort();
      expect(ours).toEqual(theirs);
    });
  });
});

describe("standard bases: progress, abort and limits", () => {
  const R = polyRing(gf(P), ["x", "y", "z"]);
  const gens = ["x^5+y^6+z^7+x*y*z^3", "x^4*y-z^6+y^3*z^2", "y^5-x^2*z^3+x*y^4*z"].map((g) => p(R, g));
  it("an aborted signal ends it with kind cancelled", () => {
    const ctl = new AbortController();
    ctl.abort();
    expect(() => standardBasis(R, gens, { signal: ctl.signal })).toThrow(/cancelled/);
  });
  it("a basis-size limit ends it with kind limit", () => {
    let err: unknown = null;
    try {
      standardBasis(R, gens, { limits: { maxBasisSize: 2 } });
    } catch (e) {
      err = e;
    }
    expect(err).toMatchObject({ kind: "limit" });
  });
  it("reports progress while it runs", () => {
    const stages: string[] = [];
    standardBasis(R, gens, { progress: (q) => stages.push(q.stage) });
    expect(stages.length).toBeGreaterThan(0);
  });
});
