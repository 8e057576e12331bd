/// Golden tests: every construct of the notation v1 (grammar/README.md) parses to the expected tree and
/// checks to the expected type. Trees are written in the compact form of sexpr.ts.
import { describe, expect, test } from "vitest";
import { analyze, formatError, typeToString } from "@/grammar/index";
import { sx } from "./sexpr";

const RING = "S := GF(32003)[x, y, z, w]\n";
const WITH_IDEALS = RING + "I := <x*z, x*w, y*z, y*w>\nJ := <x - z, y - w>\nR := S / I\nA := [x, y, z; y, z, w]\n";
const WITH_COMPLEX = WITH_IDEALS + "M := coker(A)\nC := resolve(S / I)\nH := hilbert(S / I)\nP := poincare(R.residue, terms = 6)\n";

/// [section, prelude, statement, tree, type]
type Case = readonly [string, string, string, string, string];

const CASES: Case[] = [
  // §1 lexical
  ["§1 comment", "", "1 + 2 # a comment", "(+ 1 2)", "Int"],
  ["§1 integer is exact", "", "123456789012345678901234567890", "123456789012345678901234567890", "Int"],
  ["§1 string with escapes", "", '"a \\"quoted\\" \\\\ label"', '"a \\"quoted\\" \\\\ label"', "Str"],
  ["§1 identifiers with _ and '", "", "y_2' := 3", "(:= y_2' 3)", "Int"],
  ["§1 line continues inside (", "", "(1 +\n 2)", "(+ 1 2)", "Int"],
  ["§1 line continues inside [", "", "[1,\n 2]", "(list 1 2)", "List<Int>"],
  ["§1 line continues inside <", RING, "<x,\n y>", "(ideal x y)", "Ideal"],
  ["§1 ⟨ ⟩ alias", RING, "⟨x, y⟩", "(ideal x y)", "Ideal"],
  ["§1 ∩ alias", WITH_IDEALS, "I ∩ J", "(& I J)", "Ideal"],
  ["§1 ⊆ alias", WITH_IDEALS, "I ⊆ J", "(<= I J)", "Bool"],
  ["§1 ∈ alias", WITH_IDEALS, "x*z ∈ I", "(in (* x z) I)", "Bool"],
  ["§1 → alias", RING, "f → f^2", "(fn (f) (^ f 2))", "Function(Any) -> Any"],
  ["§1 true and false", "", "true or false", "(or true false)", "Bool"],
  // §2 statements
  ["§2 definition", "", "S := GF(32003)[x, y, z, w]", "(:= S ([] (call GF 32003) x y z w))", "Ring"],
  ["§2 ideal literal in the current ring", RING, "I := <x*z, x*w, y*z, y*w>", "(:= I (ideal (* x z) (* x w) (* y z) (* y w)))", "Ideal"],
  ["§2 expression statement", WITH_IDEALS, "resolve(S / I).betti", "(. (call resolve (/ S I)) betti)", "BettiTable"],
  ["§2 use switches the current ring", "S := Q[x, y]\nT := Q[a, b]\nuse S\n", "x + y", "(+ x y)", "Poly"],
  ["§2 a defined ring becomes current", "S := Q[x, y]\nT := Q[a, b]\n", "a*b", "(* a b)", "Poly"],
  // §3 rings
  ["§3 Q", "", "Q", "Q", "Field"],
  ["§3 GF(p)", "", "GF(101)", "(call GF 101)", "Field"],
  ["§3 polynomial ring", "", "Q[x, y, z]", "([] Q x y z)", "Ring"],
  ["§3 range of indexed variables", "", "Q[x1..x6]", "([] Q (.. x1 x6))", "Ring"],
  ["§3 range of letters", "", "Q[a..e]", "([] Q (.. a e))", "Ring"],
  ["§3 order = lex", "", "Q[x, y, z; order = lex]", "([] Q x y z (= order lex))", "Ring"],
  ["§3 order = glex", "", "Q[x, y; order = glex]", "([] Q x y (= order glex))", "Ring"],
  ["§3 order = grevlex", "", "Q[x, y; order = grevlex]", "([] Q x y (= order grevlex))", "Ring"],
  ["§3 order = weights", "", "Q[x, y, z; order = weights(1, 2, 3)]", "([] Q x y z (= order (call weights 1 2 3)))", "Ring"],
  ["§3 degrees", "", "Q[x, y, z; degrees = (1, 2, 3)]", "([] Q x y z (= degrees (tuple 1 2 3)))", "Ring"],
  ["§3 order and degrees", "", "Q[x, y; order = lex, degrees = (1, 2)]", "([] Q x y (= order lex) (= degrees (tuple 1 2)))", "Ring"],
  ["§3 quotient ring", RING, "S / <x*y>", "(/ S (ideal (* x y)))", "Ring"],
  ["§3 quotient of a quotient", WITH_IDEALS, "R / <x^2>", "(/ R (ideal (^ x 2)))", "Ring"],
  ["§3 R.field", WITH_IDEALS, "R.field", "(. R field)", "Field"],
  ["§3 R.vars", WITH_IDEALS, "R.vars", "(. R vars)", "List<Poly>"],
  ["§3 R.maximal^2", WITH_IDEALS, "R.maximal^2", "(^ (. R maximal) 2)", "Ideal"],
  ["§3 R.ambient", WITH_IDEALS, "R.ambient", "(. R ambient)", "Ring"],
  ["§3 R.residue", WITH_IDEALS, "R.residue", "(. R residue)", "Module"],
  ["§3 R.is_gorenstein", WITH_IDEALS, "R.is_gorenstein", "(. R is_gorenstein)", "Bool"],
  ["§3 module property of a quotient ring", WITH_IDEALS, "(S / I).pd", "(. (/ S I) pd)", "Int"],
  ["§3 length of S/(I+J)", WITH_IDEALS, "(S / (I + J)).length", "(. (/ S (+ I J)) length)", "Int"],
  // §4 polynomials, ideals, matrices
  ["§4 polynomial arithmetic", RING, "x^2*y - 2*x + 3", "(+ (- (* (^ x 2) y) (* 2 x)) 3)", "Poly"],
  ["§4 rational coefficient", RING, "3/4*x^2", "(* (/ 3 4) (^ x 2))", "Poly"],
  ["§4 -x^2 is -(x^2)", RING, "-x^2", "(neg (^ x 2))", "Poly"],
  ["§4 powers are right-associative", "", "2^3^2", "(^ 2 (^ 3 2))", "Int"],
  ["§4 parentheses", RING, "(x + y)^3", "(^ (+ x y) 3)", "Poly"],
  ["§4 ideal(list)", RING, "ideal([x^2, y^2])", "(call ideal (list (^ x 2) (^ y 2)))", "Ideal"],
  ["§4 sum of ideals", WITH_IDEALS, "I + J", "(+ I J)", "Ideal"],
  ["§4 product of ideals", WITH_IDEALS, "I * J", "(* I J)", "Ideal"],
  ["§4 power of an ideal", WITH_IDEALS, "I ^ 2", "(^ I 2)", "Ideal"],
  ["§4 colon by an ideal", WITH_IDEALS, "I : J", "(: I J)", "Ideal"],
  ["§4 colon by an element", WITH_IDEALS, "I : x", "(: I x)", "Ideal"],
  ["§4 colon binds looser than +", WITH_IDEALS, "I : J + S.maximal", "(: I (+ J (. S maximal)))", "Ideal"],
  ["§4 intersection", WITH_IDEALS, "I & J", "(& I J)", "Ideal"],
  ["§4 saturate", WITH_IDEALS, "saturate(I, S.maximal)", "(call saturate I (. S maximal))", "Ideal"],
  ["§4 eliminate", WITH_IDEALS, "eliminate(I, [x, y])", "(call eliminate I (list x y))", "Ideal"],
  ["§4 equality of ideals", WITH_IDEALS, "I == J", "(== I J)", "Bool"],
  ["§4 containment", WITH_IDEALS, "I <= J", "(<= I J)", "Bool"],
  ["§4 membership", WITH_IDEALS, "x*z in I", "(in (* x z) I)", "Bool"],
  ["§4 membership and membership", WITH_IDEALS, "x*z in I and x - z in J", "(and (in (* x z) I) (in (- x z) J))", "Bool"],
  ["§4 I.gens", WITH_IDEALS, "I.gens", "(. I gens)", "List<Poly>"],
  ["§4 I.groebner", WITH_IDEALS, "I.groebner", "(. I groebner)", "List<Poly>"],
  ["§4 I.initial", WITH_IDEALS, "I.initial", "(. I initial)", "Ideal"],
  ["§4 I.hilbert", WITH_IDEALS, "I.hilbert", "(. I hilbert)", "HilbertSeries"],
  ["§4 I.burch", WITH_IDEALS, "I.burch", "(. I burch)", "Ideal"],
  ["§4 matrix(rows)", RING, "matrix([x, y, z], [y, z, w])", "(call matrix (list x y z) (list y z w))", "Matrix"],
  ["§4 matrix sugar", RING, "[x, y, z; y, z, w]", "(matrix (row x y z) (row y z w))", "Matrix"],
  ["§4 matrix product", WITH_IDEALS, "A * A.t", "(* A (. A t))", "Matrix"],
  ["§4 matrix sum", WITH_IDEALS, "A + A", "(+ A A)", "Matrix"],
  ["§4 scalar multiples (addition)", WITH_IDEALS, "x * A * y", "(* (* x A) y)", "Matrix"],
  ["§4 f·I and I·f (addition)", WITH_IDEALS, "x * I * y", "(* (* x I) y)", "Ideal"],
  ["§4 membership in a List (addition)", WITH_IDEALS, "x*z in I.gens", "(in (* x z) (. I gens))", "Bool"],
  ["§4 A.rows", WITH_IDEALS, "A.rows", "(. A rows)", "Int"],
  ["§4 A.cols", WITH_IDEALS, "A.cols", "(. A cols)", "Int"],
  ["§4 A.entries", WITH_IDEALS, "A.entries", "(. A entries)", "Ideal"],
  ["§4 det", RING, "det([x, y; z, w])", "(call det (matrix (row x y) (row z w)))", "Poly"],
  ["§4 minors", WITH_IDEALS, "minors(A, 2)", "(call minors A 2)", "Ideal"],
  ["§4 pfaffians", WITH_IDEALS, "pfaffians(A, 4)", "(call pfaffians A 4)", "Ideal"],
  // §5 modules and complexes
  ["§5 free module", RING, "S^3", "(^ S 3)", "Module"],
  ["§5 graded free module", RING, "S^[0, 1, 1]", "(^ S (list 0 1 1))", "Module"],
  ["§5 coker", WITH_IDEALS, "coker(A)", "(call coker A)", "Module"],
  ["§5 image", WITH_IDEALS, "image(A)", "(call image A)", "Module"],
  ["§5 ker", WITH_IDEALS, "ker(A)", "(call ker A)", "Module"],
  ["§5 module(I)", WITH_IDEALS, "module(I)", "(call module I)", "Module"],
  ["§5 syzygy", WITH_IDEALS, "syzygy(S / I, 2)", "(call syzygy (/ S I) 2)", "Module"],
  ["§5 resolve", WITH_IDEALS, "resolve(S / I)", "(call resolve (/ S I))", "Complex"],
  [
    "§5 truncated resolve",
    WITH_IDEALS,
    "resolve(R.residue, length = 4, degree = 6)",
    "(call resolve (. R residue) (= length 4) (= degree 6))",
    "Complex",
  ],
  ["§5 koszul on the variables", RING, "koszul(S)", "(call koszul S)", "Complex"],
  ["§5 koszul on elements", RING, "koszul(<x, y^2>)", "(call koszul (ideal x (^ y 2)))", "Complex"],
  ["§5 tor", WITH_IDEALS, "tor(1, S / I, S / J)", "(call tor 1 (/ S I) (/ S J))", "Module"],
  ["§5 ext", WITH_IDEALS, "ext(2, S / I, S)", "(call ext 2 (/ S I) S)", "Module"],
  ["§5 M.reg", WITH_COMPLEX, "M.reg", "(. M reg)", "Int"],
  ["§5 M.min_gens", WITH_COMPLEX, "M.min_gens", "(. M min_gens)", "Int"],
  ["§5 M.presentation", WITH_COMPLEX, "M.presentation", "(. M presentation)", "Matrix"],
  ["§5 M.splits_residue", WITH_COMPLEX, "M.splits_residue", "(. M splits_residue)", "Bool"],
  ["§5 C.betti", WITH_COMPLEX, "C.betti", "(. C betti)", "BettiTable"],
  ["§5 C.ranks", WITH_COMPLEX, "C.ranks", "(. C ranks)", "List<Int>"],
  ["§5 C.map(i)", WITH_COMPLEX, "C.map(2)", "(call (. C map) 2)", "Matrix"],
  ["§5 C.complete", WITH_COMPLEX, "C.complete", "(. C complete)", "Bool"],
  ["§5 C.minors(k)", WITH_COMPLEX, "C.minors(1)", "(call (. C minors) 1)", "List<Ideal>"],
  // §6 numbers, series, invariants
  ["§6 hilbert(M)", WITH_COMPLEX, "hilbert(M)", "(call hilbert M)", "HilbertSeries"],
  ["§6 H.numerator", WITH_COMPLEX, "H.numerator", "(. H numerator)", "Poly"],
  ["§6 H.denominator", WITH_COMPLEX, "H.denominator", "(. H denominator)", "Poly"],
  ["§6 H.at(d)", WITH_COMPLEX, "H.at(3)", "(call (. H at) 3)", "Int"],
  ["§6 H.polynomial", WITH_COMPLEX, "H.polynomial", "(. H polynomial)", "Poly"],
  ["§6 H.values(d)", WITH_COMPLEX, "H.values(5)", "(call (. H values) 5)", "List<Int>"],
  ["§6 poincare", WITH_IDEALS, "poincare(R.residue, terms = 8)", "(call poincare (. R residue) (= terms 8))", "Series"],
  ["§6 series coefficients", WITH_COMPLEX, "P.coefficients", "(. P coefficients)", "List<Int>"],
  ["§6 series rational", WITH_COMPLEX, "P.rational", "(. P rational)", "Record{numerator: Poly, denominator: Poly, checked: Int} or None"],
  ["§6 series at", WITH_COMPLEX, "P.at(2)", "(call (. P at) 2)", "Int"],
  ["§6 serre", WITH_IDEALS, "serre(S / I, S / J)", "(call serre (/ S I) (/ S J))", "Int"],
  ["§6 tor_lengths", WITH_IDEALS, "tor_lengths(S / I, S / J)", "(call tor_lengths (/ S I) (/ S J))", "List<Int>"],
  ["§6 burch_index", WITH_IDEALS, "burch_index(S / I)", "(call burch_index (/ S I))", "Int"],
  ["§6 R.burch_index", WITH_IDEALS, "R.burch_index", "(. R burch_index)", "Int"],
  [
    "§6 eventual_period",
    "",
    "eventual_period([1, 2, 3, 2, 3])",
    "(call eventual_period (list 1 2 3 2 3))",
    "Record{start: Int or None, period: Int or None}",
  ],
  [
    "§6 a value that may be none is usable (checked at run time)",
    "r := eventual_period([1, 2, 1, 2])\n",
    "if r.period == none then 0 else r.period + 1",
    "(if (== (. r period) none) 0 (+ (. r period) 1))",
    "Int",
  ],
  ["§6 fields of a rational function", WITH_COMPLEX, "P.rational.numerator", "(. (. P rational) numerator)", "Poly"],
  // §7 lists, records, functions, families
  ["§7 list", "", "[1, 2, 3]", "(list 1 2 3)", "List<Int>"],
  ["§7 empty list", "", "[]", "(list)", "List<Any>"],
  ["§7 range", "", "2..5", "(.. 2 5)", "List<Int>"],
  ["§7 range bounds are sums", "", "1..2+3", "(.. 1 (+ 2 3))", "List<Int>"],
  [
    "§7 comprehension",
    RING,
    "[burch_index(S / S.maximal^p) for p in 2..5]",
    "(for (call burch_index (/ S (^ (. S maximal) p))) (in p (.. 2 5)))",
    "List<Int>",
  ],
  ["§7 xs.length", "", "[1, 2].length", "(. (list 1 2) length)", "Int"],
  ["§7 xs[i]", "xs := [4, 5, 6]\n", "xs[0]", "([] xs 0)", "Int"],
  ["§7 sum", "", "sum([1, 2, 3])", "(call sum (list 1 2 3))", "Int"],
  ["§7 sum of ideals", WITH_IDEALS, "sum([I, J])", "(call sum (list I J))", "Ideal"],
  ["§7 all", WITH_IDEALS, "all([f in I for f in J.gens])", "(call all (for (in f I) (in f (. J gens))))", "Bool"],
  ["§7 any", "", "any([true, false])", "(call any (list true false))", "Bool"],
  [
    "§7 record",
    WITH_IDEALS,
    "{index: R.burch_index, depth: R.depth}",
    "(record (index (. R burch_index)) (depth (. R depth)))",
    "Record{index: Int, depth: Int}",
  ],
  ["§7 field access", WITH_IDEALS, "r := {index: R.burch_index, depth: R.depth}\nr.index", "(. r index)", "Int"],
  ["§7 function of one argument", RING, "I -> S / I", "(fn (I) (/ S I))", "Function(Any) -> Ring"],
  ["§7 function of two arguments", "", "(a, b) -> a + b", "(fn (a b) (+ a b))", "Function(Any, Any) -> Any"],
  ["§7 application", RING, "f := I -> S / I\nf(<x>)", "(call f (ideal x))", "Ring"],
  ["§7 application re-checks the body", "", "g := (a, b) -> a + b\ng(1, 2)", "(call g 1 2)", "Int"],
  ["§7 if then else", "", "if 1 < 2 then 3 else 4", "(if (< 1 2) 3 4)", "Int"],
  [
    "§7 comparisons",
    "",
    "1 == 1 and 1 != 2 and 1 < 2 and 1 <= 2 and 2 > 1 and 2 >= 1",
    "(and (and (and (and (and (== 1 1) (!= 1 2)) (< 1 2)) (<= 1 2)) (> 2 1)) (>= 2 1))",
    "Bool",
  ],
  ["§7 not binds looser than in", WITH_IDEALS, "not x in I", "(not (in x I))", "Bool"],
  ["§7 or is looser than and", "", "true or false and false", "(or true (and false false))", "Bool"],
  [
    "§7 random_ideals",
    RING,
    "random_ideals(S, count = 200, gens = 3, degree = 2, seed = 1)",
    "(call random_ideals S (= count 200) (= gens 3) (= degree 2) (= seed 1))",
    "Family",
  ],
  [
    "§7 monomial_ideals",
    RING,
    "monomial_ideals(S, degree = 3, max_gens = 4)",
    "(call monomial_ideals S (= degree 3) (= max_gens 4))",
    "Family",
  ],
  // A sweep is a Table when it runs inline and an Experiment when it goes to the background,
  // which is decided when it runs (the family's size, the CLI or a cell): the checker says
  // either, and background = false narrows it to the Table (these were "Table" before the
  // checker's type was made honest).
  [
    "§7 sweep",
    RING,
    "sweep(random_ideals(S), I -> {index: burch_index(S / I), depth: (S / I).depth})",
    "(call sweep (call random_ideals S) (fn (I) (record (index (call burch_index (/ S I))) (depth (. (/ S I) depth)))))",
    "Table or Experiment",
  ],
  [
    "§7 sweep over a List of ideals",
    RING,
    "sweep([<x>, <y>], I -> {dim: I.dim})",
    "(call sweep (list (ideal x) (ideal y)) (fn (I) (record (dim (. I dim)))))",
    "Table or Experiment",
  ],
  [
    "§7 sweep run inline",
    RING,
    "sweep([<x>, <y>], I -> {dim: I.dim}, background = false)",
    "(call sweep (list (ideal x) (ideal y)) (fn (I) (record (dim (. I dim)))) (= background false))",
    "Table",
  ],
  [
    "§7 sweep sent to the background (inline in the CLI)",
    RING,
    "sweep([<x>, <y>], I -> {dim: I.dim}, background = true)",
    "(call sweep (list (ideal x) (ideal y)) (fn (I) (record (dim (. I dim)))) (= background true))",
    "Table or Experiment",
  ],
];

