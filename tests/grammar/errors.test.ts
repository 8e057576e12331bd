/// Bad inputs: each gives exactly these errors — kind, 1-based line:col span and
/// message, in the printed form `<kind> error at <from>-<to>: <message>`.
import { describe, expect, test } from "vitest";
import { analyze, check, formatError, type Env } from "@/grammar/index";

/// [what, source, every error printed]
const BAD: [string, string, string[]][] = [
  [
    "burch_index of an Ideal",
    "S := Q[x, y]\nI := <x^2, y^2>\nburch_index(I)",
    ["type error at 3:13-3:14: burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?"],
  ],
  [
    "2x",
    "S := Q[x]\n2x + 1",
    ["parse error at 2:1-2:3: a number runs into a name: `2x` — there is no implicit multiplication; did you mean 2*x?"],
  ],
  [
    "2 x with a space",
    "S := Q[x]\n2 x",
    [
      "parse error at 2:3-2:4: expected an operator or the end of the statement, found `x` — there is no implicit multiplication; did you mean 2*x?",
    ],
  ],
  [
    "(x+1)(x-1)",
    "S := Q[x]\n(x+1)(x-1)",
    ["type error at 2:1-2:6: (x+1) is a Poly, not a function — there is no implicit multiplication; did you mean (x+1)*(x-1)?"],
  ],
  [
    "unknown variable lists the ring",
    "S := Q[x, y]\nx + z",
    ["type error at 2:5-2:6: unknown name z: it is not defined and not a variable of the current ring S (variables: x, y)"],
  ],
  [
    "unknown name without a ring",
    "x^2",
    [
      "type error at 1:1-1:2: unknown name x: it is not defined, and there is no current ring to read it as a variable — define a ring first, e.g. S := Q[x]",
    ],
  ],
  ["GF(4)", "GF(4)", ["type error at 1:4-1:5: GF(p) needs a prime p < 2^31, got 4, which is not prime — did you mean GF(5) or GF(3)?"]],
  ["GF(1)", "GF(1)", ["type error at 1:4-1:5: GF(p) needs a prime p < 2^31, got 1, which is not prime — did you mean GF(2)?"]],
  [
    "GF(2^31)",
    "GF(2^31)",
    ["type error at 1:4-1:8: GF(p) needs a prime p < 2^31, got 2147483648, which is too large — the largest allowed is 2147483647"],
  ],
  ["ring with no variables", "Q[]", ["type error at 1:1-1:4: a polynomial ring needs at least one variable, as in Q[x, y]"]],
  [
    "duplicated variable",
    "Q[x, y, x]",
    ["type error at 1:9-1:10: the variable x appears twice in this ring — each variable must have its own name"],
  ],
  [
    "duplicated variable from a range",
    "Q[x1..x3, x2]",
    ["type error at 1:11-1:13: the variable x2 appears twice in this ring — each variable must have its own name"],
  ],
  ["unclosed (", "S := Q[x]\nf := (x + 1", ["parse error at 2:6-2:7: unclosed `(`: expected `)` before the end of the statement"]],
  ["unmatched )", "1 + 2)", ["parse error at 1:6-1:7: unmatched `)`: no open `(` before it"]],
  [
    "unclosed ideal",
    "S := Q[x, y]\nI := <x, y\nJ := <x>",
    ["parse error at 2:6-2:7: unclosed `<`: expected `>` before the end of the statement"],
  ],
  [
    "mismatched closer",
    "[1, 2)",
    [
      "parse error at 1:1-1:2: unclosed `[`: expected `]` before the end of the statement",
      "parse error at 1:6-1:7: unmatched `)`: no open `(` before it",
    ],
  ],
  [
    "negative power",
    "S := Q[x]\nx^-1",
    ["type error at 2:3-2:5: negative power: x^-1 — powers must be non-negative integers (there are no inverses of polynomials here)"],
  ],
  [
    "power beyond the limit",
    "S := Q[x]\nx^2000000",
    ["type error at 2:3-2:10: power too large: the exponent 2000000 is above the limit 10^6"],
  ],
  ["non-integer power", "S := Q[x]\nx^(1/2)", ["type error at 2:3-2:8: powers must be non-negative integers, got the Rat (1/2)"]],
  [
    "division by a polynomial",
    "S := Q[x, y]\nx / y",
    ["type error at 2:3-2:4: cannot divide by the polynomial y: division is only by nonzero constants (for a quotient ring write S / <y>)"],
  ],
  ["division by literal zero", "S := Q[x]\nx / 0", ["type error at 2:5-2:6: division by zero: x / 0 divides by 0, which is 0"]],
  ["division by zero expression", "1 / (2 - 2)", ["type error at 1:5-1:12: division by zero: 1 / (2 - 2) divides by (2 - 2), which is 0"]],
  ["unknown function", "S := Q[x]\nresolv(S)", ["type error at 2:1-2:7: unknown function resolv — did you mean resolve?"]],
  [
    "wrong named option",
    "S := Q[x]\nresolve(S, lenght = 3)",
    ["type error at 2:12-2:18: resolve has no option lenght; its options are length, degree — did you mean length?"],
  ],
  [
    "option of the wrong type",
    "S := Q[x]\nresolve(S, length = <x>)",
    ["type error at 2:21-2:24: the option length of resolve must be an Int, got Ideal"],
  ],
  ["named option to a function without options", "GF(7, seed = 1)", ["type error at 1:7-1:11: GF takes no named options, got seed"]],
  [
    "wrong number of arguments",
    "minors([1, 2; 3, 4])",
    [
      "type error at 1:1-1:21: minors expects 2 arguments, got 1 — as in minors([x, y, z; y, z, w], 2)",
      "type error at 1:8-1:20: a matrix literal is read in the current ring, and there is none — define a ring first, e.g. S := Q[x, y]",
    ],
  ],
  [
    "resolve of an Ideal",
    "S := Q[x]\nI := <x>\nresolve(I)",
    ["type error at 3:9-3:10: resolve expects a Module or Ring, got Ideal — did you mean resolve(S / I)?"],
  ],
  [
    "ideal plus polynomial",
    "S := Q[x]\n<x> + x",
    [
      "type error at 2:5-2:6: `+` does not apply to Ideal + Poly; it applies to Int + Int, Rat + Rat, Poly + Poly, Ideal + Ideal, Matrix + Matrix — did you mean <x> + <x>?",
    ],
  ],
  [
    "unknown property",
    "S := Q[x]\nS.dimension",
    [
      "type error at 2:3-2:12: a Ring has no property dimension; its properties are field, vars, ngens, maximal, ideal, ambient, residue, dim, depth, embdim, codim, hilbert, socle, burch_index, is_burch, is_ci, is_gorenstein, is_cm, rank, pd, reg, degree, length, presentation, min_gens, splits_residue, multiplicity, samuel, tangent_cone",
    ],
  ],
  ["method without call", "S := Q[x]\nC := resolve(S / <x>)\nC.map", ["type error at 3:1-3:6: map is a method: call it, as in C.map(i)"]],
  ["property called", "S := Q[x]\n<x>.gens(1)", ["type error at 2:1-2:12: gens is a property, not a method: write <x>.gens"]],
  ["unknown record field", "r := {a: 1, b: 2}\nr.c", ["type error at 2:3-2:4: this record has no field c; its fields are a, b"]],
  ["chained comparison", "1 < 2 < 3", ["parse error at 1:7-1:8: comparisons do not chain: join them with `and`, as in a < b and b < c"]],
  ["unterminated string", '"abc', ['parse error at 1:1-1:5: unterminated string: expected a closing `"` on the same line']],
  ["unexpected character", "1 @ 2", ["parse error at 1:3-1:4: unexpected character `@`"]],
  ["use of a non-ring", "S := Q[x]\nI := <x>\nuse I", ["type error at 3:5-3:6: use expects a Ring, got Ideal"]],
  [
    "use of an unknown name",
    "S := Q[x]\nuse T",
    ["type error at 2:5-2:6: use expects the name of a ring, but T is not defined (rings defined: S)"],
  ],
  [
    "ragged matrix",
    "S := Q[x]\n[1, 2; 3]",
    ["type error at 2:8-2:9: every row of a matrix needs the same number of entries: row 2 has 1, row 1 has 2"],
  ],
  [
    "bad order",
    "Q[x, y; order = lexx]",
    ["type error at 1:17-1:21: order must be grevlex, lex, glex or weights(w1, …, wn), got `lexx` — did you mean lex?"],
  ],
  [
    "weights count",
    "Q[x, y; order = weights(1, 2, 3)]",
    ["type error at 1:17-1:33: weights(…) needs one weight per variable: 2 variables, got 3 weights"],
  ],
  ["degrees count", "Q[x, y; degrees = (1, 2, 3)]", ["type error at 1:19-1:28: degrees needs one degree per variable: 2 variables, got 3"]],
  [
    "unknown ring option",
    "Q[x; grading = (1)]",
    ["type error at 1:6-1:13: a ring has no option `grading`; its options are order and degrees"],
  ],
  ["backwards range of variables", "Q[x3..x1]", ["type error at 1:3-1:9: the range x3..x1 runs backwards: write x1..x3"]],
  [
    "redefining a ring variable",
    "S := Q[x]\nx := 3",
    ["type error at 2:1-2:2: x is a variable of the current ring S, so it cannot also name a value — choose another name, e.g. x_1"],
  ],
  [
    "redefining a function",
    "sum := 3",
    ["type error at 1:1-1:4: sum is a built-in function and cannot be redefined — choose another name"],
  ],
  [
    "odd pfaffians",
    "S := Q[x]\npfaffians([0, x; -x, 0], 3)",
    ["type error at 2:26-2:27: Pfaffians are defined for even sizes k, got 3 — did you mean pfaffians([0, x; -x, 0], 4)?"],
  ],
  ["if condition not Bool", "if 1 then 2 else 3", ["type error at 1:4-1:5: the condition of `if` must be a Bool, got Int"]],
  ["function arity", "f := a -> a\nf(1, 2)", ["type error at 2:1-2:8: f takes 1 argument, got 2"]],
  [
    "lambda parameter not a name",
    "(1, b) -> b",
    ["parse error at 1:2-1:3: a function's parameters must be names, as in `I -> S / I` or `(a, b) -> a + b`"],
  ],
  [
    "tuple as a value",
    "(1, 2)",
    ["type error at 1:1-1:7: parentheses with commas make a value only as a ring option (degrees = (1, 2)) — for a List write [1, 2]"],
  ],
  ["empty expression", "S :=", ["parse error at 1:5-1:5: expected an expression, found the end of the statement"]],
  ["missing operand", "1 +* 2", ["parse error at 1:4-1:5: expected an expression, found `*`"]],
  [
    "several errors in one program",
    "S := Q[x, y]\nx + z\nGF(9)\n(1 + 2\ny^-2",
    [
      "parse error at 4:1-4:2: unclosed `(`: expected `)` before the end of the statement",
      "type error at 2:5-2:6: unknown name z: it is not defined and not a variable of the current ring S (variables: x, y)",
      "type error at 3:4-3:5: GF(p) needs a prime p < 2^31, got 9, which is not prime — did you mean GF(11) or GF(7)?",
      "type error at 5:3-5:5: negative power: y^-2 — powers must be non-negative integers (there are no inverses of polynomials here)",
    ],
  ],
  [
    "sweep probe not a Record",
    "S := Q[x]\nsweep([<x>], I -> I.dim)",
    [
      "type error at 2:14-2:24: sweep's probe must return a Record (its fields become the columns), e.g. I -> {dim: I.dim}; this one returns Int",
    ],
  ],
  [
    "sweep probe misused",
    "S := Q[x]\nsweep([<x>], I -> {b: burch_index(I)})",
    ["type error at 2:35-2:36: burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?"],
  ],
  [
    "ideal literal without a ring",
    "<1>",
    ["type error at 1:1-1:4: an ideal literal is read in the current ring, and there is none — define a ring first, e.g. S := Q[x, y]"],
  ],
  [
    "comprehension over a non-list",
    "[k for k in 3]",
    ["type error at 1:13-1:14: `for k in …` needs a List, a range such as 1..5, or a Family; got Int"],
  ],
  [
    "range of variables outside brackets",
    "S := Q[x1..x3]\nx1..x3",
    [
      "type error at 2:1-2:7: a range a..b needs two Int, got Poly and Poly (ranges of variable names belong inside ring brackets, as in Q[x1..x6])",
    ],
  ],
  ["negative list index", "[1, 2][-1]", ["type error at 1:8-1:10: List indices start at 0 and cannot be negative, got -1"]],
  [
    "weights outside ring brackets",
    "weights(1, 2)",
    ["type error at 1:1-1:8: weights(…) gives a monomial order inside ring brackets, as in Q[x, y; order = weights(1, 2)]"],
  ],
  [
    "an order name outside ring brackets",
    "S := Q[x]\nlex",
    ["type error at 2:1-2:4: lex names a monomial order; orders are given inside ring brackets, as in Q[x, y; order = lex]"],
  ],
  [
    "several errors in one statement (recovery inside a statement)",
    "[1 +, 2 +]",
    ["parse error at 1:5-1:6: expected an expression, found `,`", "parse error at 1:10-1:11: expected an expression, found `]`"],
  ],
  [
    "indexing a Ring",
    "S := Q[x]\nS[0]",
    [
      "type error at 2:1-2:5: S is a Ring, not a List, so it cannot be indexed — a new polynomial ring is built from a field, as in S.field[t]",
    ],
  ],
];

