// Resolution rows of issue 17, run as notation programs through the evaluator — the code path
// of `npx ringside eval` and of a console cell — so the figures are what a user sees.
import { evaluate } from "../../lib/notation/evaluate";
import type { BenchCase } from "./cases";

/// Runs a program; the last statement's value is the printed label. An Error fails the case.
async function runProgram(source: string): Promise<{ size: number; label: string }> {
  let last = "";
  let failure: string | null = null;
  const outcome = await evaluate(source, [], {
    onEvent: (e) => {
      if (e.event === "result") last = e.value.text;
      if (e.event === "error") failure = e.error.text;
      if (e.event === "checked" && e.errors.length > 0) failure = e.errors.map((x) => x.text).join("; ");
    },
  });
  if (outcome.status !== "ok" || failure) throw new Error(`the program failed: ${failure ?? outcome.status}`);
  // The value's text is the result shown; no separate size.
  return { size: -1, label: last.length > 90 ? `${last.slice(0, 87)}…` : last };
}

function programCase(name: string, source: string, extra: Partial<BenchCase>): BenchCase {
  return { name, table: "resolution", run: () => runProgram(source), ...extra };
}

/// The generic alternating n×n matrix in the variables p1..p(n choose 2), as notation.
function skewMatrix(n: number): string {
  const idx = (i: number, j: number) => {
    let k = 0;
    for (let a = 0; a < n; a++)
      for (let b = a + 1; b < n; b++)
        if (a === i && b === j) return k + 1;
        else k++;
    return -1;
  };
  const rows: string[] = [];
  for (let i = 0; i < n; i++) {
    const row: string[] = [];
    for (let j = 0; j < n; j++) row.push(i === j ? "0" : i < j ? `p${idx(i, j)}` : `-p${idx(j, i)}`);
    rows.push(row.join(", "));
  }
  return `[${rows.join("; ")}]`;
}

const ANICK = "A := GF(32003)[x1..x5]\nB := A / <x1^2, x2^2, x4^2, x5^2, x1*x2, x4*x5, x1*x3 + x3*x4 + x2*x5>\n";
const CUBE = "S := GF(32003)[x, y, z]\nR := S / <x, y, z>^3\n";

export const notationCases: BenchCase[] = [
  programCase(
    "Plücker ideal of G(2,7), Betti totals",
    `S := GF(32003)[p1..p21]\nresolve(S / pfaffians(${skewMatrix(7)}, 4)).betti.totals`,
    {
      goal: { seconds: 4 },
      before: "12 s",
    },
  ),
  programCase("Koszul complex on 14 variables", "S := GF(32003)[x1..x14]\nresolve(S.residue).betti.totals", {
    goal: { seconds: 2, mb: 400 },
    before: "4.9 s, 0.9 GB",
  }),
  programCase("k over GF(32003)[x,y,z]/m^3, length 8", `${CUBE}resolve(R.residue, length = 8).betti.totals`, {
    goal: { seconds: 8, mb: 1024 },
    before: "out of memory at a 4 GB heap (CLI)",
  }),
  programCase("k over GF(32003)[x,y,z]/m^3, length 8, in a cell's 2 GB heap", `${CUBE}resolve(R.residue, length = 8).betti.totals`, {
    goal: { seconds: 8, mb: 1024 },
    before: "–",
    heapMb: 2048,
  }),
  programCase("k over GF(32003)[x,y,z]/m^3, length 9", `${CUBE}resolve(R.residue, length = 9).betti.totals`, {
    goal: { seconds: 40, mb: 2048 },
    before: "–",
    timeoutS: 400,
  }),
  programCase("Anick-shaped ring, poincare(k, terms = 8)", `${ANICK}poincare(B.residue, terms = 8)`, { before: "10.6 s, 1.6 GB" }),
  programCase("Anick-shaped ring, poincare(k, terms = 9)", `${ANICK}poincare(B.residue, terms = 9)`, {
    before: "out of a 4 GB heap",
    timeoutS: 400,
  }),
  programCase("Anick-shaped ring, poincare(k, terms = 10)", `${ANICK}poincare(B.residue, terms = 10)`, {
    before: "not measured (terms = 9 took 16.5 s before the sparse echelon's pivot table)",
    timeoutS: 300,
  }),
  programCase("Anick-shaped ring, poincare(k, terms = 11)", `${ANICK}poincare(B.residue, terms = 11)`, {
    goal: { mb: 2048 },
    before: "never reached",
    timeoutS: 300,
  }),
];
