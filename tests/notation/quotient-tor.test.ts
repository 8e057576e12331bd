// Tor lengths, Serre's multiplicity and Bass numbers over graded quotient rings R = S/J
// (issue 16, item 5), read at the irrelevant ideal through the local code.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";

async function texts(source: string): Promise<string[]> {
  const out = await evaluate(source, [], {});
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value.text);
}

describe("Tor over a graded quotient ring", () => {
  it("balance: Tor^R(R/(x,z), R/(y,z)) and Tor^R(R/(y,z), R/(x,z)) over the quadric cone xy = z^2 are k in every degree", async () => {
    // the two rulings of the cone; each has the periodic resolution of a rank-one matrix
    // factorisation of xy − z^2 (D. Eisenbud, Trans. AMS 260, 1980), so every Tor_i is k (by hand)
    const t = await texts(
      "S := Q[x, y, z]\nT := S / <x*y - z^2>\ntor_lengths(T / <x, z>, T / <y, z>, length = 5)\ntor_lengths(T / <y, z>, T / <x, z>, length = 5)",
    );
    expect(t[2]).toBe("[1, 1, 1, 1, 1, 1]");
    expect(t[3]).toBe(t[2]);
  });
  it("closed form on a complete intersection: dim Tor_i^R(k, k) are the coefficients of (1+t)^3/(1−t^2)^3 = 1/(1−t)^3 (J. Tate, Illinois J. Math. 1957)", async () => {
    const t = await texts("S := Q[x, y, z]\nR := S / <x^2, y^2, z^2>\ntor_lengths(R.residue, R.residue, length = 5)");
    expect(t[2]).toBe("[1, 3, 6, 10, 15, 21]");
  });
  it("a change of rings by hand: over R = k[x,y,z]/(x^2, y^2), R/x has the periodic resolution ←x− R ←x− R, so Tor_i(R/x, k[x]/(x^2)) = 0 for i ≥ 1; balanced", async () => {
    const t = await texts(
      "S := Q[x, y, z]\nR := S / <x^2, y^2>\ntor_lengths(R / <x>, R / <y, z>, length = 4)\ntor_lengths(R / <y, z>, R / <x>, length = 4)",
    );
    expect(t[2]).toBe("[1, 0, 0, 0, 0]");
    expect(t[3]).toBe("[1, 0, 0, 0, 0]");
  });
  it("serre where the sum is finite (finite projective dimension), an Error otherwise", async () => {
    // z is regular on U = k[x,y,z]/(x^2, y^3) and on U/(x, y) = k[z]: Tor_0 = k, Tor_1 = 0
    const t = await texts("S := Q[x, y, z]\nU := S / <x^2, y^3>\nserre(U / <z>, U / <x, y>)");
    expect(t[2]).toBe("1");
    const out = await evaluate("S := Q[x, y, z]\nR := S / <x^2, y^2>\nserre(R / <x, z>, R / <y>)", [], {});
    expect(out.error?.message).toMatch(/infinite projective dimension/);
  });
});

describe("tor and ext as modules over a quotient ring", () => {
  it("over the cone xy = z^2: Tor_1(R/(x,z), R/(y,z)) = k(−1) and Tor_2 = k(−2); Ext^1(R/(x,z), R) ≅ R/(x,z) (by hand from the rank-one matrix factorisation; R Gorenstein, so Ext^1 of the ruling is its canonical module — Eisenbud, Commutative Algebra, §21.1, from memory)", async () => {
    const t = await texts(
      "S := Q[x, y, z]\nT := S / <x*y - z^2>\nA := tor(1, T / <x, z>, T / <y, z>)\n[A.length, A.min_gens]\nA.hilbert\ntor(2, T / <x, z>, T / <y, z>).hilbert\next(1, T / <x, z>, T^1).hilbert",
    );
    expect(t[3]).toBe("[1, 1]");
    expect(t[4]).toBe("(t-3*t^2+3*t^3-t^4)/(1-t)^3"); // = t
    expect(t[5]).toBe("(t^2-3*t^3+3*t^4-t^5)/(1-t)^3"); // = t^2
    expect(t[6]).toBe("(1-2*t+t^2)/(1-t)^3"); // = 1/(1−t), the Hilbert series of k[y]
  });
  it("the modules agree with tor_lengths (Tate's closed form over x^2, y^2, z^2) and Ext^i(k, R) of an Artinian Gorenstein ring is k, 0, 0", async () => {
    const t = await texts(
      "S := Q[x, y, z]\nR := S / <x^2, y^2, z^2>\n[tor(i, R.residue, R.residue).length for i in 0..3]\n[ext(i, R.residue, R^1).length for i in 0..2]",
    );
    expect(t[2]).toBe("[1, 3, 6, 10]");
    expect(t[3]).toBe("[1, 0, 0]");
  });
  it("over a local ring: Tor_1(k, k) over the cusp has length 2 = embdim, Tor_2 length 2 (Tate: (1+t)^2/(1−t^2))", async () => {
    const t = await texts(
      "S := Q[x, y]\nL := localize(S / <y^2 - x^3>)\n[tor(1, L.residue, L.residue).length, tor(2, L.residue, L.residue).length]",
    );
    expect(t[2]).toBe("[2, 2]");
  });
});

describe("Bass numbers", () => {
  it("a Gorenstein ring of dimension 1 has μ_i(R) = 1 exactly for i = 1 (H. Bass, Math. Z. 82, 1963); μ_i(k) = β_i(k) over the same ring (Ext(k, k))", async () => {
    const t = await texts("S := Q[x, y, z]\nR := S / <x^2, y^2>\n[bass(R^1, i) for i in 0..3]\n[bass(R.residue, i) for i in 0..3]");
    expect(t[2]).toBe("[0, 1, 0, 0]");
    // Tate: P_k = (1+t)^3/(1−t^2)^2 = (1+t)/(1−t)^2: 1, 3, 5, 7
    expect(t[3]).toBe("[1, 3, 5, 7]");
  });
  it("over a polynomial ring in 3 variables: μ_i(S) = 1 exactly for i = 3; over a local ring at a point as well", async () => {
    const t = await texts(
      "S := Q[x, y, z]\n[bass(S^1, i) for i in 0..3]\nL := localize(S / <y - x^2>, at = [1, 1, 0])\n[bass(L^1, i) for i in 0..3]",
    );
    expect(t[1]).toBe("[0, 0, 0, 1]");
    expect(t[3]).toBe("[0, 0, 1, 0]");
  });
});
