/// Fuzzing the front end (fast-check): random token soups and random mutations of
/// valid programs never make the lexer, parser or checker throw, and every error
/// has a well-formed span inside the source whose line:col agrees with its offset.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { Position } from "@/grammar/ast";
import type { Diagnostic } from "@/grammar/analysis";
import { check } from "@/grammar/checker";
import { EMPTY_ENV, tokenize, type Env } from "@/grammar/index";
import { parse } from "@/grammar/parser";

const FRAGMENTS = [
  "S",
  ":=",
  "GF(32003)",
  "Q",
  "[",
  "]",
  "(",
  ")",
  "{",
  "}",
  "<",
  ">",
  "⟨",
  "⟩",
  ",",
  ";",
  "\n",
  ".",
  "..",
  "x",
  "y",
  "z",
  "x1",
  "a'",
  "y_2",
  "I",
  "J",
  "R",
  "C",
  "0",
  "1",
  "2",
  "3",
  "10000000",
  "-1",
  "+",
  "-",
  "*",
  "/",
  "^",
  "&",
  "∩",
  ":",
  "==",
  "!=",
  "<=",
  ">=",
  "⊆",
  "∈",
  "in",
  "and",
  "or",
  "not",
  "->",
  "→",
  "use",
  "for",
  "if",
  "then",
  "else",
  "true",
  "false",
  "=",
  '"s"',
  '"open',
  "#c",
  "2x",
  "@",
  "resolve",
  "burch_index",
  "ideal",
  "matrix",
  "sweep",
  "order",
  "lex",
  "degrees",
  "length",
  "map",
  "betti",
  " ",
  "\t",
  "é",
  "\\",
  "'",
  "`",
  "\r\n",
];

const VALID = [
  "S := GF(32003)[x, y, z, w]\nuse S\nI := <x*z, x*w, y*z, y*w>\nresolve(S / I).betti",
  "R := Q[a..e; order = lex]\nJ := <a^2, b*c> : <a>\n[burch_index(R / R.maximal^p) for p in 2..5]",
  "S := Q[x1..x4; degrees = (1, 1, 2, 2)]; A := [x1, x2; x3, x4]; det(A) in minors(A, 2)",
  "f := (a, b) -> a + b\nif f(1, 2) >= 3 then {ok: true} else {ok: false}",
  "S := Q[x, y]\nsweep(random_ideals(S, count = 5), I -> {d: (S / I).depth, p: (S / I).pd})",
  "S := Q[x,y]\nC := resolve(S / <x^2, y^2>, length = 3)\nC.map(1) * C.map(2)\n# done",
];

function positionOk(p: Position, source: string): boolean {
  if (!Number.isInteger(p.offset) || p.offset < 0 || p.offset > source.length) return false;
  const before = source.slice(0, p.offset);
  const line = before.split("\n").length;
  const col = p.offset - (before.lastIndexOf("\n") + 1) + 1;
  return p.line === line && p.col === col;
}

/// A session with a current ring and some bindings, so mutations reach more of the checker.
const SESSION: Env = {
  bindings: { S: { kind: "Ring", vars: ["x", "y", "z"] }, I: { kind: "Ideal" }, R: { kind: "Ring", vars: ["x", "y", "z"] } },
  currentRing: "S",
};

function assertWellFormed(source: string, env: Env = EMPTY_ENV): void {
  const parsed = parse(source);
  const analysis = check(parsed, env, source);
  for (const e of analysis.errors as Diagnostic[]) {
    expect(["parse", "type"]).toContain(e.kind);
    expect(e.message.length).toBeGreaterThan(0);
    expect(positionOk(e.span.from, source), `${JSON.stringify(source)}: ${JSON.stringify(e)}`).toBe(true);
    expect(positionOk(e.span.to, source), `${JSON.stringify(source)}: ${JSON.stringify(e)}`).toBe(true);
    expect(e.span.from.offset).toBeLessThanOrEqual(e.span.to.offset);
  }
  for (const t of tokenize(source)) {
    expect(t.from).toBeGreaterThanOrEqual(0);
    expect(t.to).toBeLessThanOrEqual(source.length);
    expect(source.slice(t.from, t.to)).toBe(t.text);
  }
}

const soup = fc
  .array(fc.oneof(fc.constantFrom(...FRAGMENTS), fc.string({ maxLength: 3 })), { maxLength: 40 })
  .chain((parts) =>
    fc
      .array(fc.constantFrom("", " ", "\n"), { minLength: parts.length, maxLength: parts.length })
      .map((gaps) => parts.map((p, i) => p + gaps[i]).join("")),
  );

type Mutation = { at: number; kind: "delete" | "insert" | "replace"; text: string; len: number };
const mutation: fc.Arbitrary<Mutation> = fc.record({
  at: fc.nat(),
  kind: fc.constantFrom("delete", "insert", "replace"),
  text: fc.oneof(fc.constantFrom(...FRAGMENTS), fc.string({ maxLength: 2 })),
  len: fc.integer({ min: 1, max: 4 }),
});

function mutate(source: string, ms: Mutation[]): string {
  let s = source;
  for (const m of ms) {
    const at = m.at % (s.length + 1);
    if (m.kind === "delete") s = s.slice(0, at) + s.slice(at + m.len);
    else if (m.kind === "insert") s = s.slice(0, at) + m.text + s.slice(at);
    else s = s.slice(0, at) + m.text + s.slice(at + m.len);
  }
  return s;
}

describe("fuzz: the front end never throws and spans stay inside the source", () => {
  test("the valid programs used for mutation are valid", () => {
    for (const v of VALID) expect(check(parse(v), EMPTY_ENV, v).errors).toEqual([]);
  });

  test("random token soups", () => {
    fc.assert(
      fc.property(soup, (s) => assertWellFormed(s)),
      { numRuns: 400, seed: 20261201 },
    );
  });

  test("random token soups in a session with a current ring", () => {
    fc.assert(
      fc.property(soup, (s) => assertWellFormed(s, SESSION)),
      { numRuns: 400, seed: 7 },
    );
  });

  test("random mutations of valid programs", () => {
    fc.assert(
      fc.property(fc.constantFrom(...VALID), fc.array(mutation, { minLength: 1, maxLength: 6 }), (v, ms) =>
        assertWellFormed(mutate(v, ms)),
      ),
      { numRuns: 400, seed: 4 },
    );
  });

  test("a mutation that breaks a program is reported", () => {
    // Deleting the closing `>` of an ideal can never leave a valid program.
    const broken = "S := Q[x]\nI := <x, x^2\nI.gens";
    const a = check(parse(broken), EMPTY_ENV, broken);
    expect(a.errors.some((e) => e.kind === "parse" && e.span.from.line === 2)).toBe(true);
  });
});

describe("pathological sizes end with a clear error, not a crash", () => {
  test.each([
    ["a sum of 5000 terms is fine", Array(5000).fill("1").join(" + "), []],
    [
      "300 nested parentheses",
      "(".repeat(300) + "1" + ")".repeat(300),
      ["brackets are nested more than 200 levels deep in this statement"],
    ],
    ["3000 signs", "-".repeat(3000) + "1", ["this expression is nested more than 1000 levels deep — split it into several definitions"]],
    [
      "a tower of 5000 powers",
      Array(5000).fill("2").join("^"),
      ["this statement is nested too deeply to read — split it into several definitions"],
    ],
  ])("%s", (_what, source, messages) => {
    const a = check(parse(source), EMPTY_ENV, source);
    expect(a.errors.map((e) => e.message)).toEqual(messages);
  });
});
