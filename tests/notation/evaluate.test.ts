// The evaluator on every part-1 construct of the notation (grammar/README.md), with values checked against
// facts from outside the project (each cited beside its check).
import { describe, expect, it } from "vitest";
import { evaluate, type Binding, type EvalEvent, type EvalOutcome } from "@/lib/notation/evaluate";
import type { ValueJson } from "@/lib/notation/json";

async function run(
  source: string,
  bindings: Binding[] = [],
  currentRing: string | null = null,
): Promise<EvalOutcome & { events: EvalEvent[] }> {
  const events: EvalEvent[] = [];
  const out = await evaluate(source, bindings, { currentRing, onEvent: (e) => events.push(e) });
  return { ...out, events };
}

/// The values of all statements; fails the test with the Error when one failed.
async function values(source: string): Promise<ValueJson[]> {
  const out = await run(source);
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value);
}

async function last(source: string): Promise<ValueJson> {
  const v = await values(source);
  return v[v.length - 1];
}

const text = async (source: string) => (await last(source)).text;

describe("rings and polynomials", () => {
  it("defining a ring makes it current; polynomial literals are read in it", async () => {
    const [S, f] = await values("S := GF(32003)[x, y, z, w]\n(x + y)^2");
    expect(S).toEqual({
      type: "Ring",
      text: "GF(32003)[x, y, z, w]",
      field: "GF(32003)",
      vars: ["x", "y", "z", "w"],
      degrees: [1, 1, 1, 1],
      order: "grevlex",
      ideal: [],
    });
    // binomial theorem, grevlex with x > y
    expect(f.text).toBe("x^2+2*x*y+y^2");
  });

  it("GF(p) coefficients print in the symmetric range, Q coefficients as fractions", async () => {
    // 4 ≡ −3 (mod 7) and −7/2 < −3 ≤ 7/2 (lib/notation/README.md, the JSON encoding)
    expect(await text("S := GF(7)[x]\n4*x + 10")).toBe("-3*x+3");
    expect(await text("S := Q[x, y]\n3/4*x^2 - y")).toBe("3/4*x^2-y");
    expect(await text("S := Q[x]\n(x + 1/2)^2")).toBe("x^2+x+1/4");
  });

  it("ranges of variables and ring options", async () => {
    const R = await last("R := Q[x1..x3, a..c; order = lex, degrees = (1, 1, 1, 2, 2, 2)]");
    expect(R).toMatchObject({ vars: ["x1", "x2", "x3", "a", "b", "c"], order: "lex", degrees: [1, 1, 1, 2, 2, 2] });
    expect((await last("R := Q[x, y; order = weights(1, 3)]")).text).toBe("Q[x, y; order = weights(1, 3)]");
  });

  it("use switches the current ring", async () => {
    const v = await values("S := Q[x, y]\nT := GF(5)[u, v]\nuse S\nx*y\nuse T\n6*u");
    expect(v[3].text).toBe("x*y");
    expect(v[5].text).toBe("u");
  });

  it("ring properties", async () => {
    const v = await values("S := GF(101)[x, y, z]\nS.field\nS.vars\nS.ngens\nS.maximal\nS.ideal\nS.dim\nS.codim\nS.embdim\nS.ambient");
    expect(v.slice(1).map((x) => x.text)).toEqual(["GF(101)", "[x, y, z]", "3", "<x, y, z>", "<0>", "3", "0", "3", "GF(101)[x, y, z]"]);
  });
});

