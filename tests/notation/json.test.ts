// The JSON encoding of every value type, exactly as lib/notation/README.md ("The JSON encoding"), and the round trip
// encode → decode → encode (what restoring a saved named object relies on).
import { describe, expect, it } from "vitest";
import { QQ, gf, hilbertSeriesFromNumerator, parsePoly } from "@/lib/algebra/index";
import { DecodeError, ValueJson, ValueJsonSchemas, decodeValue, encodeValue, type ValueJson as Json } from "@/lib/notation/json";
import { ratOf } from "@/lib/algebra";
import { RingRegistry } from "@/lib/notation/rings";
import type { FunctionValue, RingValue, Value } from "@/lib/notation/values";

const rings = new RingRegistry();
const S = rings.polynomialRing(gf(32003), ["x", "y", "z", "w"]);
const Qxy = rings.polynomialRing(QQ, ["x", "y"], { order: { kind: "lex" }, degrees: [1, 2] });
const P = (r: RingValue, t: string) => parsePoly(r.poly, t);
const SJSON = {
  type: "Ring",
  text: "GF(32003)[x, y, z, w]",
  field: "GF(32003)",
  vars: ["x", "y", "z", "w"],
  degrees: [1, 1, 1, 1],
  order: "grevlex",
  ideal: [],
};

function roundTrip(v: Value): Json {
  const j = encodeValue(v);
  expect(ValueJson.safeParse(j).success).toBe(true);
  expect(ValueJsonSchemas[j.type].safeParse(j).success).toBe(true);
  // through a JSON string, as the database stores it, into a fresh evaluation's rings
  const again = encodeValue(decodeValue(JSON.parse(JSON.stringify(j)), { rings: new RingRegistry() }));
  expect(again).toEqual(j);
  return j;
}

