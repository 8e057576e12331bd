import * as A from "../../lib/algebra/index";
import { cyclic, katsura } from "./families";

/// A benchmark case: our computation, and optionally the same problem for SymPy.
export interface BenchCase {
  name: string;
  /// Runs our engine once (in a child process of its own); returns a size to print (e.g. the
  /// basis length).
  run(): { size: number; label: string } | Promise<{ size: number; label: string }>;
  /// Which table of the README the row belongs to.
  table?: "groebner" | "resolution" | "other";
  /// Goals and the figure before this work (issue 17), printed beside the measurement.
  goal?: { seconds?: number; mb?: number; ratio?: number; note?: string };
  before?: string;
  /// The child's V8 heap limit (default 4096 MB) and time bound (default 600 s).
  heapMb?: number;
  timeoutS?: number;
  /// The same computation as a SymPy groebner call (tests/algebra/sympy/groebner_batch.py).
  sympy?: { vars: string[]; gens: string[]; order: "grevlex" | "lex" | "grlex"; modulus: number | null };
}

const F = A.gf(32003);

/// A reduced Gröbner basis over GF(32003) in grevlex; with `sympy`, SymPy runs the same
/// system in the same bench run (the ratio rows).
function groebnerCase(
  name: string,
  build: () => { R: A.PolyRing; gens: A.Poly[] },
  extra: Omit<Partial<BenchCase>, "sympy"> & { sympy?: boolean } = {},
): BenchCase {
  const { sympy, ...rest } = extra;
  const system = sympy ? build() : null;
  return {
    name,
    table: "groebner",
    run: () => {
      const { R, gens } = build();
      return { size: A.groebnerBasis(R, gens).length, label: "basis size" };
    },
    ...(system
      ? {
          sympy: {
            vars: [...system.R.vars],
            gens: system.gens.map((g) => A.formatPoly(system.R, g)),
            order: "grevlex" as const,
            modulus: F.p,
          },
        }
      : {}),
    ...rest,
  };
}

/// Add new cases here; the runner times each and compares with SymPy where given. Goals and
/// "before" figures are those of issue 17 (measured through the CLI, start-up subtracted).
export const cases: BenchCase[] = [
  groebnerCase("cyclic-5", () => cyclic(F, 5), { sympy: true, table: "other" }),
  groebnerCase("cyclic-6", () => cyclic(F, 6), { sympy: true, goal: { ratio: 1000 }, before: "196× SymPy" }),
  groebnerCase("cyclic-7", () => cyclic(F, 7), { goal: { seconds: 0.25 }, before: "0.51 s" }),
  groebnerCase("cyclic-8", () => cyclic(F, 8), { goal: { seconds: 4 }, before: "not measured" }),
  groebnerCase("katsura-6", () => katsura(F, 6), { sympy: true, table: "other" }),
  groebnerCase("katsura-8", () => katsura(F, 8), { table: "other" }),
  groebnerCase("katsura-9", () => katsura(F, 9), { goal: { seconds: 0.5 }, before: "2.2 s" }),
  groebnerCase("katsura-10", () => katsura(F, 10), { goal: { seconds: 2.5 }, before: "17.7 s" }),
  groebnerCase("katsura-11", () => katsura(F, 11), { goal: { seconds: 15 }, before: "not measured", timeoutS: 300 }),
];
