// Local rings through the evaluator (grammar/README.md, "Local rings"; issue 16): localize, local invariants,
// Milnor and Tjurina numbers, intersection multiplicities by Serre's Tor formula, resolutions
// over local rings. Each value names its source.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";
import type { ValueJson } from "@/lib/notation/json";

type J = ValueJson & Record<string, unknown>;

async function values(source: string): Promise<J[]> {
  const out = await evaluate(source, [], {});
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value as J);
}
const lastText = async (source: string) => (await values(source)).at(-1)!.text;
const ints = (v: J) => (v as unknown as { items: { value: string }[] }).items.map((i) => Number(i.value));

describe("Milnor and Tjurina numbers", () => {
  it("A_k, D_k, E_6, E_7, E_8: μ is the index (V. I. Arnold, Funct. Anal. Appl. 6, 1972; from memory)", async () => {
    const src = "S := Q[x, y]\n[milnor(x^4 + y^2), milnor(x^2*y + y^4), milnor(x^3 + y^4), milnor(x^3 + x*y^3), milnor(x^3 + y^5)]";
    expect(await lastText(src)).toBe("[3, 5, 6, 7, 8]");
  });
  it("τ = μ for quasi-homogeneous f (K. Saito, Invent. Math. 14, 1971) and τ = 11 < μ = 12 for E_12 with modulus 1", async () => {
    const src = "S := Q[x, y]\n[tjurina(x^3 + y^5), tjurina(x^2*y + y^4), milnor(x^3 + y^7 + x*y^5), tjurina(x^3 + y^7 + x*y^5)]";
    expect(await lastText(src)).toBe("[8, 5, 12, 11]");
  });
  it("at a point and over a local ring; a non-isolated singularity is an Error", async () => {
    expect(await lastText("S := Q[x, y]\nmilnor((x - 1)^3 + (y - 2)^4, at = [1, 2])")).toBe("6");
    expect(await lastText("S := Q[x, y]\nL := localize(S, at = [1, 2])\ntjurina((x - 1)^3 + (y - 2)^4)")).toBe("6");
    const out = await evaluate("S := Q[x, y]\nmilnor(x^2*y^2)", [], {});
    expect(out.error?.message).toMatch(/not isolated/);
  });
});

describe("intersection multiplicities at a point (Serre's Tor formula)", () => {
  // W. Fulton, Algebraic Curves (1969), §3.3: I(P, F ∩ G) = dim O_P/(F, G) for plane curves with
  // no common component (Tor_i = 0 for i > 0, both Cohen–Macaulay of complementary dimension).
  it("tangency y = x^2 with y = 0 gives 2; a transversal line gives 1", async () => {
    const v = await values("S := Q[x, y]\nL := localize(S)\nserre(L / <y - x^2>, L / <y>)\nserre(L / <y - x^2>, L / <y - x>)");
    expect([v[2].value, v[3].value]).toEqual(["2", "1"]);
  });
  it("at a singular point: node with a non-tangent line m_P(F)·m_P(G) = 2, cusp with its tangent 3 (Fulton §3.3 property (5))", async () => {
    const v = await values(
      "S := Q[x, y]\nL := localize(S)\nserre(L / <y^2 - x^2 - x^3>, L / <y>)\nserre(L / <y^2 - x^3>, L / <y>)\nserre(L / <y^2 - x^3>, L / <x>)",
    );
    expect(v.slice(2).map((x) => x.value)).toEqual(["2", "3", "2"]);
  });
  it("Fulton's worked example: E = (x^2+y^2)^2 + 3x^2y − y^3, F = (x^2+y^2)^3 − 4x^2y^2 meet at the origin with multiplicity 14 (§3.3)", async () => {
    const src = "S := Q[x, y]\nL := localize(S)\nserre(L / <(x^2 + y^2)^2 + 3*x^2*y - y^3>, L / <(x^2 + y^2)^3 - 4*x^2*y^2>)";
    expect(await lastText(src)).toBe("14");
  });
  it("away from the origin: y = x^2 meets y = 1 transversally at (1, 1)", async () => {
    expect(await lastText("S := Q[x, y]\nL := localize(S, at = [1, 1])\nserre(L / <y - x^2>, L / <y - 1>)")).toBe("1");
  });
  it("Serre's two planes in 4-space: graded and non-homogeneous forms agree (J.-P. Serre, Algèbre locale, multiplicités, 1965, ch. V; from memory)", async () => {
    // Y = V(x, y) ∪ V(z, w) and the plane V(x − z, y − w): ℓ(Tor_0) = 3, ℓ(Tor_1) = 1, χ = 2.
    const graded = await values("S := Q[x, y, z, w]\nserre(S / <x*z, x*w, y*z, y*w>, S / <x - z, y - w>)");
    expect(graded[1].value).toBe("2");
    // the same configuration through (1, 2, 0, 0), and bent by the automorphism x ↦ x + z^2
    const moved = await values(
      "S := Q[x, y, z, w]\nL := localize(S, at = [1, 2, 0, 0])\nI := <(x - 1)*z, (x - 1)*w, (y - 2)*z, (y - 2)*w>\nK := <x - 1 - z, y - 2 - w>\ntor_lengths(L / I, L / K, length = 4)\nserre(L / I, L / K)",
    );
    expect(ints(moved[4])).toEqual([3, 1, 0, 0, 0]);
    expect(moved[5].value).toBe("2");
    const bent = await values(
      "S := Q[x, y, z, w]\nL := localize(S)\nserre(L / <(x + z^2)*z, (x + z^2)*w, y*z, y*w>, L / <x + z^2 - z, y - w>)",
    );
    expect(bent[2].value).toBe("2");
  });
  it("refuses when the ideals' sum is not primary to the point", async () => {
    const out = await evaluate("S := Q[x, y, z]\nL := localize(S)\nserre(L / <x>, L / <y>)", [], {});
    expect(out.error?.message).toMatch(/finite length/);
  });
});

