import { describe, expect, it } from "vitest";
import katex from "katex";
import { texOfExpression, texOfIdeal, texOfMatrix, texOfVariable, texOrVerbatim } from "@/app/_console/render/tex";
import { texOfHilbertSeries, ascendingPolyText } from "@/app/_console/render/series";
import { texOfRankChain } from "@/app/_console/render/chain";

// Every TeX string must be accepted by KaTeX itself (the renderer the page uses).
const parses = (tex: string) => expect(() => katex.renderToString(tex, { throwOnError: true })).not.toThrow();

describe("texOfExpression", () => {
  it("typesets the canonical text of lib/notation/README.md (the JSON encoding)", () => {
    expect(texOfExpression("x^2*y-2*x+3")).toBe("x^{2}y - 2x + 3");
    expect(texOfExpression("3/4*x^2-y")).toBe("\\frac{3}{4}x^{2} - y");
    expect(texOfExpression("-x*y")).toBe("-xy");
  });

  it("keeps a visible product sign before a digit", () => {
    expect(texOfExpression("2*3")).toBe("2 \\cdot 3");
  });

  it("subscripts indexed variables and keeps primes", () => {
    expect(texOfVariable("x12")).toBe("x_{12}");
    expect(texOfVariable("y_2")).toBe("y_{2}");
    expect(texOfVariable("a'")).toBe("a'");
    expect(texOfVariable("alpha")).toBe("\\mathit{alpha}");
    expect(texOfExpression("x1^3*x2")).toBe("x_{1}^{3}x_{2}");
  });

  it("typesets rational functions", () => {
    expect(texOfExpression("(1+t)/(1-t)^3")).toBe("\\frac{1 + t}{\\left(1 - t\\right)^{3}}");
  });

  it("returns null for text outside the arithmetic form, and verbatim escapes it", () => {
    expect(texOfExpression("x +* y")).toBeNull();
    expect(texOfExpression("")).toBeNull();
    const v = texOrVerbatim("a{b}_c^d");
    expect(v.startsWith("\\texttt{")).toBe(true);
    parses(v);
  });

  it("produces TeX KaTeX accepts", () => {
    for (const t of ["x^2*y-2*x+3", "3/4*x^2-y", "(1+t)/(1-t)^3", "x1^3*x2-a'*b_7"]) parses(texOfExpression(t)!);
    parses(texOfIdeal(["x*y", "y*z"]));
    parses(texOfIdeal([]));
    parses(
      texOfMatrix([
        ["x", "y", "z"],
        ["y", "z", "w"],
      ]),
    );
  });
});

describe("series and chains", () => {
  it("writes a Hilbert numerator in ascending powers", () => {
    // Twisted cubic: H(t) = (1 − 3t² + 2t³)/(1 − t)⁴ (its Betti numbers 1, 3, 2 in
    // degrees 0, 2, 3; Eisenbud, The Geometry of Syzygies, 2005, Ch. 1).
    expect(ascendingPolyText(["1", "0", "-3", "2"])).toBe("1-3*t^2+2*t^3");
    const tex = texOfHilbertSeries(["1", "0", "-3", "2"], "(1-t)^4");
    expect(tex).toBe("\\frac{1 - 3t^{2} + 2t^{3}}{\\left(1 - t\\right)^{4}}");
    parses(tex);
    // issue 16: a module generated in degree −2 has the factor t^{-2} in front
    expect(texOfHilbertSeries(["1", "-2", "1"], "(1-t)^2", -2)).toMatch(/^t\^\{-2\} \\cdot \\frac/);
  });

  it("writes a resolution as a chain of ranks", () => {
    expect(texOfRankChain([1, 3, 2], true)).toBe("0 \\leftarrow R \\leftarrow R^{3} \\leftarrow R^{2} \\leftarrow 0");
    expect(texOfRankChain([1, 4], false)).toContain("\\cdots");
    parses(texOfRankChain([1, 3, 2], true));
  });
});
