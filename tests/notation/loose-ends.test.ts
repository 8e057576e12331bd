// Issue 16, item 6: the loose ends found in an independent check, each reproduced here.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";
import type { ValueJson } from "@/lib/notation/json";

type J = ValueJson & Record<string, unknown>;

async function run(source: string) {
  return evaluate(source, [], {});
}

async function values(source: string): Promise<J[]> {
  const out = await run(source);
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value as J);
}

const ints = (v: J) => (v as unknown as { items: { value: string }[] }).items.map((i) => Number(i.value));

describe("loose ends of engine part 3 (issue 16)", () => {
  it("residue field over a quotient of a weighted polynomial ring: resolution, syzygy and Poincaré series", async () => {
    // R = k[x,y]/(x^2, y^2) with deg y = 2 is a complete intersection of two elements of m^2:
    // J. Tate, "Homology of Noetherian rings and local rings", Illinois J. Math. 1957 gives
    // P_k(t) = (1+t)^2/(1−t^2)^2 = 1/(1−t)^2, whatever the grading.
    const v = await values(
      "S := Q[x, y; degrees = (1, 2)]\nR := S / <x^2, y^2>\nP := poincare(R.residue, terms = 6)\nP.coefficients\nresolve(R.residue, length = 3).ranks\nsyzygy(R.residue, 1).min_gens",
    );
    expect(ints(v[3])).toEqual([1, 2, 3, 4, 5, 6]);
    expect(ints(v[4])).toEqual([1, 2, 3, 4]);
    expect(v[5]).toMatchObject({ value: "2" });
    // not Artinian (z free of degree 3): Tate gives (1+t)^3/(1−t^2)^2 = (1+t)/(1−t)^2, exact —
    // the total Betti numbers are those of the localisation at the irrelevant ideal
    const w = await values("S := Q[x, y, z; degrees = (1, 2, 3)]\nR := S / <x^2, y^2>\npoincare(R.residue, terms = 5).coefficients");
    expect(ints(w[2])).toEqual([1, 3, 5, 7, 9]);
  });

  it("the zero ring answers depth with a plain error", async () => {
    const out = await run("S := Q[x, y]\n(S / <1>).depth");
    expect(out.error?.kind).toBe("runtime");
    expect(out.error?.message).toMatch(/zero ring/);
    expect(out.error?.message).not.toMatch(/BigInt|Infinity/);
  });

  it("burch_index follows one rule for S/m and S/0: linear forms are eliminated first", async () => {
    // k = S/m and S/0 (depth 2, reduced to k by two general linear forms) both reach the field k
    // presented by 0 in no variables: index 0. k[x,y]/(x, y^2) ≅ k[y]/(y^2): with n = (y),
    // I = (y^2): I : n = (y), n·I = (y^3), B(I) = (y^3) : (y) = (y^2), dim_k n/B(I) = 1 (by hand).
    // x + y^2 lets x be solved for as well: k[x,y]/(x + y^2, y^3) ≅ k[y]/(y^3), index 1 (same
    // computation with I = (y^3)).
    const v = await values(
      "S := Q[x, y]\nburch_index(S / S.maximal)\nburch_index(S / <0>)\nburch_index(S / <x, y^2>)\nburch_index(S / <x + y^2, y^3>)",
    );
    expect(v.slice(1).map((x) => x.value)).toEqual(["0", "0", "1", "1"]);
  });

  it("Hilbert series of a module generated in negative degrees: a Laurent numerator", async () => {
    // Ext^2_S(k, S) ≅ k(2) for S = k[x, y] (local duality; D. Eisenbud, Commutative Algebra,
    // Ch. 17 on the Koszul complex, from memory): one basis element, in degree −2.
    const v = await values("S := Q[x, y]\nE := ext(2, S.residue, S^1)\nH := E.hilbert\nH.at(-2)\nH.at(-1)\nH.values(1)");
    expect(v[2]).toMatchObject({ lowest: -2, denominator: "(1-t)^2", numerator: ["1", "-2", "1"] });
    expect(v[2].text).toBe("(t^-2-2*t^-1+1)/(1-t)^2");
    expect([v[3].value, v[4].value]).toEqual(["1", "0"]);
    expect(ints(v[5])).toEqual([0, 0]);
    const bad = await run("S := Q[x, y]\next(2, S.residue, S^1).hilbert.numerator");
    expect(bad.error?.message).toMatch(/negative powers of t/);
  });

  it("a denominator with several factors is parenthesised in the text", async () => {
    // S/(xy) with deg z = 2: (1 − t^2)/((1 − t)^2 (1 − t^2)), numerator over the full denominator
    const [, h] = await values("S := Q[x, y, z; degrees = (1, 1, 2)]\nhilbert(S / <x*y>)");
    expect(h.text).toBe("(1-t^2)/((1-t)^2*(1-t^2))");
    expect(h.denominator).toBe("(1-t)^2*(1-t^2)");
  });

  it(".hilbert of a non-homogeneous ideal says what it is; under lex it is refused", async () => {
    const [, h] = await values("S := Q[x, y]\n<x^2 + y^3, x*y>.hilbert");
    expect(h.note).toMatch(/not homogeneous.*associated graded ring for the degree filtration/);
    expect(h.text).toMatch(/not homogeneous/);
    const lex = await run("S := Q[x, y; order = lex]\n<x^2 + y^3, x*y>.hilbert");
    expect(lex.error?.message).toMatch(/not homogeneous.*lex/);
    // homogeneous ideals carry no note
    const [, g] = await values("S := Q[x, y]\n<x^2, x*y>.hilbert");
    expect(g.note).toBeUndefined();
  });

  it("minors(A, k) with k larger than the matrix is the zero ideal, as C.minors(k)", async () => {
    // the ideal of k-minors is 0 when k exceeds the size (common practice)
    const v = await values("S := Q[x, y]\nminors([x, y; y, x], 3)\nminors(matrix([x, y, x]), 2)\nminors([x, y; y, x], 2)");
    expect((v[1] as unknown as { gens: string[] }).gens).toEqual([]);
    expect((v[2] as unknown as { gens: string[] }).gens).toEqual([]);
    expect((v[3] as unknown as { gens: string[] }).gens).toEqual(["x^2-y^2"]);
    expect((await run("S := Q[x, y]\nminors([x, y; y, x], 0)")).error).not.toBeNull();
  });

  it("a guessed rational function says it is a guess and counts only the terms beyond the fit", async () => {
    // k over k[x,y]/(x^2, y^2): 1/(1−t)^2 (Tate 1957), a recurrence of length 2, fixed by 4 terms
    const src = (n: number) => `S := GF(101)[x, y]\nR := S / <x^2, y^2>\npoincare(R.residue, terms = ${n})`;
    const [four] = (await values(src(4))).slice(2);
    expect(four).toMatchObject({ guessed: true, rational: "1/(1-2*t+t^2)", checked: 0 });
    expect(four.text).toMatch(/a guess: it reproduces 0 computed terms beyond those it was fitted to/);
    const [seven] = (await values(src(7))).slice(2);
    expect(seven).toMatchObject({ guessed: true, checked: 3 });
    const [three] = (await values(src(3))).slice(2);
    expect(three).toMatchObject({ rational: null });
    expect(three.guessed).toBeUndefined();
  });
});