function lastStatementType(source: string) {
  const a = analyze(source);
  const s = a.program.statements[a.program.statements.length - 1];
  const e = s.kind === "Define" ? s.value : s.kind === "ExprStatement" ? s.expr : undefined;
  return { a, s, type: e ? a.types.get(e) : undefined };
}

describe("every construct of the notation (grammar/README.md) parses and checks", () => {
  test.each(CASES)("%s", (_section, prelude, statement, tree, type) => {
    const { a, s, type: t } = lastStatementType(prelude + statement);
    expect(a.errors.map(formatError)).toEqual([]);
    expect(sx(s)).toBe(tree);
    expect(t && typeToString(t)).toBe(type);
  });
});

describe("the specification examples (grammar/README.md) as written", () => {
  test("§2 statements block, comments included", () => {
    const program = [
      "S := GF(32003)[x, y, z, w]      # definition: binds a name, saved as a named object",
      "use S                           # make S the current ring",
      "I := <x*z, x*w, y*z, y*w>       # ideal literal, read in the current ring",
      "resolve(S / I).betti            # expression: evaluated and shown",
    ].join("\n");
    const a = analyze(program);
    expect(a.errors).toEqual([]);
    expect(a.program.statements.map(sx)).toEqual([
      "(:= S ([] (call GF 32003) x y z w))",
      "(use S)",
      "(:= I (ideal (* x z) (* x w) (* y z) (* y w)))",
      "(. (call resolve (/ S I)) betti)",
    ]);
  });

  test("§6–§7 experiment lines", () => {
    const program = [
      "S := Q[x, y, z]",
      "R := S / <x^2, y^2, z^2>",
      "[burch_index(S / S.maximal^p) for p in 2..5]",
      "{index: R.burch_index, depth: R.depth}",
      "F := random_ideals(S, count = 200, gens = 3, degree = 2, seed = 1)",
      "G := monomial_ideals(S, degree = 3, max_gens = 4)",
      "sweep(F, I -> {index: burch_index(S / I), depth: (S / I).depth})",
      "eventual_period(poincare(R.residue, terms = 12).coefficients)",
      "serre(S / <x*y>, S / <x - y, z>)",
      "tor_lengths(S / <x*y>, S / <x - y, z>)",
    ].join("\n");
    const a = analyze(program);
    expect(a.errors.map(formatError)).toEqual([]);
    const types = a.program.statements.map((s) => (s.kind === "ExprStatement" ? typeToString(a.types.get(s.expr)!) : s.kind));
    expect(types).toEqual([
      "Define",
      "Define",
      "List<Int>",
      "Record{index: Int, depth: Int}",
      "Define",
      "Define",
      "Table or Experiment",
      "Record{start: Int or None, period: Int or None}",
      "Int",
      "List<Int>",
    ]);
  });
});

