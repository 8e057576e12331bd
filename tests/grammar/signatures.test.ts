/// The signature table is complete for the notation v1 (grammar/README.md) and consistent: every name of
/// the reference is there, every example in it type-checks, every property resolves on
/// a value of its type to the declared result.
import { describe, expect, test } from "vitest";
import {
  analyze,
  CONSTANTS,
  formatOverload,
  formatProperty,
  FUNCTIONS,
  formatError,
  lookupFunction,
  lookupProperty,
  OPERATORS,
  PROPERTIES,
  typeToString,
  type TypeKind,
} from "@/grammar/index";

const PRELUDE = [
  "S := GF(32003)[x, y, z, w]",
  "I := <x*z, x*w, y*z, y*w>",
  "J := <x - z, y - w>",
  "R := S / I",
  "A := [x, y, z; y, z, w]",
  "M := coker(A)",
  "C := resolve(S / I)",
  "H := hilbert(S / I)",
  "P := poincare(R.residue, terms = 6)",
  "F := random_ideals(S, count = 3)",
  "T := sweep(F, I -> {d: I.dim})",
  "rings := [S / I, S / J]",
].join("\n");

/// Notation.md v1, §3–§7: every function name.
const NOTATION_FUNCTIONS = [
  "GF",
  "ideal",
  "matrix",
  "saturate",
  "eliminate",
  "det",
  "minors",
  "pfaffians",
  "coker",
  "image",
  "ker",
  "module",
  "syzygy",
  "resolve",
  "koszul",
  "tor",
  "ext",
  "hilbert",
  "poincare",
  "serre",
  "tor_lengths",
  "burch_index",
  "eventual_period",
  "sum",
  "all",
  "any",
  "random_ideals",
  "monomial_ideals",
  "sweep",
];

/// Notation.md v1: every property, by the type that has it.
const NOTATION_PROPERTIES: [TypeKind, string[]][] = [
  [
    "Ring",
    [
      "field",
      "vars",
      "ngens",
      "maximal",
      "ideal",
      "ambient",
      "residue",
      "dim",
      "depth",
      "embdim",
      "codim",
      "hilbert",
      "socle",
      "burch_index",
      "is_burch",
      "is_ci",
      "is_gorenstein",
      "is_cm",
      // §3: a quotient ring answers every Module property
      "rank",
      "pd",
      "reg",
      "degree",
      "length",
      "presentation",
      "min_gens",
      "splits_residue",
    ],
  ],
  ["Ideal", ["gens", "groebner", "initial", "codim", "dim", "degree", "hilbert", "is_homogeneous", "burch"]],
  ["Matrix", ["t", "rows", "cols", "entries"]],
  ["Module", ["rank", "dim", "depth", "pd", "reg", "degree", "length", "hilbert", "socle", "presentation", "min_gens", "splits_residue"]],
  ["Complex", ["betti", "ranks", "length", "map", "complete", "minors"]],
  ["HilbertSeries", ["numerator", "denominator", "at", "polynomial", "values"]],
  ["Series", ["coefficients", "rational", "at"]],
  ["List", ["length"]],
];

/// A value of each type, written in the notation over PRELUDE.
const VALUE_OF: Partial<Record<TypeKind, string>> = {
  Field: "S.field",
  Ring: "R",
  Poly: "x",
  Ideal: "I",
  Matrix: "A",
  Module: "M",
  Complex: "C",
  BettiTable: "C.betti",
  HilbertSeries: "H",
  Series: "P",
  List: "[1, 2]",
  Family: "F",
  Table: "T",
  Str: '"s"',
};

function typeOfLast(source: string) {
  const a = analyze(source);
  const s = a.program.statements[a.program.statements.length - 1];
  const e = s.kind === "Define" ? s.value : s.kind === "ExprStatement" ? s.expr : undefined;
  return { errors: a.errors.map(formatError), type: e && a.types.get(e) };
}