describe("ideals (grammar/README.md §5)", () => {
  const S = "S := Q[x, y, z, w]\nI := <x*z, x*w, y*z, y*w>\n";

  it("membership: checkable by hand for a monomial ideal", async () => {
    // x*z + y*w is a sum of generators; x*y is divisible by no generator
    const v = await values(`${S}x*z + y*w in I\nx*y in I\nx*y ∈ I`);
    expect(v.slice(2).map((x) => x.text)).toEqual(["true", "false", "false"]);
  });

  it("sum, product, power, intersection, colon, containment and equality", async () => {
    const v = await values(
      [
        "S := Q[x, y]",
        "<x> + <y> == <x, y>",
        "<x> * <y> == <x*y>",
        "<x, y>^2 == <x^2, x*y, y^2>",
        "(<x> & <y>) == <x*y>", // lcm of coprime monomials
        "<x> ∩ <y^2> == <x*y^2>",
        "(<x^2*y> : <x>) == <x*y>",
        "(<x^2*y> : x*y) == <x>",
        "<x> <= <x, y>",
        "<x, y> ⊆ <x>",
        "<x, y> != <x>",
        "x * <y> == <x*y>",
        "<y> * x == <x*y>",
      ].join("\n"),
    );
    expect(v.slice(1).map((x) => x.text)).toEqual([
      "true",
      "true",
      "true",
      "true",
      "true",
      "true",
      "true",
      "true",
      "false",
      "true",
      "true",
      "true",
    ]);
  });

  it("saturation: (x^2, x*y) : m^∞ = (x), since (x^2, xy) = (x) ∩ (x^2, y) (common practice)", async () => {
    expect(await text("S := Q[x, y]\nsaturate(<x^2, x*y>, <x, y>) == <x>")).toBe("true");
    expect(await text("S := Q[x, y]\nsaturate(<x^2*y>, y) == <x^2>")).toBe("true");
  });

  it("elimination: the cuspidal cubic x = t^2, y = t^3 has equation x^3 − y^2 (Cox, Little, O'Shea, Ch. 3)", async () => {
    expect(await text("S := Q[t, x, y]\neliminate(<x - t^2, y - t^3>, [t]) == <x^3 - y^2>")).toBe("true");
  });

  it("reduced Gröbner basis in lex agrees with SymPy", async () => {
    // SymPy: groebner([x**2 - y, x*y - 1], x, y, order='lex') = [x - y**2, y**3 - 1]
    const G = await last("S := Q[x, y; order = lex]\n<x^2 - y, x*y - 1>.groebner");
    expect(G).toMatchObject({
      type: "List",
      items: [
        { type: "Poly", text: "y^3-1" },
        { type: "Poly", text: "x-y^2" },
      ],
    });
  });

  it("initial ideal, homogeneity, dimension, codimension and degree", async () => {
    const v = await values(`${S}I.initial == I\nI.is_homogeneous\nI.dim\nI.codim\nI.degree\n<x - 1>.is_homogeneous`);
    // two planes in 4-space meeting at a point: dimension 2, codimension 2, degree 2 (Serre, Algèbre locale, multiplicités, 1965)
    expect(v.slice(2).map((x) => x.text)).toEqual(["true", "true", "2", "2", "2", "false"]);
    // grevlex: the S-pair y(x^2 − y^2) − x(xy) = −y^3 completes the basis {x^2 − y^2, xy, y^3}
    // (Buchberger's criterion, by hand)
    expect(await text("S := Q[x, y]\n<x^2 - y^2, x*y>.initial == <x^2, x*y, y^3>")).toBe("true");
  });

  it("ℓ(S/(I + J)) = 3 for the two planes I and J = (x − z, y − w) (Serre, Algèbre locale, multiplicités, 1965)", async () => {
    const v = await values(`${S}J := <x - z, y - w>\nH := (S / (I + J)).hilbert\nH.values(4)\nsum(H.values(10))`);
    expect(v.slice(4).map((x) => x.text)).toEqual(["[1, 2, 0, 0, 0]", "3"]);
  });

  it("ideal(list) and the Burch ideal of m^2: B(m^p) = m^2 (Dao–Kobayashi–Takahashi, Algebra & Number Theory 2020)", async () => {
    expect(await text("S := Q[x, y, z]\nm := S.maximal\nideal([x, y]) == <x, y>")).toBe("true");
    expect(await text("S := Q[x, y, z]\nm := S.maximal\n(m^3).burch == m^2")).toBe("true");
    expect(await text("S := Q[x, y, z]\nm := S.maximal\n(m^3 : m) == m^2")).toBe("true");
  });
});