describe("local invariants", () => {
  it("Hilbert–Samuel multiplicities: node 2, cusp 2, A_2 surface x^2+y^2+z^3 2, D_4 surface 2, cone over a smooth plane cubic 3 (D. Eisenbud, Commutative Algebra, §12.1; common practice: e = the order of f)", async () => {
    const src =
      "S := Q[x, y, z]\nL := localize(S)\n[(L / <y^2 - x^2 - x^3>).multiplicity, (L / <y^2 - x^3>).multiplicity, (L / <x^2 + y^2 + z^3>).multiplicity, (L / <x^2*y + y^3 + z^2>).multiplicity, (L / <x^3 + y^3 + z^3 + x^4>).multiplicity]";
    expect(await lastText(src)).toBe("[2, 2, 2, 2, 3]");
  });
  it("the node: dim 1, embdim 2, depth 1, Cohen–Macaulay, Gorenstein, complete intersection; Samuel function 2d+1; tangent cone x^2 − y^2", async () => {
    const v = await values(
      "S := Q[x, y]\nR := localize(S / <y^2 - x^2 - x^3>)\n[R.dim, R.embdim, R.depth, R.codim]\n[R.is_cm, R.is_gorenstein, R.is_ci]\nR.samuel.values(4)\nR.samuel.at(10)\nR.tangent_cone",
    );
    expect(v[2].text).toBe("[1, 2, 1, 1]");
    expect(v[3].text).toBe("[true, true, true]");
    expect(ints(v[4])).toEqual([1, 3, 5, 7, 9]);
    expect(v[5].value).toBe("21");
    expect(v[6].text).toBe("Q[x, y] / <x^2-y^2>");
  });
  it("a local ring of depth 0 that is not Cohen–Macaulay: k[[x,y]]/(x^2, x*y) (embedded point at the origin; common practice)", async () => {
    const v = await values("S := Q[x, y]\nR := localize(S / <x^2 + x^3, x*y>)\n[R.dim, R.depth, R.is_cm]\nR.socle");
    expect(v[2].text).toBe("[1, 0, false]");
  });
  it("the tangency y = x^2, y = 0 is a local ring of length 2 (Fulton §3.3), and at a point off V(I) the local ring is zero", async () => {
    const v = await values("S := Q[x, y]\nlocalize(S / <y - x^2, y>).length\nR := localize(S / <y - x^2, y - 1>)\nR.samuel.values(2)");
    expect(v[1].value).toBe("2");
    expect(ints(v[3])).toEqual([0, 0, 0]);
  });
  it("homogeneous input: the local ring at the origin has the graded ring's dim, multiplicity, depth and CM-ness", async () => {
    const src = (l: string) =>
      `S := Q[x, y, z, w]\nR := ${l}(S / <x*z - y^2, y*w - z^2, x*w - y*z>)\n[R.dim, R.depth, R.is_cm, R.is_gorenstein, R.is_ci]`;
    const graded = await lastText(src(""));
    expect(await lastText(src("localize"))).toBe(graded);
    expect(await lastText("S := Q[x, y, z, w]\nR := localize(S / <x*z - y^2, y*w - z^2, x*w - y*z>)\nR.multiplicity")).toBe("3");
  });
});

