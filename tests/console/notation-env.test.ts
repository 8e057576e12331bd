import { describe, expect, it } from "vitest";
import { envFromObjects, typeOfValueJson } from "@/lib/editor/notation-env";

describe("envFromObjects", () => {
  it("gives rings their variables and picks the newest ring as current", () => {
    // lib/notation/README.md (JSON encoding): a Ring's JSON carries "vars"; the checker needs them to read literals.
    const env = envFromObjects([
      { name: "S", type: "Ring", value: { type: "Ring", vars: ["x", "y", "z"] }, updatedAt: "2026-01-01T00:00:00Z" },
      { name: "I", type: "Ideal", value: { type: "Ideal" }, updatedAt: "2026-01-02T00:00:00Z" },
      { name: "A", type: "Ring", value: { type: "Ring", vars: ["a", "b"] }, updatedAt: "2026-01-03T00:00:00Z" },
    ]);
    expect(env.bindings.S).toEqual({ kind: "Ring", vars: ["x", "y", "z"] });
    expect(env.bindings.I).toEqual({ kind: "Ideal" });
    expect(env.currentRing).toBe("A");
  });

  it("has no current ring without rings", () => {
    expect(envFromObjects([{ name: "n", type: "Int", value: { type: "Int" } }]).currentRing).toBeNull();
  });

  it("types lists by their first item and unknown JSON as Any", () => {
    expect(typeOfValueJson({ type: "List", items: [{ type: "Ideal" }] })).toEqual({ kind: "List", item: { kind: "Ideal" } });
    expect(typeOfValueJson({ type: "Mystery" })).toEqual({ kind: "Any" });
    expect(typeOfValueJson(null)).toEqual({ kind: "Any" });
  });
});