describe("Hilbert series (grammar/README.md §6)", () => {
  it("of a complete intersection: ∏(1 − t^{d_i}) / (1 − t)^n (Koszul complex on a regular sequence, common practice)", async () => {
    // degrees 2 and 3 in 3 variables: (1 − t^2)(1 − t^3) = 1 − t^2 − t^3 + t^5
    const H = await last("S := Q[x, y, z]\n(S / <x^2, y^3>).hilbert");
    expect(H).toEqual({
      type: "HilbertSeries",
      text: "(1-t^2-t^3+t^5)/(1-t)^3",
      numerator: ["1", "0", "-1", "-1", "0", "1"],
      denominator: "(1-t)^3",
    });
    expect((await last("S := Q[x, y, z]\nhilbert(S / <x^2, y^3>)")).text).toBe("(1-t^2-t^3+t^5)/(1-t)^3");
  });

  it("Hilbert function of k[x,y,z]/m^3: C(2 + d, 2) for d < 3, then 0 (counting monomials, common practice)", async () => {
    const v = await values("S := GF(32003)[x, y, z]\nH := (S / S.maximal^3).hilbert\nH.values(5)\nH.at(2)\nH.at(7)");
    expect(v.slice(2).map((x) => x.text)).toEqual(["[1, 3, 6, 0, 0, 0]", "6", "0"]);
  });

  it("Hilbert polynomial of a plane cubic is 3t (degree-d plane curve: d·t + 1 − g with g = 1; common practice)", async () => {
    const v = await values("S := Q[x, y, z]\nH := <x^3 + y^3 + z^3>.hilbert\nH.polynomial\nH.numerator\nH.denominator");
    expect(v.slice(2).map((x) => x.text)).toEqual(["3*t", "-t^3+1", "-t^3+3*t^2-3*t+1"]);
  });

  it("weighted grading: k[x, y] with degrees 1, 2 has H(d) = ⌊d/2⌋ + 1 (counting monomials, common practice)", async () => {
    expect(await text("S := Q[x, y; degrees = (1, 2)]\nS.hilbert.values(5)")).toBe("[1, 1, 2, 2, 3, 3]");
  });
});

describe("quotient rings", () => {
  it("k[x, y]/(x^2, y^2): basis 1, x, y, xy, so h = (1, 2, 1) (checkable by hand)", async () => {
    const v = await values(
      "S := Q[x, y]\nR := S / <x^2, y^2>\n(x + y)^2\n(x + y)^3\nR.hilbert.values(3)\nR.dim\nR.embdim\nR.codim\nR.ideal",
    );
    expect(v.slice(2).map((x) => x.text)).toEqual(["2*x*y", "0", "[1, 2, 1, 0]", "0", "2", "2", "<x^2, y^2>"]);
    expect(v[1]).toMatchObject({ type: "Ring", text: "Q[x, y] / <x^2, y^2>", ideal: ["x^2", "y^2"] });
  });

  it("embedding dimension drops by the linear forms of the ideal: k[x,y,z]/(x − y^2) has embdim 2", async () => {
    expect(await text("S := Q[x, y, z]\n(S / <x - y^2>).embdim")).toBe("2");
  });

  it("ideals of a quotient: membership modulo the defining ideal", async () => {
    const v = await values("S := Q[x, y]\nR := S / <x*y>\nx^2*y in <y^3>\nx + y in <x, y>\n<x> & <y>");
    expect(v.slice(2).map((x) => x.text)).toEqual(["true", "true", "<0>"]);
  });

  it("A / <…> reads its ideal in A, whichever ring is current (grammar/README.md)", async () => {
    // after k := R / R.maximal the current ring is k, yet S / <x^3> is a quotient of S:
    // its Hilbert function is h(d) = min(d + 1, 3)
    // (count the monomials x^a y^b of degree d with a < 3; common practice)
    const v = await values(
      "S := Q[x, y]\nR := S / <x^2, y^2>\nk := R / R.maximal\nT := S / <x^3>\nT.hilbert.values(4)\nU := Q[a, b]\n(S / <y^5>).ideal",
    );
    expect(v[4].text).toBe("[1, 2, 3, 3, 3]");
    expect(v[6].text).toBe("<y^5>");
    const out = await run("S := Q[x, y]\nU := Q[a, b]\nS / <a>");
    expect(out.error?.text).toMatch(/unknown name a: .*not a variable of S, the ring on the left of \/ \(variables: x, y\)/);
  });
});

