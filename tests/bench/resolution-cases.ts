// Resolution benchmarks (issue 5). Hook into the runner by adding `...resolutionCases` to
// the `cases` list in tests/bench/cases.ts (import { resolutionCases } from "./resolution-cases").
import * as A from "../../lib/algebra/index";
import { minors, pfaffians } from "../../lib/algebra/invariants/index";
import { bettiTotals, resolveQuotient } from "../../lib/algebra/resolution/schreyer/index";
import type { BenchCase } from "./cases";

const F = A.gf(32003);

function ring(n: number, name = "x", field: A.Field = F): A.PolyRing {
  return A.polyRing(
    field,
    Array.from({ length: n }, (_, i) => `${name}${i + 1}`),
  );
}

/// `count` random quadrics with coefficients in [−9, 9] (a fixed linear congruential
/// sequence, common practice) in k[x_1..x_n]: their reduced Gröbner basis over Q has large
/// coefficients, which is what the rational case measures.
export function randomQuadrics(n: number, count: number, field: A.Field): A.Ideal {
  const R = ring(n, "x", field);
  let seed = 12345;
  const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const gens: A.Poly[] = [];
  for (let g = 0; g < count; g++) {
    let f = A.zero(R);
    for (let i = 0; i < n; i++) {
      for (let j = i; j < n; j++) {
        const c = BigInt(Math.floor(next() * 19) - 9);
        const e = new Array<number>(n).fill(0);
        e[i]++;
        e[j]++;
        if (c !== 0n) f = A.add(R, f, A.monomial(R, e, c));
      }
    }
    gens.push(f);
  }
  return A.ideal(R, gens);
}

function resolutionCase(name: string, build: () => A.Ideal): BenchCase {
  return {
    name,
    run: () => {
      const C = resolveQuotient(build());
      return { size: bettiTotals(C.betti).reduce((s, b) => s + b, 0), label: `Betti totals ${bettiTotals(C.betti).join(",")}, sum` };
    },
  };
}

/// The 2×2 minors of the generic 2×c matrix.
export function genericMinors2(c: number, field: A.Field = F): A.Ideal {
  const R = ring(2 * c, "x", field);
  const M = [0, 1].map((r) => Array.from({ length: c }, (_, j) => A.variable(R, r * c + j)));
  return A.ideal(R, minors(R, M, 2));
}

/// The p-th power of the maximal ideal of k[x_1..x_n].
export function maximalPower(n: number, p: number): A.Ideal {
  const R = ring(n);
  return A.idealPower(
    A.ideal(
      R,
      R.vars.map((_, i) => A.variable(R, i)),
    ),
    p,
  );
}

/// The ideal of the variables of k[x_1..x_n] (its resolution is the Koszul complex).
export function variablesIdeal(n: number): A.Ideal {
  const R = ring(n);
  return A.ideal(
    R,
    R.vars.map((_, i) => A.variable(R, i)),
  );
}

/// The Plücker ideal of the Grassmannian G(2, n): the 4×4 Pfaffians of the generic
/// alternating n×n matrix, in C(n, 2) variables.
export function pluckerIdeal(n: number): A.Ideal {
  const R = ring((n * (n - 1)) / 2, "p");
  const M: A.Poly[][] = Array.from({ length: n }, () => new Array<A.Poly>(n).fill(A.zero(R)));
  let v = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      M[i][j] = A.variable(R, v);
      M[j][i] = A.neg(R, A.variable(R, v));
      v++;
    }
  }
  return A.ideal(R, pfaffians(R, M, 4));
}

export const resolutionCases: BenchCase[] = [
  resolutionCase("resolution: 2x2 minors of generic 2x8, GF(32003)", () => genericMinors2(8)),
  resolutionCase("resolution: m^4 in 5 variables, GF(32003)", () => maximalPower(5, 4)),
  resolutionCase("resolution: Koszul complex on 10 variables, GF(32003)", () => variablesIdeal(10)),
  resolutionCase("resolution: Pluecker ideal of G(2,6), GF(32003)", () => pluckerIdeal(6)),
  // over Q: the same ideal as over GF(32003), and random quadrics (coefficient growth)
  resolutionCase("resolution: 2x2 minors of generic 2x6, over Q", () => genericMinors2(6, A.QQ)),
  resolutionCase("resolution: 2x2 minors of generic 2x6, GF(32003)", () => genericMinors2(6)),
  resolutionCase("resolution: 4 random quadrics in 5 variables, over Q", () => randomQuadrics(5, 4, A.QQ)),
  resolutionCase("resolution: 4 random quadrics in 5 variables, GF(32003)", () => randomQuadrics(5, 4, F)),
];
