/// Export keeps what could mislead a reader (issue 8: "truncation notes kept"; the rule that
/// a guessed rational function, a truncated resolution and a random choice say so): values
/// come from the real evaluator, so the test follows the §9 shapes it actually produces.
import { describe, expect, it } from "vitest";
import { valueTex } from "@/lib/export/tex";
import { evaluate } from "@/lib/notation/evaluate";
import type { ValueJsonLike } from "@/lib/export/transcript";
import { transcriptToMarkdown } from "@/lib/export/markdown";

async function lastValue(source: string): Promise<ValueJsonLike> {
  const out = await evaluate(source, [], { currentRing: null });
  expect(out.error?.text ?? null).toBeNull();
  return out.results[out.results.length - 1]!.value as ValueJsonLike;
}

function markdownOf(v: ValueJsonLike): string {
  return transcriptToMarkdown({
    title: "notes",
    ownerName: "Harbor tester",
    exportedAt: "2026-12-02T00:00:00.000Z",
    cells: [{ position: 0, source: "…", status: "done", results: [{ statement: 0, value: v }], error: null }],
    objects: [],
  });
}

describe("notes survive export", () => {
  it("a guessed Poincaré series: the terms in math, the guess called a guess", async () => {
    // P_k(t) = 1/(1 − 3t) over k[x,y,z]/m^2: a ring with m^2 = 0 and embedding dimension e
    // has P_k = 1/(1 − e·t), since every syzygy module of k is a k-vector space
    // (common practice; a special case of Golod 1962).
    const v = await lastValue("S := GF(101)[x, y, z]\nR := S / S.maximal^2\npoincare(R.residue, terms = 6)");
    const tex = valueTex(v);
    expect(tex).toContain("$1 + 3 t + 9 t^{2} + 27 t^{3} + 81 t^{4} + 243 t^{5} + O(t^{6})$");
    // 1/(1 − 3t) is fixed by 2 terms, so 4 of the 6 confirm it (issue 16: checked counts those)
    expect(tex).toMatch(
      /\\emph\{Guessed rational function \}\$1\/\(1 - 3 t\)\$\\emph\{: it reproduces 4 computed terms beyond those it was fitted to; a guess, not a proof\.\}/,
    );
    expect(markdownOf(v)).toMatch(/> Guessed rational function \$1\/\(1 - 3 t\)\$: it reproduces 4 computed terms beyond/);
  });

  it("too few terms: no guess, and the export says none was found", async () => {
    // issue 16: 2 terms already determine a guess (1/(1 − 3t), confirmed by none); 1 term does not
    const v = await lastValue("S := GF(101)[x, y, z]\nR := S / S.maximal^2\npoincare(R.residue, terms = 1)");
    expect(valueTex(v)).toMatch(/No rational function was found that fits the 1 computed terms/);
  });

  it("a Burch index after a random linear form: the number in math, the seed and form in words", async () => {
    const v = await lastValue("S := GF(101)[x, y, z]\nburch_index(S / <x^2, y*z>)");
    const tex = valueTex(v);
    expect(tex.startsWith(`$${String(v.value)}$`)).toBe(true);
    expect(tex).toMatch(/\\emph\{Depth 1: .*random \(seed \d+\)/);
  });

  it("a resolution cut by its length bound keeps the reason", async () => {
    const v = await lastValue("S := GF(101)[x, y, z]\nR := S / <x^2, y*z>\nresolve(R / R.maximal, length = 3)");
    expect(v.complete).toBe(false);
    const md = markdownOf(v);
    expect(md).toMatch(/> Truncated: only/);
    expect(md).toContain(String(v.note).slice(1, 20));
  });
});