describe("numbers, lists, records, functions", () => {
  it("exact integers and rationals", async () => {
    const v = await values("2^100\n3/4 + 1/4\n-7/21\n2 == 4/2\n3/4 < 1\n(2/3)^3\n10 - 2 * 3");
    expect(v.map((x) => x.text)).toEqual(["1267650600228229401496703205376", "1", "-1/3", "true", "true", "8/27", "4"]);
    expect(v[1]).toEqual({ type: "Rat", text: "1", value: "1" });
  });

  it("lists, ranges, indexing, comprehensions, sum/all/any", async () => {
    const v = await values(
      "[p^2 for p in 1..4]\nsum(1..100)\n[1, 2, 3][0]\n[1, 2, 3].length\nall([true, 1 < 2])\nany([false, 2 < 1])\n[[a, b] for a in 1..2 for b in 3..4]\n2 in [1, 2]",
    );
    // Gauss: 1 + … + 100 = 5050
    expect(v.map((x) => x.text)).toEqual(["[1, 4, 9, 16]", "5050", "1", "3", "true", "false", "[[1, 3], [1, 4], [2, 3], [2, 4]]", "true"]);
  });

  it("sum of polynomials and of ideals", async () => {
    expect(await text("S := Q[x, y]\nsum([x^i for i in 0..3])")).toBe("x^3+x^2+x+1");
    expect(await text("S := Q[x, y]\nsum([<x>, <y>]) == <x, y>")).toBe("true");
  });

  it("records and field access", async () => {
    const r = await last("S := Q[x]\n{index: 2, f: x^2}");
    expect(r).toMatchObject({
      type: "Record",
      text: "{index: 2, f: x^2}",
      fields: { index: { type: "Int", value: "2" }, f: { type: "Poly", text: "x^2" } },
    });
    expect(await text("{a: 1, b: 2}.b")).toBe("2");
  });

  it("lambdas, closures and if", async () => {
    const v = await values(
      "f := (a, b) -> a + b\nf(2, 3)\nk := 10\ng := n -> n + k\ng(1)\nif 2 < 3 then 1 else 0\n[(n -> n * n)(i) for i in 1..3]",
    );
    expect(v.map((x) => x.text)).toEqual(["(a, b) -> a + b", "5", "10", "n -> n + k", "11", "1", "[1, 4, 9]"]);
    expect(v[3]).toMatchObject({ type: "Function", params: ["n"], captures: { k: { type: "Int", value: "10" } } });
  });

  it("a function of ideals building quotient rings", async () => {
    expect(await text("S := Q[x, y]\nq := I -> (S / I).dim\nq(<x>)")).toBe("1");
  });

  it("matrices: literals, sum, product, transpose, shape and entries", async () => {
    const v = await values(
      "S := Q[x, y, z, w]\nA := [x, y; z, w]\nA * A\nA + A\nA.t\nA.rows\nmatrix([x, y, z], [y, z, w]).cols\nA.entries\nx * A == A * x",
    );
    expect(v.slice(2).map((x) => x.text)).toEqual([
      "[x^2+y*z, x*y+y*w; x*z+z*w, y*z+w^2]",
      "[2*x, 2*y; 2*z, 2*w]",
      "[x, z; y, w]",
      "2",
      "3",
      "<x, y, z, w>",
      "true",
    ]);
  });
});

