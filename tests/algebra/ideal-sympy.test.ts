// Intersections and elimination ideals cross-checked against SymPy (Debian package
// python3-sympy, a general-purpose reference library): SymPy's reduced lex basis of the
// ideal, restricted to the polynomials free of the eliminated variables, is the reduced lex
// basis of the elimination ideal (elimination theorem: D. Cox, J. Little, D. O'Shea,
// Ideals, Varieties, and Algorithms, Ch. 3 §1); for I ∩ J the ideal is t·I + (1 − t)·J
// (same book, Ch. 4 §3). Ours are computed with weight orders in grevlex rings, then
// re-expressed in lex.
import { beforeAll, describe, expect, it } from "vitest";
import {
  formatPoly,
  gf,
  ideal,
  idealEliminate,
  idealGroebnerBasis,
  idealIntersection,
  parsePoly,
  polyRing,
  terms,
  type Ideal,
  type PolyRing,
} from "@/lib/algebra";
import { mulberry32, randomSystem } from "./sympy/random-systems";
import { assertSympyAvailable, runSympyBatch, type SympyResult, type SympySystem } from "./sympy/sympy";

const P = 32003;
const VARS = ["x", "y", "z"];
const grevlex = polyRing(gf(P), VARS);
const lex = polyRing(gf(P), VARS, { order: { kind: "lex" } });

/// The reduced lex basis of I (an ideal of the grevlex ring) in SymPy's term format,
/// dropping the first `drop` exponents of each SymPy vector that we do not have.
function oursInLex(I: Ideal): string[] {
  const L = ideal(
    lex,
    I.gens.map((g) => parsePoly(lex, formatPoly(grevlex, g))),
  );
  return idealGroebnerBasis(L)
    .map((g) => JSON.stringify(terms(lex, g).map((t) => [String(((t.num % BigInt(P)) + BigInt(P)) % BigInt(P)), "1", t.exps])))
    .sort();
}

function theirs(r: SympyResult, keep: (exps: number[]) => boolean, drop: number): string[] {
  if ("error" in r) throw new Error(`SymPy failed: ${r.error}`);
  return r.basis
    .filter((g) => g.every(([, , e]) => keep(e)))
    .map((g) => JSON.stringify(g.map(([n, d, e]) => [n, d, e.slice(drop)])))
    .sort();
}

function idealOf(R: PolyRing, gens: string[]): Ideal {
  return ideal(
    R,
    gens.map((s) => parsePoly(R, s)),
  );
}

describe("intersections and elimination ideals agree with SymPy", () => {
  const rng = mulberry32(3141);
  const random = () => randomSystem(rng, { vars: 3, gens: 2, terms: 3, degree: 2, rational: false, modulus: P, order: "lex" }).gens;
  const pairs = Array.from({ length: 12 }, () => [random(), random()] as const);
  const singles = Array.from(
    { length: 12 },
    () => randomSystem(rng, { vars: 3, gens: 3, terms: 3, degree: 3, rational: false, modulus: P, order: "lex" }).gens,
  );
  let meetResults: SympyResult[] = [];
  let elimResults: SympyResult[] = [];

  beforeAll(() => {
    assertSympyAvailable();
    const meetSystems: SympySystem[] = pairs.map(([a, b]) => ({
      vars: ["t", ...VARS],
      gens: [...a.map((f) => `t*(${f})`), ...b.map((g) => `(1-t)*(${g})`)],
      order: "lex",
      modulus: P,
    }));
    const elimSystems: SympySystem[] = singles.map((gens) => ({ vars: VARS, gens, order: "lex", modulus: P }));
    meetResults = runSympyBatch(meetSystems, 120_000);
    elimResults = runSympyBatch(elimSystems, 120_000);
  });

  it("I ∩ J", () => {
    let nontrivial = 0;
    pairs.forEach(([a, b], i) => {
      const meet = idealIntersection(idealOf(grevlex, [...a]), idealOf(grevlex, [...b]));
      const expected = theirs(meetResults[i], (e) => e[0] === 0, 1);
      expect(oursInLex(meet)).toEqual(expected);
      if (expected.length > 1) nontrivial++;
    });
    expect(nontrivial).toBeGreaterThanOrEqual(8);
  });

  it("I ∩ k[y, z] and I ∩ k[z]", () => {
    // a zero-dimensional I has I ∩ k[z] = (one univariate polynomial of positive degree)
    let nontrivial = 0;
    singles.forEach((gens, i) => {
      const I = idealOf(grevlex, gens);
      expect(oursInLex(idealEliminate(I, ["x"]))).toEqual(theirs(elimResults[i], (e) => e[0] === 0, 0));
      const last = theirs(elimResults[i], (e) => e[0] === 0 && e[1] === 0, 0);
      expect(oursInLex(idealEliminate(I, ["x", "y"]))).toEqual(last);
      if (last.length === 1 && !last[0].startsWith('[["1","1",[0,0,0]]]')) nontrivial++;
    });
    expect(nontrivial).toBeGreaterThanOrEqual(8);
  });
});
