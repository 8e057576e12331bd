// SymPy's groebner (python3-sympy): reduced Gröbner bases of small random systems agree term for term with
// SymPy's groebner(..., order=..., modulus=p) (SymPy, Debian package python3-sympy).
import { beforeAll, describe, expect, it } from "vitest";
import * as A from "@/lib/algebra";
import { mulberry32, randomSystem } from "./sympy/random-systems";
import { assertSympyAvailable, runSympyBatch, type SympyResult, type SympySystem } from "./sympy/sympy";

const P = 32003;
const ORDERS = ["grevlex", "lex", "grlex"] as const;
const ourOrder = (o: SympySystem["order"]): A.OrderSpec => ({ kind: o === "grlex" ? "glex" : o });

function buildSystems(): SympySystem[] {
  const rng = mulberry32(20261201);
  const systems: SympySystem[] = [];
  for (let i = 0; i < 36; i++) {
    systems.push(
      randomSystem(rng, {
        vars: 2 + (i % 3),
        gens: 2 + (i % 2) + (i % 3 === 2 ? 1 : 0),
        terms: 4,
        degree: 3,
        rational: false,
        modulus: P,
        order: ORDERS[i % 3],
      }),
    );
  }
  for (let i = 0; i < 36; i++) {
    systems.push(
      randomSystem(rng, { vars: 2 + (i % 2), gens: 2 + (i % 2), terms: 3, degree: 3, rational: true, modulus: null, order: ORDERS[i % 3] }),
    );
  }
  return systems;
}

/// Our reduced basis in SymPy's term format (residues in [0, p) over GF(p)), as sorted strings.
function ours(s: SympySystem): string[] {
  const R = A.polyRing(s.modulus ? A.gf(s.modulus) : A.QQ, s.vars, { order: ourOrder(s.order) });
  const G = A.groebnerBasis(
    R,
    s.gens.map((g) => A.parsePoly(R, g)),
  );
  return G.map((g) =>
    JSON.stringify(
      A.terms(R, g).map((t) => {
        const num = s.modulus ? (((t.num % BigInt(s.modulus)) + BigInt(s.modulus)) % BigInt(s.modulus)).toString() : t.num.toString();
        return [num, t.den.toString(), t.exps];
      }),
    ),
  ).sort();
}

describe("reduced Gröbner bases agree with SymPy (python3-sympy)", () => {
  const systems = buildSystems();
  let results: SympyResult[] = [];

  beforeAll(() => {
    assertSympyAvailable();
    results = runSympyBatch(systems, 120_000);
  });

  it("covers at least 50 systems over GF(32003) and Q, most of them non-trivial", () => {
    expect(systems.length).toBeGreaterThanOrEqual(50);
    const nontrivial = results.filter((r) => "basis" in r && r.basis.length > 1).length;
    expect(nontrivial).toBeGreaterThanOrEqual(40);
  });

  it("agrees term for term on every system", () => {
    const mismatches: string[] = [];
    systems.forEach((s, i) => {
      const r = results[i];
      if ("error" in r) {
        mismatches.push(`system ${i}: SymPy failed: ${r.error}`);
        return;
      }
      const theirs = r.basis.map((g) => JSON.stringify(g)).sort();
      const mine = ours(s);
      if (JSON.stringify(mine) !== JSON.stringify(theirs)) {
        mismatches.push(
          `system ${i} (${s.order}, ${s.modulus ?? "Q"}): ${s.gens.join(", ")}\n ours:  ${mine.join(" ")}\n sympy: ${theirs.join(" ")}`,
        );
      }
    });
    expect(mismatches).toEqual([]);
  });
});