describe("determinants, minors and Pfaffians (engine part 2, already landed)", () => {
  it("det of a generic 2×2 matrix", async () => {
    expect(await text("S := Q[x, y, z, w]\ndet([x, y; z, w]) == x*w - y*z")).toBe("true");
  });

  it("2×2 minors of [x, y, z; y, z, w]: the twisted cubic, Betti numbers 1, 3, 2 in degrees 0, 2, 3 (Hilbert–Burch; Eagon–Northcott 1962)", async () => {
    // so its Hilbert numerator is 1 − 3t^2 + 2t^3 (alternating sum of the Betti numbers)
    const v = await values("S := Q[x, y, z, w]\nI := minors([x, y, z; y, z, w], 2)\nI.gens.length\nI.codim\nI.degree\nI.hilbert");
    expect(v.slice(2, 5).map((x) => x.text)).toEqual(["3", "2", "3"]);
    expect(v[5]).toMatchObject({ numerator: ["1", "0", "-3", "2"], denominator: "(1-t)^4" });
  });

  it("4×4 Pfaffians of the generic 5×5 alternating matrix: Betti numbers 1, 5, 5, 1 in degrees 0, 2, 3, 5 (Buchsbaum–Eisenbud, Amer. J. Math. 1977)", async () => {
    // Buchsbaum–Eisenbud 1977: Gorenstein of codimension 3; numerator 1 − 5t^2 + 5t^3 − t^5
    const A = "[0, a, b, c, d; -a, 0, e, f, g; -b, -e, 0, h, i; -c, -f, -h, 0, j; -d, -g, -i, -j, 0]";
    const v = await values(`S := GF(32003)[a..j]\nI := pfaffians(${A}, 4)\nI.gens.length\nI.codim\nI.hilbert`);
    expect(v.slice(2, 4).map((x) => x.text)).toEqual(["5", "3"]);
    expect(v[4]).toMatchObject({ numerator: ["1", "0", "-5", "5", "0", "-1"], denominator: "(1-t)^10" });
  });

  it("bad sizes are runtime errors at the argument", async () => {
    const out = await run("S := Q[x, y]\nk := 0\nminors(matrix([x, y]), k)");
    expect(out.error).toMatchObject({ kind: "runtime", span: { from: { line: 3, col: 24 }, to: { line: 3, col: 25 } } });
    // issue 16: a size above the matrix's is no error — the ideal of 3-minors of a 1×2 matrix is 0
    expect((await run("S := Q[x, y]\nk := 3\nminors(matrix([x, y]), k)")).error).toBeNull();
    expect((await run("S := Q[x, y]\ndet(matrix([x, y]))")).error?.message).toMatch(/square/);
  });
});

describe("depth, Cohen–Macaulay, Gorenstein, complete intersection of S/J (engine part 2)", () => {
  const props = ".depth, R.dim, R.is_cm, R.is_gorenstein, R.is_ci]";
  it("a complete intersection k[x,y,z]/(x^2, y^3) is CM, Gorenstein and CI of depth 1 (common practice)", async () => {
    expect(await text(`S := Q[x, y, z]\nR := S / <x^2, y^3>\n[R${props}`)).toBe("[1, 1, true, true, true]");
  });

  it("two planes meeting at a point: dimension 2 but depth 1, so not Cohen–Macaulay (Hartshorne's connectedness example; common practice)", async () => {
    expect(await text(`S := Q[x, y, z, w]\nR := S / <x*z, x*w, y*z, y*w>\n[R${props}`)).toBe("[1, 2, false, false, false]");
  });

  it("the twisted cubic is arithmetically CM, not Gorenstein (last Betti number 2, Hilbert–Burch; Eagon–Northcott 1962), not a CI", async () => {
    expect(await text(`S := Q[x, y, z, w]\nR := S / minors([x, y, z; y, z, w], 2)\n[R${props}`)).toBe("[2, 2, true, false, false]");
  });

  it("a polynomial ring has depth n", async () => {
    expect(await text("S := Q[x, y, z]\n[S.depth, S.is_cm]")).toBe("[3, true]");
  });
});

