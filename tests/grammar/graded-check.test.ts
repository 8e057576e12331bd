/// The checker flags, before anything runs, a resolution over a polynomial ring of an ideal
/// literal whose generators are not homogeneous (issue 18, point 6). Homogeneity: a
/// polynomial is homogeneous when all its terms have one degree, with variable degrees as
/// given by the ring (common practice; Eisenbud, Commutative Algebra, §1.5).
import { describe, expect, it } from "vitest";
import { check } from "@/grammar/index";

const messages = (src: string) => check(src).errors.map((e) => e.message);

describe("graded resolution of a non-homogeneous ideal", () => {
  it("flags a named ideal literal with the clashing generator and degrees", () => {
    const m = messages("S := Q[x, y, z]\nI := <x^2 + y, y*z>\nF := resolve(S / I)");
    expect(m).toHaveLength(1);
    expect(m[0]).toMatch(/resolve needs a homogeneous ideal/);
    expect(m[0]).toMatch(/x\^2 \+ y has terms of degrees 1 and 2/);
    expect(m[0]).not.toMatch(/resolveQuotient/);
  });

  it("flags an ideal literal written inside the call", () => {
    const a = check("S := Q[x, y, z]\nF := resolve(S / <x*y, x^3 - z>)");
    expect(a.errors).toHaveLength(1);
    expect(a.errors[0]!.span.from.line).toBe(2);
  });

  it("accepts homogeneous ideals, also under weighted degrees", () => {
    expect(messages("S := Q[x, y, z]\nF := resolve(S / <x^2 + y*z, y*z>)")).toEqual([]);
    // deg x = 1, deg y = 2: x^2 + y is homogeneous of degree 2
    expect(messages("S := Q[x, y; degrees = [1, 2]]\nF := resolve(S / <x^2 + y>)")).toEqual([]);
  });

  it("decides after cancellation, and over GF(p) after reducing coefficients", () => {
    // (x+1)^2 - 2x - 1 = x^2
    expect(messages("S := Q[x, y]\nF := resolve(S / <(x+1)^2 - 2*x - 1>)")).toEqual([]);
    // 2y = 0 over GF(2), so x^2 + 2y = x^2
    expect(messages("S := GF(2)[x, y]\nF := resolve(S / <x^2 + 2*y>)")).toEqual([]);
    expect(messages("S := GF(3)[x, y]\nF := resolve(S / <x^2 + 2*y>)")).toHaveLength(1);
  });

  it("leaves what it cannot read exactly to the evaluator", () => {
    // a ring from an earlier cell: unknown here
    expect(
      check("F := resolve(S / <x^2 + y>)", { bindings: {}, currentRing: null }).errors.every((e) => !/homogeneous/.test(e.message)),
    ).toBe(true);
    // a non-homogeneous ideal is fine where no grading is needed
    expect(messages("S := Q[x, y]\nI := <x^2 + y>\nI.dim")).toEqual([]);
  });
});
