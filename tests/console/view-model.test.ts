import { describe, expect, it } from "vitest";
import { noteOfValue, texOfModule, viewOfValue } from "@/app/_console/render/view-model";

describe("viewOfValue", () => {
  it("shows an Experiment (a background sweep) as its text, with done/total", async () => {
    const { encodeValue } = await import("@/lib/notation/json");
    const j = encodeValue({
      type: "Experiment",
      id: "00000000-0000-4000-8000-000000000003",
      status: "queued",
      done: 0,
      total: 30,
      failures: 0,
    });
    const v = viewOfValue(j);
    expect(v.kind).toBe("text");
    if (v.kind === "text")
      expect(v.text).toMatch(/^experiment 00000000-0000-4000-8000-000000000003: queued, 0\/30 members done — runs in the background/);
  });

  it("turns a §9 BettiTable into a grid, truncated when incomplete", () => {
    // Betti numbers of S/<xy, yz> over k[x,y,z]: <xy, yz> = y·<x, z>, resolved by
    // 0 ← S ← S(−2)^2 ← S(−3) ← 0 (Eisenbud, The Geometry of Syzygies, 2005, Ch. 1).
    const v = viewOfValue({
      type: "BettiTable",
      text: "",
      entries: [
        [0, 0, 1],
        [1, 2, 2],
        [2, 3, 1],
      ],
      complete: false,
    });
    expect(v.kind).toBe("betti");
    if (v.kind !== "betti") return;
    expect(v.grid.rows.map((r) => r.cells)).toEqual([
      [1, null, null],
      [null, 2, 1],
    ]);
    expect(v.grid.totals).toEqual([1, 2, 1]);
    expect(v.grid.truncated).toBe(true);
  });

  it("a local ring is drawn localised at its point, not as the global ring (issue 16)", () => {
    const origin = viewOfValue({ type: "Ring", text: "", field: "Q", vars: ["x", "y"], ideal: ["y^2-x^3"], local: { at: ["0", "0"] } });
    expect(origin).toMatchObject({ kind: "tex" });
    if (origin.kind === "tex") expect(origin.tex).toMatch(/_\{\\mathfrak\{m\}_\{0\}\}$/);
    const point = viewOfValue({ type: "Ring", text: "", field: "Q", vars: ["x", "y"], ideal: [], local: { at: ["1/2", "3"] } });
    if (point.kind === "tex") expect(point.tex).toContain("\\mathfrak{m}_{(\\tfrac{1}{2}, 3)}");
  });

  it("typesets rings, ideals and a Series with its number of computed terms", () => {
    const ring = viewOfValue({ type: "Ring", text: "", field: "GF(32003)", vars: ["x", "y"], ideal: ["x*y"] });
    expect(ring).toEqual({ kind: "tex", tex: "\\mathbb{F}_{32003}[x, y] / \\left\\langle xy \\right\\rangle" });
    const s = viewOfValue({ type: "Series", text: "", coefficients: ["1", "2", "4"], rational: "1/(1-2*t)" });
    expect(s.kind).toBe("series");
    // issue 16: `checked` counts the terms beyond those the fit used; absent means none
    if (s.kind === "series")
      expect(s.note).toBe("guessed rational function (not a proof): it reproduces 0 computed terms beyond those it was fitted to");
    const checked = viewOfValue({ type: "Series", text: "", coefficients: ["1", "2", "4", "8"], rational: "1/(1-2*t)", checked: 2 });
    if (checked.kind === "series") expect(checked.note).toContain("reproduces 2 computed terms beyond");
    // the computed terms are shown, with the guess beside them
    if (s.kind === "series") expect(s.tex).toMatch(/^1 \+ 2 ?t \+ 4 ?t\^\{2\} \+ O.*\\qquad /);
    const none = viewOfValue({ type: "Series", text: "", coefficients: ["1", "2"], rational: null });
    expect(none).toMatchObject({ kind: "series", note: "2 terms computed; no rational function found that fits them" });
  });

  it("draws modules: 0, graded free modules with their twists, a cokernel with its generators' degrees", () => {
    const S = { type: "Ring", text: "Q[x, y]", field: "Q", vars: ["x", "y"], ideal: [] };
    expect(texOfModule([], [], S)).toBe("0");
    // R^[0, 1, 1] = R ⊕ R(−1)^2 (the twist R(−d) is generated in degree d; common practice)
    expect(texOfModule([[], [], []], [0, 1, 1], S)).toBe("\\mathbb{Q}[x, y] \\oplus \\mathbb{Q}[x, y](-1)^{2}");
    expect(texOfModule([["x", "y"]], [0], S)).toMatch(/^\\operatorname\{coker\} /);
    expect(texOfModule([["x"], ["y"]], [0, 1], S)).toMatch(/generators in degrees 0, 1/);
    const R = { ...S, text: "Q[x, y] / <x*y>", ideal: ["x*y"] };
    expect(texOfModule([[]], [2], R)).toMatch(/^\\left\(.*\\right\)\(-2\)$/);
  });

  it("a value's own warning is shown in words under it", () => {
    expect(noteOfValue({ type: "Int", text: "0 (…)", value: "0", note: "depth 1: computed after factoring out random forms" })).toBe(
      "depth 1: computed after factoring out random forms",
    );
    expect(noteOfValue({ type: "Int", text: "3", value: "3" })).toBeNull();
    expect(viewOfValue({ type: "Int", text: "0 (depth 1: …)", value: "0", note: "depth 1: …" })).toEqual({ kind: "text", text: "0" });
  });

  it("falls back to text for unknown types and malformed values", () => {
    expect(viewOfValue({ type: "Gadget", text: "a gadget" })).toEqual({ kind: "text", text: "a gadget" });
    expect(viewOfValue({ type: "Ideal", text: "<x>" })).toEqual({ kind: "text", text: "<x>" });
  });
});
