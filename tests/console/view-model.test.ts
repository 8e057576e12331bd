import { describe, expect, it } from "vitest";
import { viewOfValue } from "@/app/_console/render/view-model";

describe("viewOfValue", () => {
  it("turns a §9 BettiTable into a grid, truncated when incomplete", () => {
    // Betti numbers of S/<xy, yz> over k[x,y,z]: <xy, yz> = y·<x, z>, resolved by
    // 0 ← S ← S(−2)^2 ← S(−3) ← 0 (Eisenbud, The Geometry of Syzygies, 2005, Ch. 1).
    const v = viewOfValue({ type: "BettiTable", text: "", entries: [[0, 0, 1], [1, 2, 2], [2, 3, 1]], complete: false });
    expect(v.kind).toBe("betti");
    if (v.kind !== "betti") return;
    expect(v.grid.rows.map((r) => r.cells)).toEqual([[1, null, null], [null, 2, 1]]);
    expect(v.grid.totals).toEqual([1, 2, 1]);
    expect(v.grid.truncated).toBe(true);
  });

  it("typesets rings, ideals and a Series with its number of computed terms", () => {
    const ring = viewOfValue({ type: "Ring", text: "", field: "GF(32003)", vars: ["x", "y"], ideal: ["x*y"] });
    expect(ring).toEqual({ kind: "tex", tex: "\\mathbb{F}_{32003}[x, y] / \\left\\langle xy \\right\\rangle" });
    const s = viewOfValue({ type: "Series", text: "", coefficients: ["1", "2", "4"], rational: "1/(1-2*t)" });
    expect(s.kind).toBe("series");
    if (s.kind === "series") expect(s.note).toContain("3 terms");
  });

  it("falls back to text for unknown types and malformed values", () => {
    expect(viewOfValue({ type: "Gadget", text: "a gadget" })).toEqual({ kind: "text", text: "a gadget" });
    expect(viewOfValue({ type: "Ideal", text: "<x>" })).toEqual({ kind: "text", text: "<x>" });
  });
});
