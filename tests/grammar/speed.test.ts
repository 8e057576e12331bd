/// How fast `analyze` is on a 50-line program, printed as a ratio to lexing alone
/// (never asserted: wall-clock times vary by machine). The program must check clean.
import { expect, test } from "vitest";
import { analyze, tokenize } from "@/grammar/index";

const LINES = ["S := GF(32003)[x, y, z, w]", "I := <x*z, x*w, y*z, y*w>", "J := <x - z, y - w>", "R := S / I", "A := [x, y, z; y, z, w]"];
for (let i = 0; i < 45; i++) {
  LINES.push(
    [
      `f${i} := (x + ${i}*y)^3 - 3/4*z^2*w`,
      `b${i} := [burch_index(S / S.maximal^p) for p in 2..${i + 2}]`,
      `r${i} := {index: R.burch_index, depth: R.depth, ok: x*z in I and not w in J}`,
      `c${i} := resolve(S / (I + J), length = ${i % 5}).betti`,
      `m${i} := minors(A, 2) : <x> & saturate(I, S.maximal)`,
    ][i % 5],
  );
}
const PROGRAM = LINES.join("\n");

test("a 50-line program: analysis time relative to lexing (printed)", () => {
  expect(LINES).toHaveLength(50);
  expect(analyze(PROGRAM).errors).toEqual([]);
  // CPU time of this process, so other load on the machine does not count.
  const time = (f: () => void, n: number) => {
    const t0 = process.cpuUsage();
    for (let i = 0; i < n; i++) f();
    const d = process.cpuUsage(t0);
    return (d.user + d.system) / 1000 / n;
  };
  const n = 30;
  time(() => analyze(PROGRAM), 10); // warm up the JIT first
  const lex = time(() => tokenize(PROGRAM), n);
  const full = time(() => analyze(PROGRAM), n);
  console.log(`analyze 50 lines: ${full.toFixed(2)} ms of CPU per run; ${(full / lex).toFixed(1)}× the time of tokenizing alone`);
});
