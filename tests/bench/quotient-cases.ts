// Quotient-ring benchmarks (issue 6). Hook into the runner by adding `...quotientCases` to
// the `cases` list in tests/bench/cases.ts (import { quotientCases } from "./quotient-cases").
import * as A from "../../lib/algebra/index";
import { burchIndexOfRing } from "../../lib/algebra/burch/index";
import { residueFieldResolution } from "../../lib/algebra/resolution/graded-quotient/index";
import { randomForm } from "../algebra/local-helpers";
import type { BenchCase } from "./cases";

const F = A.gf(32003);

function ring(n: number): A.PolyRing {
  return A.polyRing(
    F,
    Array.from({ length: n }, (_, i) => `x${i + 1}`),
  );
}

/// Park–Miller generator with a fixed seed, so every run benchmarks the same input.
function seeded(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647);
}

/// A guard only: with sparse vectors and per-multidegree blocks both cases finish far below it.
const MAX_PIECE = 200000;

function residueCase(name: string, J: () => A.Ideal, length: number, before: string): BenchCase {
  return {
    name,
    run: () => {
      const done: number[] = [];
      try {
        residueFieldResolution(J(), length, { partial: (c) => done.push(c.total), limits: { maxBasisSize: MAX_PIECE } });
      } catch (e) {
        if (!(e instanceof A.AlgebraError && e.kind === "limit")) throw e;
        return {
          size: done.reduce((s, b) => s + b, 0),
          label: `stopped by maxBasisSize ${MAX_PIECE} after Betti totals ${done.join(",")}, sum`,
        };
      }
      return { size: done.reduce((s, b) => s + b, 0), label: `(before sparse blocks: ${before}) Betti totals ${done.join(",")}, sum` };
    },
  };
}

const maximal = (S: A.PolyRing) =>
  A.ideal(
    S,
    S.vars.map((_, i) => A.variable(S, i)),
  );

export const quotientCases: BenchCase[] = [
  residueCase(
    "residue field over k[x1..x4]/(4 random quadrics), length 10",
    () => {
      const S = ring(4);
      const next = seeded(2026);
      return A.ideal(
        S,
        [0, 1, 2, 3].map(() => randomForm(S, 2, next)),
      );
    },
    10,
    "5.5 s",
  ),
  residueCase(
    "residue field over k[x,y,z]/m^3, length 8",
    () => A.idealPower(maximal(ring(3)), 3),
    8,
    "stopped by the piece-size limit 2500 after β_5 in 0.8 s; dense pieces of ~58 000 coordinates",
  ),
  {
    name: "Burch index of a random m-primary ideal in 4 variables",
    run: () => {
      const S = ring(4);
      const next = seeded(7);
      const gens = [...[0, 1, 2, 3].map(() => randomForm(S, 2, next)), randomForm(S, 3, next)];
      const r = burchIndexOfRing(A.ideal(S, gens));
      return { size: r.index, label: "Burch index" };
    },
  },
];
