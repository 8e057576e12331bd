// Hover documentation in the input comes from the signature table (grammar/signatures.ts,
// grammar/README.md), the table the checker, completion and /reference also read.
import { describe, expect, it } from "vitest";
import { analyze, EMPTY_ENV, formatOverload, formatProperty, lookupFunction, propertiesOf, RING_OPTIONS } from "@/grammar";
import type { Env } from "@/grammar/analysis";
import { envFromObjects } from "@/lib/editor/notation-env";
import { hoverDoc } from "@/lib/editor/notation-hover";

const hover = (source: string, pos: number, env: Env = EMPTY_ENV) => hoverDoc({ analyze, env: () => env }, source, pos);

describe("hover documentation", () => {
  it("shows a function's overloads, description and example, as /reference prints them", () => {
    const source = "resolve(M)";
    const doc = hover(source, 3)!;
    const f = lookupFunction("resolve")!;
    expect(doc).toMatchObject({ from: 0, to: 7, description: f.description, example: f.example });
    expect(doc.signatures).toEqual(f.overloads.map((o) => formatOverload(f, o)));
  });

  it("shows the property of the value's own type after a dot", () => {
    const env = envFromObjects([{ name: "R", type: "Ring", value: { type: "Ring", vars: ["x", "y"] } }]);
    const doc = hover("R.vars", 4, env)!;
    const vars = propertiesOf("Ring").find((p) => p.name === "vars")!;
    expect(doc.signatures).toEqual([formatProperty(vars)]);
    expect(doc.description).toBe(vars.description);
    expect(doc).toMatchObject({ from: 2, to: 6 });
  });

  it("shows a ring option inside ring brackets", () => {
    const source = "Q[x, y; order = lex]";
    const doc = hover(source, source.indexOf("order") + 1)!;
    const order = RING_OPTIONS.find((o) => o.name === "order")!;
    expect(doc.description).toContain(order.description);
  });

  it("has nothing for a binding, a number or blank space", () => {
    expect(hover("myIdeal + 1", 2)).toBeNull();
    expect(hover("myIdeal + 1", 10)).toBeNull();
    expect(hover("x  y", 2)).toBeNull();
  });
});
