// Random programs never make the evaluator throw: every outcome is a result or an Error
// with a kind and a span inside the program.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";

const atoms = [
  "x",
  "y",
  "0",
  "1",
  "2",
  "3/4",
  "<x>",
  "<x, y>",
  "<0>",
  "[1, 2]",
  "S",
  "S.maximal",
  "true",
  '"s"',
  "none",
  "(S / <x^2>)",
  "f",
];
const binary = ["+", "-", "*", "/", "^", ":", "&", "==", "!=", "<=", "<", "in", "and", "or"];

const expr: fc.Arbitrary<string> = fc.letrec<{ e: string }>((tie) => ({
  e: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    fc.constantFrom(...atoms),
    fc.tuple(tie("e"), fc.constantFrom(...binary), tie("e")).map(([a, op, b]) => `(${a} ${op} ${b})`),
    fc.tuple(tie("e"), fc.constantFrom(".gens", ".dim", ".hilbert", ".length", ".groebner", "[0]", ".vars")).map(([a, p]) => `(${a})${p}`),
    tie("e").map((a) => `[${a} for i in 0..2]`),
    tie("e").map((a) => `if ${a} then 1 else 0`),
    tie("e").map((a) => `sum([${a}, ${a}])`),
  ),
})).e;

describe("random programs", () => {
  it("end with results or with an Error that has a kind and a span", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(expr, { minLength: 1, maxLength: 3 }), async (lines) => {
        const source = ["S := Q[x, y]", "f := I -> I + <y>", ...lines].join("\n");
        const out = await evaluate(source, [], { engineLimits: { maxBasisSize: 2000, maxTerms: 20000, maxDegree: 60 } });
        if (out.status === "ok") {
          expect(out.results).toHaveLength(lines.length + 2);
          return;
        }
        expect(["parse", "type", "runtime", "limit"]).toContain(out.error!.kind);
        const { from, to } = out.error!.span;
        expect(from.line).toBeGreaterThanOrEqual(1);
        expect(to.line).toBeLessThanOrEqual(lines.length + 3);
        expect(out.error!.message).not.toMatch(/^internal error/);
        expect(out.error!.message).not.toMatch(/a defect of Ringside/);
      }),
      { numRuns: 150, seed: 20261201 },
    );
  });
});