describe("bad inputs get exact errors", () => {
  test.each(BAD)("%s", (_what, source, printed) => {
    expect(analyze(source).errors.map(formatError)).toEqual(printed);
  });

  test("at least 25 bad inputs, of both kinds", () => {
    expect(BAD.length).toBeGreaterThanOrEqual(25);
    const kinds = new Set(BAD.flatMap(([, s]) => analyze(s).errors.map((e) => e.kind)));
    expect(kinds).toEqual(new Set(["parse", "type"]));
  });
});

describe("the example of grammar/README.md §8", () => {
  const env: Env = { bindings: { S: { kind: "Ring", vars: ["x", "y", "z", "w"] }, I: { kind: "Ideal" } }, currentRing: "S" };

  test("burch_index of an Ideal, with S and I from earlier cells", () => {
    const a = analyze("burch_index(I)", env);
    expect(a.errors).toHaveLength(1);
    expect(a.errors[0].kind).toBe("type");
    expect(a.errors[0].span).toEqual({ from: { line: 1, col: 13, offset: 12 }, to: { line: 1, col: 14, offset: 13 } });
    expect(formatError(a.errors[0])).toBe(
      "type error at 1:13-1:14: burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?",
    );
  });

  test("check says whether the program may run", () => {
    expect(check("burch_index(I)", env).ok).toBe(false);
    expect(check("burch_index(S / I)", env).ok).toBe(true);
  });
});