describe("Burch index at a point", () => {
  it("the cusp: index 1 (by hand: a general line y = c·x cuts k[[x,y]]/(y^2 − x^3) to k[[x]]/(x^2): B = (x^3) : (x) = (x^2), dim (x)/(x^2) = 1)", async () => {
    const [, , b] = await values("S := Q[x, y]\nL := localize(S)\n(L / <y^2 - x^3>).burch_index");
    expect(b.value).toBe("1");
    expect(b.note).toMatch(/chosen at random/);
  });
  it("a non-Artinian local ring of depth 1 with index 2 (by hand: k[[x,y,z]]/((x+z^2)^2, (x+z^2)y, y^2) ≅ k[[x,y,z]]/(x,y)^2 via x ↦ x − z^2; a general linear form cuts it to k[[x,y]]/n^2, B = n^3 : n = n^2, dim n/n^2 = 2)", async () => {
    const v = await values("S := Q[x, y, z]\nR := localize(S / <(x + z^2)^2, (x + z^2)*y, y^2>)\n[R.depth, R.dim]\nR.burch_index");
    expect(v[2].text).toBe("[1, 1]");
    expect(v[3].value).toBe("2");
  });
});

describe("resolutions over local rings", () => {
  it("periodicity over a local hypersurface that is not graded: k over the node has β = 1, 2, 2, 2, … (D. Eisenbud, Trans. AMS 260, 1980: eventually periodic of period 2 via a matrix factorisation)", async () => {
    const v = await values(
      "S := Q[x, y]\nR := localize(S / <y^2 - x^2 - x^3>)\nC := resolve(R.residue, length = 6)\nC.ranks\neventual_period(C.ranks)\npoincare(R.residue, terms = 8).rational\nC.map(3) * C.map(4)\nC.map(4) * C.map(5)",
    );
    expect(ints(v[3])).toEqual([1, 2, 2, 2, 2, 2, 2]);
    expect(v[4].text).toBe("{start: 1, period: 1}");
    expect(v[2].text).toMatch(/over the local ring at the origin/);
    // consecutive maps compose to 0 over R (their entries reduce to 0 modulo y^2 − x^2 − x^3)
    for (const m of [v[6], v[7]]) expect((m as unknown as { rows: string[][] }).rows.flat().every((e) => e === "0")).toBe(true);
  });
  it("in three variables: k over k[[x,y,z]]/(xy − z^2 − z^3) has P = (1+t)^3/(1 − t^2) (J. Tate, Illinois J. Math. 1957): 1, 3, 4, 4, 4", async () => {
    const v = await values("S := Q[x, y, z]\nR := localize(S / <x*y - z^2 - z^3>)\npoincare(R.residue, terms = 6).coefficients");
    expect(ints(v[2])).toEqual([1, 3, 4, 4, 4, 4]);
  });
  it("over the local ring of S at a point the resolution is finite: the twisted-cubic ideal moved to (1, 0, 0, 0)", async () => {
    const v = await values(
      "S := Q[x, y, z, w]\nL := localize(S, at = [1, 0, 0, 0])\nR := L / <(x - 1)*z - y^2, y*w - z^2, (x - 1)*w - y*z>\nC := resolve(R)\nC.ranks\nC.complete",
    );
    expect(ints(v[4])).toEqual([1, 3, 2, 0, 0, 0]);
    expect(v[5].value).toBe(true);
  });
  it("socles and splits_residue over a non-Artinian local ring: depth 0 k[[x,y]]/(x^2, xy) (x^2 + x^3 locally x^2)", async () => {
    // soc R = (x) (x·m = 0); R is cyclic and not k, so k does not split off R; k splits off k;
    // a depth-0 ring is Burch exactly when k is a summand of Ω^2 k (H. Dao, T. Kobayashi,
    // R. Takahashi, Algebra & Number Theory 2020; from memory): compare with the Burch index
    const v = await values(
      "S := Q[x, y]\nR := localize(S / <x^2 + x^3, x*y>)\nR.socle\n[R.splits_residue, R.residue.splits_residue]\nR.residue.socle.min_gens\nsyzygy(R.residue, 2).splits_residue\nR.burch_index",
    );
    expect(v[2].text).toBe("<x^2+x>");
    expect(v[3].text).toBe("[false, true]");
    expect(v[4].value).toBe("1");
    expect(v[5].value).toBe(Number(v[6].value) >= 1);
    // depth 1: the socle of Ω^1 k = m is 0 and k does not split off Ω^2 k over the cusp
    const w = await values(
      "S := Q[x, y]\nT := localize(S / <y^2 - x^3>)\nsyzygy(T.residue, 1).socle.min_gens\nsyzygy(T.residue, 2).splits_residue",
    );
    expect([w[2].value, w[3].value]).toEqual(["0", false]);
  });

  it("presented modules over the local ring of S: coker, ker and image need no grading", async () => {
    // coker of a 2×3 matrix whose minors have codimension 2: the Buchsbaum–Rim complex
    // 0 → R → R^3 → R^2 (D. Eisenbud, Commutative Algebra, Appendix A2.6; from memory),
    // depth = dim = 1; z − 1 is a unit at the origin, so that column splits off a generator;
    // ker(x, y, z) is the second syzygy of k, 3 generators and one Koszul relation
    const v = await values(
      "S := Q[x, y, z]\nL := localize(S)\nN := coker(matrix([x, y, z], [y, z, x^2]))\nresolve(N).ranks\n[N.depth, N.dim]\nresolve(coker(matrix([x, y, z - 1], [y, z, x]))).ranks\nK := ker(matrix([x, y, z]))\n[K.min_gens, image(matrix([x*(1 + y), y])).min_gens]\nresolve(K).ranks",
    );
    expect(ints(v[3])).toEqual([2, 3, 1, 0, 0]);
    expect(v[4].text).toBe("[1, 1]");
    expect(ints(v[5])).toEqual([1, 2, 1, 0, 0]);
    expect(v[7].text).toBe("[3, 2]");
    expect(ints(v[8])).toEqual([3, 1, 0, 0, 0]);
  });

  it("a local ring is encoded with its point and restored from JSON", async () => {
    const v = await values("S := Q[x, y]\nL := localize(S / <y^2 - x^3>, at = [0, 0])\nM := localize(S, at = [1/2, 3])");
    expect(v[1]).toMatchObject({ local: { at: ["0", "0"] }, text: "localize(Q[x, y] / <-x^3+y^2>)" });
    expect(v[2]).toMatchObject({ local: { at: ["1/2", "3"] }, text: "localize(Q[x, y], at = [1/2, 3])" });
    const out = await evaluate("M.dim", [{ name: "M", value: v[2] }], {});
    expect(out.error).toBeNull();
    expect(out.results[0].value).toMatchObject({ value: "2" });
  });
  it("membership, containment and equality of ideals are decided at the point (x − 1 is a unit at the origin)", async () => {
    const v = await values(
      "S := Q[x, y]\nL := localize(S)\n[x in <x*(x - 1)>, <x*(1 + y)> == <x>, <x> <= <x^2 - x>, x in <x^2>]\nuse S\nx in <x*(x - 1)>",
    );
    expect(v[2].text).toBe("[true, true, true, false]");
    expect(v[4].value).toBe(false);
  });

  it("pd over a local ring: finite over the local ring of S (Hilbert), infinite for k over the cusp", async () => {
    // pd of S_m/(y^2 − x^3) is 1; over the cusp R, k has the periodic resolution 1, 2, 2, …
    const v = await values("S := Q[x, y]\nL := localize(S)\n(L / <y^2 - x^3>).pd");
    expect(v[2].value).toBe("1");
    const out = await evaluate("S := Q[x, y]\nR := localize(S / <y^2 - x^3>)\nR.residue.pd", [], {});
    expect(out.error?.message).toMatch(/infinite/);
  });

  it("eventual_period compares ideals of a local ring at the point (x·(1 + y) and x agree there)", async () => {
    const src = "[<x*(1 + y)>, <y>, <x>, <y*(2 + x)>, <x*(1 - y)>, <y>]";
    const v = await values(`S := Q[x, y]\nL := localize(S)\neventual_period(${src})\nuse S\neventual_period(${src})`);
    expect(v[2].text).toBe("{start: 0, period: 2}");
    expect(v[4].text).toBe("{start: none, period: none}");
  });

  it("names without a local reading are refused, not answered globally", async () => {
    const out = await evaluate("S := Q[x, y]\nR := localize(S / <y^2 - x^3>)\nR.hilbert", [], {});
    expect(out.error?.message).toMatch(/local ring.*samuel/);
    const reg = await evaluate("S := Q[x, y]\nR := localize(S / <y^2 - x^3>)\nR.reg", [], {});
    expect(reg.error?.kind).toBe("runtime");
  });
});
