import { describe, expect, it } from "vitest";
import { errorCaret } from "@/app/_console/render/caret";

describe("errorCaret", () => {
  it("puts carets under a one-line span (to exclusive, 1-based)", () => {
    // grammar/README.md §8: "type error at 1:13-1:14" names columns 13 up to 14.
    const c = errorCaret("I := <x>\nburch_index(I)", { from: { line: 2, col: 13 }, to: { line: 2, col: 14 } });
    expect(c.lineNumber).toBe(2);
    expect(c.line).toBe("burch_index(I)");
    expect(c.caret).toBe(" ".repeat(12) + "^");
    expect(c.location).toBe("2:13-14");
  });

  it("underlines to the end of the line when the span runs on", () => {
    const c = errorCaret("f := (x +\n y", { from: { line: 1, col: 6 }, to: { line: 2, col: 3 } });
    expect(c.caret).toBe("     ^^^^");
    expect(c.location).toBe("1:6-2:3");
  });

  it("gives one caret for an empty span at the end of the line", () => {
    expect(errorCaret("x +", { from: { line: 1, col: 4 }, to: { line: 1, col: 4 } }).caret).toBe("   ^");
  });

  it("keeps tabs in the padding and clamps a span past the source", () => {
    expect(errorCaret("\tx", { from: { line: 1, col: 2 }, to: { line: 1, col: 3 } }).caret).toBe("\t^");
    const c = errorCaret("x", { from: { line: 9, col: 9 }, to: { line: 9, col: 10 } });
    expect(c.lineNumber).toBe(1);
    expect(c.caret).toBe(" ^");
  });
});
