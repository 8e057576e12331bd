import { describe, expect, it } from "vitest";
import { completionPlace } from "@/lib/editor/completion-context";

// Positions are given by a `|` in the text, removed before classifying.
const at = (marked: string) => {
  const pos = marked.indexOf("|");
  return completionPlace(marked.slice(0, pos) + marked.slice(pos + 1), pos);
};

describe("completionPlace", () => {
  it("recognises a property after a dot (grammar/signatures.ts: R.vars)", () => {
    expect(at("R.|")).toEqual({ kind: "property", dot: 1, from: 2 });
    expect(at("resolve(S / I).be|")).toEqual({ kind: "property", dot: 14, from: 15 });
  });

  it("does not take a range `..` for a property", () => {
    expect(at("2..|").kind).toBe("name");
  });

  it("offers options inside a call (grammar/signatures.ts: resolve(M, length = n))", () => {
    expect(at("resolve(|")).toEqual({ kind: "option", fn: "resolve", from: 8 });
    expect(at("resolve(S / I, le|")).toEqual({ kind: "option", fn: "resolve", from: 15 });
    expect(at("resolve(S / <x*y, |").kind).toBe("name");
  });

  it("offers ring options after `;` in ring brackets (grammar/README.md §4)", () => {
    expect(at("Q[x, y; |")).toEqual({ kind: "ring-option", from: 8 });
    expect(at("Q[x, |").kind).toBe("name");
  });

  it("falls back to a plain name, also across lines", () => {
    expect(at("S := Q[x]\nbur|")).toEqual({ kind: "name", from: 10 });
    expect(at("resolve(x)\n|").kind).toBe("name");
  });
});