describe("the signature table", () => {
  test("the prelude is a valid program", () => {
    expect(analyze(PRELUDE).errors.map(formatError)).toEqual([]);
  });

  test("has every function of the notation (grammar/README.md §6)", () => {
    for (const f of NOTATION_FUNCTIONS) expect(lookupFunction(f), f).toBeDefined();
  });

  test("has every property of the notation (grammar/README.md §6)", () => {
    for (const [owner, names] of NOTATION_PROPERTIES) {
      for (const n of names) expect(lookupProperty(owner, n), `${owner}.${n}`).toBeDefined();
    }
  });

  test("has the operators of the notation (grammar/README.md §5)", () => {
    const ops = new Set(OPERATORS.map((o) => o.op));
    for (const o of ["+", "-", "*", "/", "^", "&", ":", "==", "!=", "<", "<=", ">", ">=", "in", "and", "or", "not", "..", "index"]) {
      expect(ops.has(o as never), o).toBe(true);
    }
    expect(CONSTANTS.map((c) => c.name)).toEqual(["Q", "none"]);
  });

  test("entries are well formed: unique names, one-line descriptions, parts 0–3", () => {
    expect(new Set(FUNCTIONS.map((f) => f.name)).size).toBe(FUNCTIONS.length);
    const keys = PROPERTIES.map((p) => `${p.owner}.${p.name}`);
    expect(new Set(keys).size).toBe(keys.length);
    const descriptions = [
      ...FUNCTIONS.map((f) => f.description),
      ...FUNCTIONS.flatMap((f) => f.options.map((o) => o.description)),
      ...PROPERTIES.map((p) => p.description),
      ...OPERATORS.map((o) => o.description),
    ];
    for (const d of descriptions) {
      expect(d.length).toBeGreaterThan(3);
      expect(d).not.toMatch(/\n/);
    }
    const parts = [
      ...FUNCTIONS.flatMap((f) => f.overloads.map((o) => o.part)),
      ...PROPERTIES.map((p) => p.part),
      ...OPERATORS.map((o) => o.part),
    ];
    for (const p of parts) expect([0, 1, 2, 3]).toContain(p);
  });

  test("the reference's printed forms", () => {
    const resolve = lookupFunction("resolve")!;
    expect(formatOverload(resolve, resolve.overloads[0])).toBe("resolve(M: Module or Ring, length = …: Int, degree = …: Int) -> Complex");
    const poincare = lookupFunction("poincare")!;
    expect(formatOverload(poincare, poincare.overloads[0])).toBe("poincare(M: Module or Ring, terms = 10: Int) -> Series");
    const matrix = lookupFunction("matrix")!;
    expect(formatOverload(matrix, matrix.overloads[0])).toBe("matrix(rows…: List<Poly>) -> Matrix");
    expect(formatProperty(lookupProperty("Complex", "map")!)).toBe("Complex.map(i: Int) -> Matrix");
    expect(formatProperty(lookupProperty("Ring", "vars")!)).toBe("Ring.vars -> List<Poly>");
  });

  test.each(FUNCTIONS.map((f) => [f.name, f.example] as const))("the example of %s type-checks: %s", (_name, example) => {
    const { errors, type } = typeOfLast(`${PRELUDE}\n${example}`);
    expect(errors).toEqual([]);
    expect(type?.kind).not.toBe("Any");
  });

  test.each(PROPERTIES.map((p) => [`${p.owner}.${p.name}`, p] as const))("%s resolves to its declared type", (_key, p) => {
    const value = VALUE_OF[p.owner];
    expect(value, `no sample value of ${p.owner}`).toBeDefined();
    const args =
      p.params === null
        ? ""
        : `(${p.params.map((q) => (q.type.kind === "Str" ? '"d"' : q.type.kind === "Function" ? "r -> true" : "1")).join(", ")})`;
    const { errors, type } = typeOfLast(`${PRELUDE}\n(${value}).${p.name}${args}`);
    expect(errors).toEqual([]);
    expect(type && typeToString(type)).toBe(typeToString(p.result));
  });
});