describe("events and named objects", () => {
  it("checked, then one result per statement in order, partial items of a comprehension", async () => {
    const out = await run("S := Q[x]\n[x^i for i in 1..3]");
    expect(out.events.map((e) => e.event)).toEqual(["checked", "result", "partial", "partial", "partial", "result"]);
    expect(out.events[0]).toEqual({ event: "checked", statements: 2, errors: [] });
    expect(out.events.filter((e) => e.event === "partial").map((e) => (e as { value: ValueJson }).value.text)).toEqual(["x", "x^2", "x^3"]);
    expect(out.events[1]).toMatchObject({
      event: "result",
      index: 0,
      name: "S",
      span: { from: { line: 1, col: 1 }, to: { line: 1, col: 10 } },
    });
  });

  it("definitions come back as named objects with type, JSON value and source text", async () => {
    const out = await run("S := Q[x, y]\nI := <x^2, y>\nI := I + <x>\nxs := [1, 2]");
    expect(out.objects.map((o) => [o.name, o.type, o.source])).toEqual([
      ["S", "Ring", "S := Q[x, y]"],
      ["I", "Ideal", "I := I + <x>"],
      ["xs", "List<Int>", "xs := [1, 2]"],
    ]);
    expect(out.currentRing).toBe("S");
  });

  it("a second cell uses bindings restored from the JSON of the first", async () => {
    const first = await run("S := Q[x, y, z]\nI := <x^2, y*z>\nf := J -> J + <z>\nH := (S / I).hilbert");
    expect(first.status).toBe("ok");
    // through the database: JSON text
    const saved: Binding[] = JSON.parse(JSON.stringify(first.objects.map((o) => ({ name: o.name, value: o.value }))));
    const second = await run("x^2 * z in I\nf(I) == <x^2, z>\nH.at(2)\nT := S / I\nT.dim", saved, first.currentRing);
    expect(second.error, second.error?.text).toBeNull();
    // (x^2, yz) + (z) = (x^2, z); x^2 z ∈ (x^2); S/(x^2, yz) in degree 2: the 6 monomials
    // minus x^2 and yz leaves 4; dimension 3 − 2 = 1 (a complete intersection of codimension 2)
    expect(second.results.map((r) => r.value.text)).toEqual(["true", "true", "4", "Q[x, y, z] / <x^2, y*z>", "1"]);
  });

  it("restored bindings type-check: using a saved Ideal where a Ring is expected is a type error", async () => {
    const first = await run("S := Q[x]\nI := <x>");
    const saved = first.objects.map((o) => ({ name: o.name, value: o.value }));
    const second = await run("I.ngens", saved, "S");
    expect(second.error?.kind).toBe("type");
  });
});

