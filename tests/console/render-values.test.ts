/// The console's value rendering (issue 18, point 4) and copy formats (point 5): pure
/// functions of the §9 JSON.
import { describe, expect, it } from "vitest";
import { copyFormats, copyText, csvOf } from "@/app/_console/render/copy-formats";
import { hilbertFacts } from "@/app/_console/render/hilbert";
import { resolutionView, ringNameOf, texOfTwistedFree } from "@/app/_console/render/resolution";
import { typeWords } from "@/app/_console/render/type-words";
import { viewOfValue } from "@/app/_console/render/view-model";
import type { ValueReading as ValueJson } from "@/lib/wire/reading";

const S: ValueJson = {
  type: "Ring",
  text: "Q[x, y, z]",
  field: "Q",
  vars: ["x", "y", "z"],
  degrees: [1, 1, 1],
  order: "grevlex",
  ideal: [],
};
// The resolution of S/(xy, yz, xz), three coordinate points of P²:
// 0 ← S ← S(−2)³ ← S(−3)² ← 0 (Eisenbud, The Geometry of Syzygies, GTM 229, §3A; the
// Hilbert–Burch matrix is the second differential).
const threePoints = {
  type: "Complex",
  text: "complex of ranks 1, 3, 2",
  ranks: [1, 3, 2],
  betti: [
    [0, 0, 1],
    [1, 2, 3],
    [2, 3, 2],
  ],
  complete: true,
  maps: [
    { type: "Matrix", text: "[x*y, x*z, y*z]", rows: [["x*y", "x*z", "y*z"]] },
    {
      type: "Matrix",
      text: "[z, 0; -y, y; 0, -x]",
      rows: [
        ["z", "0"],
        ["-y", "y"],
        ["0", "-x"],
      ],
    },
  ],
  ring: S,
} as unknown as ValueJson;

describe("a free resolution shows its free modules with their twists over the named ring", () => {
  it("names the ring by the session's binding and twists each summand", () => {
    expect(
      ringNameOf(S, [
        { name: "T", value: { ...S, vars: ["a"] } },
        { name: "S", value: S },
      ]),
    ).toBe("S");
    const r = resolutionView(threePoints as never, "S");
    expect(r.modules).toEqual(["S", "S(-2)^{3}", "S(-3)^{2}"]);
    expect(r.chain).toBe("0 \\leftarrow S \\leftarrow S(-2)^{3} \\leftarrow S(-3)^{2} \\leftarrow 0");
    expect(r.differentials).toHaveLength(2);
    expect(r.differentials![1]).toContain("\\begin{pmatrix}");
  });

  it("mixes twists in one module, lowest degree first, and falls back to R without a name", () => {
    expect(
      texOfTwistedFree("S", [
        [3, 1],
        [2, 2],
      ]),
    ).toBe("S(-2)^{2} \\oplus S(-3)");
    const v = viewOfValue(threePoints);
    expect(v.kind).toBe("complex");
    if (v.kind === "complex") expect(v.resolution.modules[1]).toBe("R(-2)^{3}");
    const named = viewOfValue(threePoints, { objects: [{ name: "S", value: S }] });
    if (named.kind === "complex") expect(named.resolutionText).toBe("0 <- S <- S(-2)^3 <- S(-3)^2 <- 0");
  });
});

