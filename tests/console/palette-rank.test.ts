/// The palette ranks word starts above scattered letters (issue 18, point 7).
import { describe, expect, it } from "vitest";
import { paletteScore } from "@/app/_console/render/palette-rank";

const rank = (search: string, labels: string[]) =>
  labels
    .map((l) => [l, paletteScore(l, search)] as const)
    .filter(([, s]) => s > 0)
    .sort((a, b) => b[1] - a[1])
    .map(([l]) => l);

describe("palette ranking", () => {
  it("puts a match at a word start above the same letters scattered", () => {
    // "ex" starts "Export…" but is scattered in "Next cell"
    expect(rank("ex", ["Run the next cell", "Export the session as LaTeX"])).toEqual(["Export the session as LaTeX", "Run the next cell"]);
    expect(rank("hist", ["Show the keyboard shortcuts", "Search the input history"])).toEqual(["Search the input history"]);
  });

  it("ranks initials above letters inside a word, and those above scattered ones", () => {
    const s = (l: string) => paletteScore(l, "ns");
    expect(s("New session")).toBeGreaterThan(s("Transcript options"));
    expect(paletteScore("Open the notation reference", "ref")).toBeGreaterThan(paletteScore("Prefer dark theme", "ref"));
  });

  it("needs every typed word, and matches keywords at a lower rank", () => {
    expect(paletteScore("New session", "new zzz")).toBe(0);
    expect(paletteScore("Insert name: I (Ideal)", "groebner", ["groebner basis of I"])).toBeGreaterThan(0);
    expect(paletteScore("Insert name: I (Ideal)", "groebner", ["groebner basis of I"])).toBeLessThan(
      paletteScore("Groebner basis", "groebner"),
    );
    expect(paletteScore("anything", "  ")).toBe(1);
  });
});