describe("errors with kind and span", () => {
  it("division by zero is a runtime error at the division", async () => {
    const out = await run("x := 1\n3 / (x - 1)");
    expect(out.error).toMatchObject({
      type: "Error",
      kind: "runtime",
      message: "division by zero",
      span: { from: { line: 2, col: 5 }, to: { line: 2, col: 12 } },
    });
    expect(out.results).toHaveLength(1);
  });

  it("GF(p) with p not prime at run time", async () => {
    const out = await run("ps := [4]\nGF(ps[0])");
    expect(out.error).toMatchObject({ kind: "runtime", span: { from: { line: 2, col: 4 }, to: { line: 2, col: 9 } } });
    expect(out.error!.message).toMatch(/4 is not prime/);
  });

  it("a power beyond the limit is a limit error", async () => {
    const out = await run("S := Q[x]\n(x + 1)^100000");
    expect(out.error).toMatchObject({ kind: "limit", span: { from: { line: 2, col: 9 }, to: { line: 2, col: 15 } } });
    const big = await run("n := 10000000\n2^n");
    expect(big.error?.kind).toBe("limit");
  });

  it("dividing by a multiple of p in GF(p) is a division by zero", async () => {
    const out = await run("S := GF(7)[x]\nq := 7\nx / q");
    expect(out.error).toMatchObject({
      kind: "runtime",
      message: "division by zero: 7 is 0 in GF(7)",
      span: { from: { line: 3, col: 5 }, to: { line: 3, col: 6 } },
    });
    const rat = await run("S := GF(7)[x]\nq := 7\n(1/q) * x");
    expect(rat.error?.message).toMatch(/division by zero/);
    // 1/2 is 4 in GF(7), since 2·4 = 8 ≡ 1
    expect(await text("S := GF(7)[x]\nx / 2")).toBe("-3*x");
  });

  it("a saved object that does not decode is reported, naming it", async () => {
    const out = await run("1", [
      {
        name: "I",
        value: {
          type: "Ideal",
          text: "<q>",
          gens: ["q"],
          ring: { type: "Ring", text: "", field: "Q", vars: ["x"], degrees: [1], order: "grevlex", ideal: [] },
        },
      },
    ]);
    expect(out.error).toMatchObject({ kind: "runtime" });
    expect(out.error!.message).toMatch(/^the saved object I cannot be restored: /);
  });

  it("an index out of range", async () => {
    const out = await run("[1, 2, 3][5]");
    expect(out.error).toMatchObject({ kind: "runtime", span: { from: { line: 1, col: 11 }, to: { line: 1, col: 12 } } });
  });

  it("nothing after the failing statement runs", async () => {
    const out = await run("a := 0\nb := 1 / a\nc := 3");
    expect(out.objects.map((o) => o.name)).toEqual(["a"]);
    expect(out.events.at(-1)).toMatchObject({ event: "error", index: 1 });
  });

  it("check errors come before anything runs", async () => {
    const out = await run("a := 1\n2x");
    expect(out.results).toHaveLength(0);
    expect(out.error?.kind).toBe("parse");
    expect(out.events[0]).toMatchObject({ event: "checked" });
  });

  it("the families, the last names that were pending, now evaluate (tests/notation/families.test.ts)", async () => {
    const out = await run("S := Q[x, y]\nrandom_ideals(S)");
    expect(out.error).toBeNull();
    expect(out.results[1].value).toMatchObject({ type: "Family", length: 200 });
  });

  it("invariants computed over polynomial rings only say so, and what to use, over a quotient ring", async () => {
    const quotient = await run("S := Q[x, y]\n(S / <x^2>).residue.reg");
    expect(quotient.error).toMatchObject({ kind: "runtime", span: { from: { line: 2, col: 1 } } });
    expect(quotient.error!.message).toMatch(
      /reg is computed for modules over a polynomial ring only, .*quotient ring Q\[x, y\] \/ <x\^2>.*resolve\(M, length = n\)/,
    );
  });
});

describe("cancellation", () => {
  it("an aborted signal ends the evaluation with kind cancelled", async () => {
    const controller = new AbortController();
    const events: EvalEvent[] = [];
    const out = await evaluate("a := 1\nb := 2", [], {
      signal: controller.signal,
      onEvent: (e) => {
        events.push(e);
        if (e.event === "result") controller.abort();
      },
    });
    expect(out.status).toBe("cancelled");
    expect(out.error).toMatchObject({ kind: "cancelled", span: { from: { line: 2, col: 1 } } });
    expect(out.results).toHaveLength(1);
  });

  it("a long Gröbner computation stops when the signal fires during it (aborted from its progress report)", async () => {
    const controller = new AbortController();
    // cyclic-6 over Q (Björck–Fröberg, J. Symbolic Comput. 1991): far more than one progress report long
    const cyclic6 =
      "S := Q[a, b, c, d, e, f]\nI := <a+b+c+d+e+f, a*b+b*c+c*d+d*e+e*f+f*a, a*b*c+b*c*d+c*d*e+d*e*f+e*f*a+f*a*b, a*b*c*d+b*c*d*e+c*d*e*f+d*e*f*a+e*f*a*b+f*a*b*c, a*b*c*d*e+b*c*d*e*f+c*d*e*f*a+d*e*f*a*b+e*f*a*b*c+f*a*b*c*d, a*b*c*d*e*f-1>\nI.degree";
    const progress: EvalEvent[] = [];
    const out = await evaluate(cyclic6, [], {
      signal: controller.signal,
      onEvent: (e) => {
        if (e.event !== "progress") return;
        progress.push(e);
        controller.abort();
      },
    });
    expect(progress.length).toBeGreaterThan(0);
    expect(progress[0]).toMatchObject({ event: "progress", index: 2 });
    expect(out.status).toBe("cancelled");
    expect(out.error).toMatchObject({ kind: "cancelled", span: { from: { line: 3, col: 1 } } });
  });
});