describe("a Hilbert series shows reduced form, h-vector, dimension, degree and Hilbert polynomial", () => {
  it("three points of P²: (1 − 3t² + 2t³)/(1 − t)³ = (1 + 2t)/(1 − t), dimension 1, degree 3, P = 3", () => {
    // three points in P²: Hilbert polynomial is the constant 3 (common practice)
    const f = hilbertFacts(["1", "0", "-3", "2"], "(1-t)^3")!;
    expect(f.reduced).toBe("(1+2*t)/(1-t)");
    expect(f.hVector).toEqual([1n, 2n]);
    expect(f.dimension).toBe(1);
    expect(f.degree).toBe(3n);
    expect(f.polynomial).toBe("3");
  });

  it("the twisted cubic: (1 − 3t² + 2t³)/(1 − t)⁴ reduces to (1 + 2t)/(1 − t)², P(n) = 3n + 1", () => {
    // the twisted cubic curve in P³ has degree 3 and genus 0, so P(n) = 3n + 1 (from memory:
    // Hartshorne, Algebraic Geometry, I.7, P(n) = dn + 1 − g)
    const f = hilbertFacts(["1", "0", "-3", "2"], "(1-t)^4")!;
    expect(f.reduced).toBe("(1+2*t)/(1-t)^2");
    expect(f.dimension).toBe(2);
    expect(f.degree).toBe(3n);
    expect(f.polynomial).toBe("3*n+1");
  });

  it("a polynomial ring in 3 variables: P(n) = C(n + 2, 2) = n²/2 + 3n/2 + 1; Artinian: P = 0", () => {
    expect(hilbertFacts(["1"], "(1-t)^3")!.polynomial).toBe("1/2*n^2+3/2*n+1");
    // k[x, y]/(x², y²): h = (1, 2, 1), length 4 (common practice)
    const a = hilbertFacts(["1", "0", "-2", "0", "1"], "(1-t)^2")!;
    expect(a).toMatchObject({ dimension: 0, degree: 4n, polynomial: "0" });
    expect(a.hVector).toEqual([1n, 2n, 1n]);
    expect(hilbertFacts(["1"], "(1-t)*(1-t^2)")).toBeNull();
    // k[x, y](1), generated in degree −1: dim of degree n is n + 2 (common practice)
    const shifted = hilbertFacts(["1"], "(1-t)^2", -1)!;
    expect(shifted).toMatchObject({ dimension: 2, degree: 1n, polynomial: "n+2" });
  });
});

describe("records and type tags", () => {
  it("keeps the field order the user wrote, whatever order storage gave the keys", () => {
    const v = viewOfValue({
      type: "Record",
      text: "{depth: 1, a: 2}",
      fields: { a: { type: "Int", text: "2" }, depth: { type: "Int", text: "1" } },
      fieldOrder: ["depth", "a"],
    } as unknown as ValueJson);
    expect(v.kind === "record" && v.fields.map(([k]) => k)).toEqual(["depth", "a"]);
  });

  it("writes type tags as words", () => {
    expect(typeWords("Complex")).toBe("free resolution");
    expect(typeWords("HilbertSeries")).toBe("Hilbert series");
    expect(typeWords("BettiTable")).toBe("Betti table");
    expect(typeWords("SomethingNew")).toBe("something new");
  });
});

describe("copy formats", () => {
  const betti = {
    type: "BettiTable",
    text: "…",
    entries: [
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 2],
    ],
    complete: true,
  } as unknown as ValueJson;

  it("offers CSV for tables only", () => {
    expect(copyFormats(betti)).toContain("csv");
    expect(copyFormats(S)).not.toContain("csv");
  });

  it("copies a Betti table as a LaTeX array with its totals row", () => {
    const tex = copyText(betti, "latex");
    expect(tex).toContain("\\begin{array}{r|rrr}");
    expect(tex).toContain("1 &  & 3 & 2 \\\\");
    expect(tex).toContain("\\text{total} & 1 & 3 & 2 \\\\");
  });

  it("copies Markdown and RFC 4180 CSV", () => {
    expect(copyText(betti, "markdown").split("\n")[0]).toBe("| j−i \\ i | 0 | 1 | 2 |");
    expect(copyText(betti, "csv")).toBe("j−i \\ i,0,1,2\r\n0,1,,\r\n1,,3,2\r\ntotal,1,3,2\r\n");
    expect(csvOf([["a,b", 'say "x"']])).toBe('"a,b","say ""x"""\r\n');
    expect(copyText(S, "latex")).toBe("$\\mathbb{Q}[x, y, z]$");
  });
});
