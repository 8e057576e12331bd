/// Reading the brackets of a ring literal `K[x, y1..y3, a..c; order = lex, degrees = (1, 2)]`:
/// variable names (ranges expanded), monomial order and grading. Used by the checker
/// and, through `ringLiteralInfo`, by the evaluator.
import type { Expr, NamedArg, Span, Subscript } from "./ast";
import type { RingLiteralInfo } from "./analysis";
import { ORDER_NAMES, RING_OPTIONS } from "./signatures";
import { nearest } from "./suggest";
import { LIMIT_TABLE } from "../lib/limits";

/// More variables than this is surely a typo in a range.
export const MAX_VARIABLES = LIMIT_TABLE.ringVariables.value;

export interface RingLiteralProblem {
  readonly message: string;
  readonly span: Span;
}

/// The range `x1..x6` (same stem, increasing number) or `a..e` (single letters of one case).
function expandRange(from: string, to: string): string[] | string {
  const fm = /^(.*?)([0-9]+)$/.exec(from);
  const tm = /^(.*?)([0-9]+)$/.exec(to);
  if (fm && tm && fm[1] === tm[1] && fm[1] !== "") {
    const a = Number(fm[2]);
    const b = Number(tm[2]);
    if (b < a) return `the range ${from}..${to} runs backwards: write ${to}..${from}`;
    if (b - a + 1 > MAX_VARIABLES) return `the range ${from}..${to} has ${b - a + 1} variables, more than the limit ${MAX_VARIABLES}`;
    const out: string[] = [];
    for (let i = a; i <= b; i++) out.push(fm[1] + String(i));
    return out;
  }
  if ((/^[a-z]$/.test(from) && /^[a-z]$/.test(to)) || (/^[A-Z]$/.test(from) && /^[A-Z]$/.test(to))) {
    const a = from.charCodeAt(0);
    const b = to.charCodeAt(0);
    if (b < a) return `the range ${from}..${to} runs backwards: write ${to}..${from}`;
    const out: string[] = [];
    for (let c = a; c <= b; c++) out.push(String.fromCharCode(c));
    return out;
  }
  return `a range of variables is a name ending in a number up to the same name with a larger number (x1..x6) or a letter up to a later letter (a..e); got ${from}..${to}`;
}

const MAX_WEIGHT = LIMIT_TABLE.ringWeight.value;

function positiveIntList(e: Expr, what: string, problems: RingLiteralProblem[]): number[] | null {
  const items = e.kind === "Tuple" || e.kind === "ListLit" ? e.items : [e];
  const out: number[] = [];
  for (const it of items) {
    if (it.kind !== "IntLit" || it.value < 1n || it.value > BigInt(MAX_WEIGHT)) {
      problems.push({
        message: `${what} must be positive integers (at most ${MAX_WEIGHT}, limit ringWeight), written out, as in (1, 2, 3)`,
        span: it.span,
      });
      return null;
    }
    out.push(Number(it.value));
  }
  return out;
}

function readOrder(value: Expr, nvars: number, problems: RingLiteralProblem[]): RingLiteralInfo["order"] {
  if (value.kind === "Identifier" && ORDER_NAMES.includes(value.name)) {
    return { kind: value.name as "grevlex" | "lex" | "glex" };
  }
  if (value.kind === "Call" && value.callee.kind === "Identifier" && value.callee.name === "weights" && value.named.length === 0) {
    const weights = positiveIntList({ kind: "Tuple", items: value.args, span: value.span }, "weights", problems);
    if (weights && weights.length !== nvars) {
      problems.push({
        message: `weights(…) needs one weight per variable: ${nvars} variable${nvars === 1 ? "" : "s"}, got ${weights.length} weight${weights.length === 1 ? "" : "s"}`,
        span: value.span,
      });
    }
    return { kind: "weights", weights: weights ?? [] };
  }
  const found = value.kind === "Identifier" ? `\`${value.name}\`` : "this expression";
  const guess = value.kind === "Identifier" ? nearest(value.name, [...ORDER_NAMES, "weights"]) : undefined;
  problems.push({
    message: `order must be grevlex, lex, glex or weights(w1, …, wn), got ${found}${guess ? ` — did you mean ${guess}?` : ""}`,
    span: value.span,
  });
  return { kind: "grevlex" };
}

/// Reads the bracket contents of a ring literal. Problems are reported, never thrown;
/// the result is usable even with problems (the evaluator only runs checked programs).
export function readRingLiteral(node: Subscript, problems: RingLiteralProblem[] = []): RingLiteralInfo {
  const vars: string[] = [];
  const seen = new Map<string, Span>();
  const add = (name: string, span: Span) => {
    if (seen.has(name)) {
      problems.push({ message: `the variable ${name} appears twice in this ring — each variable must have its own name`, span });
      return;
    }
    seen.set(name, span);
    vars.push(name);
  };
  for (const item of node.items) {
    if (item.kind === "Identifier") add(item.name, item.span);
    else if (item.kind === "Range" && item.from.kind === "Identifier" && item.to.kind === "Identifier") {
      const r = expandRange(item.from.name, item.to.name);
      if (typeof r === "string") problems.push({ message: r, span: item.span });
      else for (const v of r) add(v, item.span);
    } else if (item.kind !== "ErrorExpr") {
      problems.push({
        message: "a ring's variables must be names or ranges of names (x, y, x1..x6, a..e)",
        span: item.span,
      });
    }
  }
  if (node.items.length === 0) {
    problems.push({ message: "a polynomial ring needs at least one variable, as in Q[x, y]", span: node.span });
  }
  if (vars.length > MAX_VARIABLES) {
    problems.push({ message: `this ring has ${vars.length} variables, more than the limit ${MAX_VARIABLES}`, span: node.span });
  }
  let order: RingLiteralInfo["order"] = { kind: "grevlex" };
  let degrees: number[] | null = null;
  const given = new Set<string>();
  for (const opt of node.options) readOption(opt);
  return { kind: "ring", vars, order, degrees };

  function readOption(opt: NamedArg): void {
    const name = opt.name.name;
    if (given.has(name)) {
      problems.push({ message: `the option ${name} is given twice`, span: opt.name.span });
      return;
    }
    given.add(name);
    if (name === "order") order = readOrder(opt.value, vars.length, problems);
    else if (name === "degrees") {
      degrees = positiveIntList(opt.value, "degrees", problems);
      if (degrees && degrees.length !== vars.length) {
        problems.push({
          message: `degrees needs one degree per variable: ${vars.length} variable${vars.length === 1 ? "" : "s"}, got ${degrees.length}`,
          span: opt.value.span,
        });
      }
    } else if (name !== "") {
      const valid = RING_OPTIONS.map((o) => o.name);
      const guess = nearest(name, valid);
      problems.push({
        message: `a ring has no option \`${name}\`; its options are ${valid.join(" and ")}${guess ? ` — did you mean ${guess}?` : ""}`,
        span: opt.name.span,
      });
    }
  }
}

/// The ring described by a ring literal node, for the evaluator.
export function ringLiteralInfo(node: Subscript): RingLiteralInfo {
  return readRingLiteral(node);
}