describe("statements and spans", () => {
  test("newline and ; separate statements; blank lines and extra ; are ignored", () => {
    const a = analyze("a := 1; b := 2\n\n c := a + b ;;\n# only a comment\n");
    expect(a.errors).toEqual([]);
    expect(a.program.statements.map(sx)).toEqual(["(:= a 1)", "(:= b 2)", "(:= c (+ a b))"]);
  });

  test("spans are 1-based line:col with an exclusive end", () => {
    const a = analyze("S := Q[x, y]\nI := <x^2, y>");
    const def = a.program.statements[1];
    expect(def.kind).toBe("Define");
    if (def.kind !== "Define") return;
    expect(def.name.span).toEqual({ from: { line: 2, col: 1, offset: 13 }, to: { line: 2, col: 2, offset: 14 } });
    expect(def.value.span.from).toEqual({ line: 2, col: 6, offset: 18 });
    expect(def.value.span.to).toEqual({ line: 2, col: 14, offset: 26 });
    expect(def.span.to).toEqual(def.value.span.to);
  });

  test("a `<` after an operand compares; at the start of an operand it opens an ideal", () => {
    const a = analyze("S := Q[x, y]\nn := 3\nn < 4\nS / <x> == S / <y>\n[n < 4, <x, y>]");
    expect(a.errors).toEqual([]);
    expect(a.program.statements.slice(2).map(sx)).toEqual([
      "(< n 4)",
      "(== (/ S (ideal x)) (/ S (ideal y)))",
      "(list (< n 4) (ideal x y))",
    ]);
  });

  test("comparison inside an ideal's parentheses still compares", () => {
    const a = analyze("S := Q[x]\n<(if 1 > 2 then x else x^2)>");
    expect(a.errors).toEqual([]);
    expect(sx(a.program.statements[1])).toBe("(ideal (if (> 1 2) x (^ x 2)))");
  });

  test("the environment is threaded: current ring, bindings, envs per statement", () => {
    const a = analyze("S := Q[x, y]\nT := S / <x>\nuse S\nn := 2");
    expect(a.envs.map((e) => e.currentRing)).toEqual([null, "S", "T", "S"]);
    expect(a.finalEnv.currentRing).toBe("S");
    expect(Object.keys(a.finalEnv.bindings)).toEqual(["S", "T", "n"]);
    expect(a.finalEnv.bindings.T).toEqual({ kind: "Ring", vars: ["x", "y"] });
  });

  test("an initial environment from earlier cells is honoured", () => {
    const env = { bindings: { S: { kind: "Ring", vars: ["a", "b"] }, I: { kind: "Ideal" } } as const, currentRing: "S" };
    const a = analyze("a*b in I", env);
    expect(a.errors).toEqual([]);
    const s = a.program.statements[0];
    expect(s.kind === "ExprStatement" && typeToString(a.types.get(s.expr)!)).toBe("Bool");
  });

  test("names resolve as locals, ring variables, bindings or constants", () => {
    const a = analyze("S := Q[x, y]\nn := 2\n[x^n + k for k in 1..3]\nQ");
    const kinds = [...a.names].map(([id, r]) => `${id.name}:${r.kind}`);
    expect(kinds).toEqual(["Q:constant", "x:variable", "n:binding", "k:local", "Q:constant"]);
  });

  test("ring literals are resolved with ranges expanded", () => {
    const a = analyze("Q[x1..x3, a..c, t; order = weights(1, 1, 1, 2, 2, 2, 3), degrees = (1, 1, 1, 2, 2, 2, 3)]");
    expect(a.errors).toEqual([]);
    const info = [...a.subscripts.values()][0];
    expect(info).toEqual({
      kind: "ring",
      vars: ["x1", "x2", "x3", "a", "b", "c", "t"],
      order: { kind: "weights", weights: [1, 1, 1, 2, 2, 2, 3] },
      degrees: [1, 1, 1, 2, 2, 2, 3],
    });
  });

  test("indexing a List is marked as indexing", () => {
    const a = analyze("xs := [1, 2]\nxs[1]");
    expect([...a.subscripts.values()]).toEqual([{ kind: "index" }]);
  });
});
