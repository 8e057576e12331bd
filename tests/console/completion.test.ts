import { describe, expect, it } from "vitest";
import { CompletionContext, type CompletionResult } from "@codemirror/autocomplete";
import { EditorState } from "@codemirror/state";
import { analyze, EMPTY_ENV, lookupFunction, propertiesOf } from "@/grammar";
import type { Env } from "@/grammar/analysis";
import { notationCompletionSource } from "@/lib/editor/notation-completion";
import { envFromObjects } from "@/lib/editor/notation-env";

function complete(doc: string, env: Env = EMPTY_ENV): CompletionResult | null {
  const source = notationCompletionSource({ analyze, env: () => env });
  const result = source(new CompletionContext(EditorState.create({ doc }), doc.length, false));
  return result instanceof Promise ? null : result;
}

describe("notation completion from the signature table", () => {
  it("offers a ring's properties with their descriptions after `R.`", () => {
    const env = envFromObjects([{ name: "R", type: "Ring", value: { type: "Ring", vars: ["x", "y"] } }]);
    const r = complete("R.", env)!;
    const labels = r.options.map((o) => o.label);
    // grammar/signatures.ts lists R.vars, R.dim, R.depth, R.is_gorenstein among Ring properties.
    for (const name of ["vars", "dim", "depth", "is_gorenstein"]) expect(labels).toContain(name);
    const vars = r.options.find((o) => o.label === "vars")!;
    expect(vars.info).toBe(propertiesOf("Ring").find((p) => p.name === "vars")!.description);
  });

  it("offers a Complex's properties after a call that returns one", () => {
    const env = envFromObjects([{ name: "S", type: "Ring", value: { type: "Ring", vars: ["x", "y", "z"] } }]);
    const labels = complete("resolve(S / <x*y, y*z>).", { ...env, currentRing: "S" })!.options.map((o) => o.label);
    // grammar/signatures.ts: C.betti, C.ranks, C.length, C.map(i), C.complete.
    expect(labels).toEqual(expect.arrayContaining(["betti", "ranks", "length", "map", "complete"]));
  });

  it("offers resolve's named options inside its parentheses", () => {
    const r = complete("resolve(")!;
    const resolve = lookupFunction("resolve")!;
    for (const o of resolve.options) {
      const item = r.options.find((c) => c.label === o.name);
      expect(item?.info).toBe(o.description);
    }
    // grammar/signatures.ts: resolve(M, length = n, degree = d)
    expect(resolve.options.map((o) => o.name)).toEqual(expect.arrayContaining(["length", "degree"]));
  });

  it("offers functions and session names while a word is typed, nothing on an empty line", () => {
    const env = envFromObjects([{ name: "tide", type: "Ideal", value: { type: "Ideal" } }]);
    const labels = complete("ti", env)!.options.map((o) => o.label);
    expect(labels).toContain("tide");
    expect(labels).toContain("resolve");
    expect(complete("")).toBeNull();
  });
});
