import * as A from "../../lib/algebra/index";
import { cyclic, katsura } from "./families";

/// A benchmark case: our computation, and optionally the same problem for SymPy.
export interface BenchCase {
  name: string;
  /// Runs our engine once; returns a size to print (e.g. the basis length).
  run(): { size: number; label: string };
  /// The same computation as a SymPy groebner call (tests/algebra/sympy/groebner_batch.py).
  sympy?: { vars: string[]; gens: string[]; order: "grevlex" | "lex" | "grlex"; modulus: number | null };
}

const F = A.gf(32003);

function groebnerCase(name: string, system: { R: A.PolyRing; gens: A.Poly[] }): BenchCase {
  const { R, gens } = system;
  return {
    name,
    run: () => ({ size: A.groebnerBasis(R, gens).length, label: "basis size" }),
    sympy: { vars: [...R.vars], gens: gens.map((g) => A.formatPoly(R, g)), order: "grevlex", modulus: F.p },
  };
}

/// Add new cases here; the runner times each and compares with SymPy where given.
export const cases: BenchCase[] = [
  groebnerCase("cyclic-5 GF(32003) grevlex", cyclic(F, 5)),
  groebnerCase("cyclic-6 GF(32003) grevlex", cyclic(F, 6)),
  groebnerCase("katsura-6 GF(32003) grevlex", katsura(F, 6)),
  groebnerCase("katsura-7 GF(32003) grevlex", katsura(F, 7)),
  groebnerCase("katsura-8 GF(32003) grevlex", katsura(F, 8)),
];