describe("§9 encoding of each type", () => {
  it("Int and Rat: value is a decimal string", () => {
    expect(roundTrip({ type: "Int", value: 42n })).toEqual({ type: "Int", text: "42", value: "42" });
    expect(roundTrip({ type: "Int", value: -(10n ** 30n) })).toEqual({
      type: "Int",
      text: `-1${"0".repeat(30)}`,
      value: `-1${"0".repeat(30)}`,
    });
    expect(roundTrip({ type: "Rat", value: ratOf(3n, -4n) })).toEqual({ type: "Rat", text: "-3/4", value: "-3/4" });
  });

  it("Bool and Str carry value", () => {
    expect(roundTrip({ type: "Bool", value: true })).toEqual({ type: "Bool", text: "true", value: true });
    expect(roundTrip({ type: "Str", value: 'a "label"' })).toEqual({ type: "Str", text: 'a "label"', value: 'a "label"' });
  });

  it("Poly: canonical text, GF(p) coefficients in the symmetric range (plus its ring)", () => {
    // 32002 ≡ −1 and 16002 ≡ −16001 mod 32003: the symmetric range −p/2 < c ≤ p/2
    const f = P(S, "x^2*y + 32002*x + 16002");
    const j = roundTrip({ type: "Poly", ring: S, poly: f });
    expect(j).toEqual({ type: "Poly", text: "x^2*y-x-16001", ring: SJSON });
    const g = roundTrip({ type: "Poly", ring: Qxy, poly: P(Qxy, "3/4*x^2 - y") });
    expect(g.text).toBe("3/4*x^2-y");
  });

  it("Ideal: gens as polynomial texts, with its ring", () => {
    const I = { type: "Ideal" as const, ring: S, gens: ["x*z", "x*w", "y*z", "y*w"].map((t) => P(S, t)) };
    expect(roundTrip(I)).toEqual({ type: "Ideal", text: "<x*z, x*w, y*z, y*w>", gens: ["x*z", "x*w", "y*z", "y*w"], ring: SJSON });
  });

  it("Ring: field, vars, degrees, order and the defining ideal", () => {
    expect(roundTrip(S)).toEqual(SJSON);
    expect(roundTrip(Qxy)).toEqual({
      type: "Ring",
      text: "Q[x, y; order = lex, degrees = (1, 2)]",
      field: "Q",
      vars: ["x", "y"],
      degrees: [1, 2],
      order: "lex",
      ideal: [],
    });
    const W = rings.polynomialRing(gf(7), ["a", "b"], { order: { kind: "weights", weights: [2, 1] } });
    const R = rings.quotient(W, [P(W, "a^2"), P(W, "b^3")]);
    expect(roundTrip(R)).toEqual({
      type: "Ring",
      text: "GF(7)[a, b; order = weights(2, 1)] / <a^2, b^3>",
      field: "GF(7)",
      vars: ["a", "b"],
      degrees: [1, 1],
      order: "weights(2,1)",
      ideal: ["a^2", "b^3"],
    });
  });

  it("Matrix: rows of polynomial texts", () => {
    const rows = [
      ["x", "y", "z"],
      ["y", "z", "w"],
    ];
    const j = roundTrip({ type: "Matrix", ring: S, rows: rows.map((r) => r.map((t) => P(S, t))), cols: 3 });
    expect(j).toMatchObject({ type: "Matrix", text: "[x, y, z; y, z, w]", rows });
  });

  it("Module: presentation matrix and the degrees of the generators", () => {
    const A = { type: "Matrix" as const, ring: S, rows: [[P(S, "x"), P(S, "y")]], cols: 2 };
    expect(roundTrip({ type: "Module", ring: S, presentation: A, degrees: [0] })).toMatchObject({
      type: "Module",
      text: "coker([x, y]) over GF(32003)[x, y, z, w]",
      presentation: { type: "Matrix", rows: [["x", "y"]] },
      degrees: [0],
    });
    const F = { type: "Matrix" as const, ring: S, rows: [[], []], cols: 0 };
    expect(roundTrip({ type: "Module", ring: S, presentation: F, degrees: [0, 2] })).toMatchObject({
      text: "GF(32003)[x, y, z, w]^[0, 2]",
      degrees: [0, 2],
    });
  });

  it("Module: a presentation of null, or degrees that do not match its rows, do not restore", () => {
    const ring = encodeValue(S);
    const bad = { type: "Module", text: "?", presentation: null, degrees: [], ring };
    expect(() => decodeValue(bad, { rings: new RingRegistry() })).toThrow(/needs its presentation/);
    const A = encodeValue({ type: "Matrix", ring: S, rows: [[P(S, "x")]], cols: 1 });
    expect(() => decodeValue({ ...bad, presentation: A, degrees: [0, 1] }, { rings: new RingRegistry() })).toThrow(
      /2 generators but the presentation has 1 rows/,
    );
  });

  it("BettiTable and Complex: entries [i, j, b] with j the internal degree", () => {
    // twisted cubic: β_{0,0}=1, β_{1,2}=3, β_{2,3}=2 (Hilbert–Burch; Eagon–Northcott 1962)
    const betti = {
      type: "BettiTable" as const,
      entries: [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ] as const,
      complete: true,
    };
    expect(roundTrip(betti)).toMatchObject({
      type: "BettiTable",
      entries: [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      complete: true,
    });
    const C = roundTrip({ type: "Complex", ring: S, ranks: [1, 3, 2], betti, complete: true, maps: null });
    expect(C).toMatchObject({
      type: "Complex",
      ranks: [1, 3, 2],
      betti: [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      complete: true,
    });
  });

  it("HilbertSeries: numerator coefficients as Int strings, denominator as text", () => {
    // k[x,y,z,w]/(x^2) : (1 − t^2)/(1 − t)^4 (complete intersection, common practice)
    const hs = hilbertSeriesFromNumerator([1n, 0n, -1n], [1, 1, 1, 1]);
    expect(roundTrip({ type: "HilbertSeries", series: hs })).toEqual({
      type: "HilbertSeries",
      text: "(1-t^2)/(1-t)^4",
      numerator: ["1", "0", "-1"],
      denominator: "(1-t)^4",
    });
    const weighted = hilbertSeriesFromNumerator([1n], [1, 2, 2, 3]);
    expect(roundTrip({ type: "HilbertSeries", series: weighted })).toMatchObject({ denominator: "(1-t)*(1-t^2)^2*(1-t^3)" });
  });

  it("Series: coefficients and rational (text or null)", () => {
    expect(roundTrip({ type: "Series", coefficients: [1n, 2n, 3n], rational: null })).toEqual({
      type: "Series",
      text: "1+2*t+3*t^2+O(t^3)",
      coefficients: ["1", "2", "3"],
      rational: null,
    });
    expect(roundTrip({ type: "Series", coefficients: [1n, 2n], rational: "1/(1-t)^2" })).toMatchObject({ rational: "1/(1-t)^2" });
  });

  it("additions of engine part 3 survive the round trip: guessed function, exact terms, notes", () => {
    const guess = { numerator: [1n], denominator: [1n, -2n, 1n], checked: 6 };
    const s = roundTrip({ type: "Series", coefficients: [1n, 2n, 3n, 4n, 5n, 6n, 7n], rational: "1/(1-2*t+t^2)", guess, exact: 6 });
    expect(s).toMatchObject({ numerator: ["1"], denominator: ["1", "-2", "1"], checked: 6, exact: 6 });
    expect(s).toMatchObject({ guessed: true });
    expect(s.text).toMatch(/t\^6 and beyond are lower bounds.*a guess: it reproduces 6 computed terms beyond those it was fitted to/);
    const n = roundTrip({ type: "Int", value: 1n, note: "chosen at random (seed 1)" });
    expect(n).toEqual({ type: "Int", text: "1 (chosen at random (seed 1))", value: "1", note: "chosen at random (seed 1)" });
    const b = roundTrip({ type: "BettiTable", entries: [[0, 0, 1]], complete: false, note: "β_1 is a lower bound" });
    expect(b.text).toBe("Betti numbers β(0,0)=1 (truncated: β_1 is a lower bound)");
  });

  it("List, Record and Table nest encodings", () => {
    const one: Value = { type: "Int", value: 1n };
    const l = roundTrip({ type: "List", items: [one, { type: "Bool", value: false }] });
    expect(l).toEqual({
      type: "List",
      text: "[1, false]",
      items: [
        { type: "Int", text: "1", value: "1" },
        { type: "Bool", text: "false", value: false },
      ],
    });
    const r = roundTrip({
      type: "Record",
      fields: new Map([
        ["index", one],
        ["depth", { type: "Int", value: 0n }],
      ]),
    });
    expect(r).toEqual({
      type: "Record",
      text: "{index: 1, depth: 0}",
      fields: { index: { type: "Int", text: "1", value: "1" }, depth: { type: "Int", text: "0", value: "0" } },
      fieldOrder: ["index", "depth"],
    });
    const t = roundTrip({ type: "Table", columns: ["index"], rows: [[one]] });
    expect(t).toMatchObject({ type: "Table", columns: ["index"], rows: [[{ type: "Int", value: "1" }]] });
  });

  it("None and Field", () => {
    expect(roundTrip({ type: "None" })).toEqual({ type: "None", text: "none" });
    expect(roundTrip({ type: "Field", field: gf(5) })).toEqual({ type: "Field", text: "GF(5)" });
  });

  it("Family: its members and recipe", () => {
    const I = { type: "Ideal" as const, ring: S, gens: [P(S, "x^2")] };
    expect(
      roundTrip({ type: "Family", ring: S, generator: "monomial_ideals", options: new Map([["degree", 2n]]), members: [I] }),
    ).toMatchObject({
      type: "Family",
      generator: "monomial_ideals",
      options: { degree: "2" },
      members: [{ type: "Ideal", gens: ["x^2"] }],
    });
  });

  it("Function: source, params, captures and ring (restored by the evaluator)", () => {
    const fn: FunctionValue = {
      type: "Function",
      params: ["I"],
      source: "I -> S / I",
      captures: new Map([["S", S]]),
      ring: S,
      call: () => ({ type: "None" }),
    };
    const j = encodeValue(fn);
    expect(j).toEqual({ type: "Function", text: "I -> S / I", params: ["I"], captures: { S: SJSON }, ring: SJSON });
    expect(() => decodeValue(j, { rings })).toThrow(DecodeError);
  });
});

describe("decoding rejects bad JSON with a clear reason", () => {
  const bad: [string, unknown][] = [
    ["not an object", 42],
    ["unknown type", { type: "Quaternion", text: "i" }],
    ["Int value not decimal", { type: "Int", text: "x", value: "0x10" }],
    ["Rat with zero denominator", { type: "Rat", text: "1/0", value: "1/0" }],
    ["Ring over a non-prime field", { ...SJSON, field: "GF(12)" }],
    ["Ring with an unknown order", { ...SJSON, order: "revlex" }],
    ["Poly with a variable outside its ring", { type: "Poly", text: "q^2", ring: SJSON }],
    ["List with a bad item", { type: "List", text: "[?]", items: [{ type: "Int", text: "1", value: 1 }] }],
    ["HilbertSeries with a bad denominator", { type: "HilbertSeries", text: "", numerator: ["1"], denominator: "(1+t)" }],
    ["Matrix with ragged rows", { type: "Matrix", text: "", rows: [["x"], []], cols: 1, ring: SJSON }],
  ];
  for (const [what, json] of bad) {
    it(what, () => {
      expect(() => decodeValue(json, { rings: new RingRegistry() })).toThrow(DecodeError);
    });
  }
});

it("rings decoded from several objects are one ring, so their polynomials mix", () => {
  const reg = new RingRegistry();
  const a = decodeValue(encodeValue({ type: "Poly", ring: S, poly: P(S, "x") }), { rings: reg });
  const b = decodeValue(encodeValue(S), { rings: reg });
  expect(a.type === "Poly" && a.ring).toBe(b);
});

it("Error: kind, message and a 1-based span, with type and text", async () => {
  const { errorJson } = await import("@/lib/notation/errors");
  const { ErrorJson } = await import("@/lib/notation/json");
  const span = { from: { line: 1, col: 13, offset: 12 }, to: { line: 1, col: 14, offset: 13 } };
  const e = errorJson("type", "burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?", span);
  // the example of grammar/README.md §8
  expect(e).toEqual({
    type: "Error",
    text: "type error at 1:13-1:14: burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?",
    kind: "type",
    message: "burch_index expects a Ring, got Ideal — did you mean burch_index(S / I)?",
    span: { from: { line: 1, col: 13 }, to: { line: 1, col: 14 } },
  });
  expect(ErrorJson.safeParse(e).success).toBe(true);
  expect(ErrorJson.safeParse({ ...e, kind: "oops" }).success).toBe(false);
  expect(ErrorJson.safeParse({ ...e, span: { from: { line: 0, col: 1 }, to: { line: 1, col: 1 } } }).success).toBe(false);
});
