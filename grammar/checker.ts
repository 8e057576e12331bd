/// The type checker: walks a parsed program statement by statement with an
/// environment of bindings, gives every expression a type from the signature table,
/// and reports every misuse with where, what was expected, what was found and the
/// obvious fix. Never throws on any AST the parser produces.
import { LIMIT_TABLE } from "../lib/limits";
import type * as A from "./ast";
import type { Analysis, Diagnostic, Env, NameResolution, SubscriptInfo } from "./analysis";
import type { ParseResult } from "./parser";
import { readRingLiteral } from "./ring-literal";
import { gradedProblems } from "./graded-check";
import {
  CONSTANTS,
  FUNCTIONS,
  lookupFunction,
  lookupProperty,
  operatorRows,
  ORDER_NAMES,
  propertiesOf,
  type FunctionSig,
  type OperatorName,
  type OperatorSig,
  type Overload,
  type PropertySig,
} from "./signatures";
import { isPrime, nearest, nextPrime, previousPrime } from "./suggest";
import { isAssignable, isFamilyMember, joinTypes, makeUnion, orNone, sameType, T, typeToString, withArticle, type Type } from "./types";

/// Literal exponents above this are refused before anything runs.
export const MAX_LITERAL_EXPONENT = BigInt(LIMIT_TABLE.literalExponent.value);
const MAX_PRIME = 2n ** 31n;
const MAX_LAMBDA_DEPTH = 8;
/// Deeper expressions are refused rather than risking the call stack.
const MAX_DEPTH = LIMIT_TABLE.expressionNesting.value;

const constantIndex = new Map(CONSTANTS.map((c) => [c.name, c]));
const functionNames = FUNCTIONS.map((f) => f.name);

interface LambdaInfo {
  readonly node: A.Lambda;
  readonly locals: readonly Map<string, Type>[];
  readonly ring: string | null;
}

/// The value of an integer constant expression, when it is one (literals, parentheses,
/// unary minus, + - * and small powers), else null.
export function constValue(e: A.Expr): bigint | null {
  switch (e.kind) {
    case "IntLit":
      return e.value;
    case "Unary": {
      if (e.op !== "-") return null;
      const v = constValue(e.operand);
      return v === null ? null : -v;
    }
    case "Binary": {
      if (!["+", "-", "*", "^"].includes(e.op)) return null;
      const a = constValue(e.left);
      const b = constValue(e.right);
      if (a === null || b === null) return null;
      if (e.op === "+") return a + b;
      if (e.op === "-") return a - b;
      if (e.op === "*") return a * b;
      if (b < 0n || b > 64n || (a !== 0n && a !== 1n && a !== -1n && b * BigInt(a.toString(2).length) > 4096n)) return null;
      return a ** b;
    }
    default:
      return null;
  }
}

class Checker {
  readonly errors: Diagnostic[] = [];
  readonly types = new Map<A.Expr, Type>();
  readonly names = new Map<A.Identifier, NameResolution>();
  readonly subscripts = new Map<A.Subscript, SubscriptInfo>();
  private readonly lambdas = new WeakMap<Type, LambdaInfo>();
  private readonly bindings: Map<string, Type>;
  /// Every definition in order, to rebuild the environment before any statement.
  readonly definitions: [string, Type][] = [];
  private currentRing: string | null;
  /// While checking the right side of `A / …` with A a Ring: its literals and variables are
  /// read in A (the text of the left side, and A's variables when known), not the current ring.
  private readIn: { readonly label: string; readonly vars: readonly string[] | null } | null = null;
  private locals: Map<string, Type>[] = [];
  private lambdaDepth = 0;
  private seen = new Set<string>();
  private depth = 0;
  private tooDeep = false;

  constructor(
    private readonly source: string,
    env: Env,
  ) {
    this.bindings = new Map(Object.entries(env.bindings));
    this.currentRing = env.currentRing;
  }

  env(): Env {
    return { bindings: Object.fromEntries(this.bindings), currentRing: this.currentRing };
  }

  ring(): string | null {
    return this.currentRing;
  }

  // ---- reporting -----------------------------------------------------------------

  private error(span: A.Span, message: string): void {
    const key = `${span.from.offset}:${span.to.offset}:${message}`;
    if (this.seen.has(key)) return;
    this.seen.add(key);
    this.errors.push({ kind: "type", message, span });
  }

  private text(node: { span: A.Span }): string {
    return this.source.slice(node.span.from.offset, node.span.to.offset);
  }

  /// Source of `outer` with the text of `inner` replaced.
  private replaced(outer: { span: A.Span }, inner: { span: A.Span }, by: string): string {
    const o = outer.span.from.offset;
    return this.source.slice(o, inner.span.from.offset) + by + this.source.slice(inner.span.to.offset, outer.span.to.offset);
  }

  private ringName(): string {
    return this.currentRing ?? "S";
  }

  /// The ring literals are read in: the left side of an enclosing quotient, else the current ring.
  private readingRing(): string | null {
    return this.readIn ? this.readIn.label : this.currentRing;
  }

  private currentVars(): readonly string[] | null {
    if (this.readIn) return this.readIn.vars;
    if (this.currentRing === null) return null;
    const t = this.bindings.get(this.currentRing);
    return t && t.kind === "Ring" ? t.vars : null;
  }

  // ---- statements ----------------------------------------------------------------

  statement(s: A.Statement, broken: boolean): void {
    if (s.kind === "Use") return this.use(s);
    if (s.kind === "Define") {
      const t = broken ? T.Any : this.infer(s.value);
      if (!broken) this.checkDefinable(s.name);
      this.bindings.set(s.name.name, t);
      this.definitions.push([s.name.name, t]);
      if (t.kind === "Ring") this.currentRing = s.name.name;
      else if (this.currentRing === s.name.name) this.currentRing = null;
      return;
    }
    if (!broken) this.infer(s.expr);
  }

  private checkDefinable(name: A.Name): void {
    const n = name.name;
    if (lookupFunction(n)) this.error(name.span, `${n} is a built-in function and cannot be redefined — choose another name`);
    else if (constantIndex.has(n)) this.error(name.span, `${n} is predefined and cannot be redefined — choose another name`);
    else if (this.currentVars()?.includes(n)) {
      this.error(
        name.span,
        `${n} is a variable of the current ring ${this.currentRing}, so it cannot also name a value — choose another name, e.g. ${n}_1`,
      );
    }
  }

  private use(s: A.Use): void {
    const n = s.name.name;
    const t = this.bindings.get(n);
    if (t === undefined) {
      const rings = [...this.bindings].filter(([, v]) => v.kind === "Ring").map(([k]) => k);
      const guess = nearest(n, rings);
      this.error(
        s.name.span,
        `use expects the name of a ring, but ${n} is not defined${guess ? ` — did you mean use ${guess}?` : rings.length ? ` (rings defined: ${rings.join(", ")})` : ""}`,
      );
      return;
    }
    if (t.kind === "Any") {
      this.currentRing = n;
      return;
    }
    if (t.kind !== "Ring") {
      this.error(s.name.span, `use expects a Ring, got ${typeToString(t)}`);
      return;
    }
    this.currentRing = n;
  }

  // ---- expressions ---------------------------------------------------------------

  infer(e: A.Expr): Type {
    if (this.depth >= MAX_DEPTH) {
      if (!this.tooDeep)
        this.error(e.span, `this expression is nested more than ${MAX_DEPTH} levels deep — split it into several definitions`);
      this.tooDeep = true;
      this.types.set(e, T.Any);
      return T.Any;
    }
    this.depth++;
    try {
      const t = this.inferInner(e);
      this.types.set(e, t);
      return t;
    } finally {
      this.depth--;
    }
  }

  private inferInner(e: A.Expr): Type {
    switch (e.kind) {
      case "IntLit":
        return T.Int;
      case "StrLit":
        return T.Str;
      case "BoolLit":
        return T.Bool;
      case "ErrorExpr":
        return T.Any;
      case "Identifier":
        return this.identifier(e);
      case "Binary":
        return this.binary(e);
      case "Unary":
        return this.unary(e);
      case "Range":
        return this.range(e);
      case "IdealLit":
        return this.idealLiteral(e);
      case "ListLit":
        return T.list(e.items.map((i) => this.infer(i)).reduce<Type | null>((a, b) => (a ? joinTypes(a, b) : b), null) ?? T.Any);
      case "MatrixLit":
        return this.matrixLiteral(e);
      case "Comprehension":
        return this.comprehension(e);
      case "RecordLit":
        return this.recordLiteral(e);
      case "Tuple":
        e.items.forEach((i) => this.infer(i));
        this.error(
          e.span,
          e.items.length === 0
            ? "`()` is only allowed as the parameters of a function, as in `() -> 1`"
            : `parentheses with commas make a value only as a ring option (degrees = (1, 2)) — for a List write [${e.items.map((i) => this.text(i)).join(", ")}]`,
        );
        return T.Any;
      case "Lambda":
        return this.lambda(e);
      case "If": {
        this.expect(e.cond, T.Bool, "the condition of `if`");
        return joinTypes(this.infer(e.then), this.infer(e.else));
      }
      case "Call":
        return this.call(e);
      case "Property":
        return this.property(e);
      case "Subscript":
        return this.subscript(e);
    }
  }

  private expect(e: A.Expr, want: Type, what: string): Type {
    const t = this.infer(e);
    if (!isAssignable(t, want)) this.error(e.span, `${what} must be ${withArticle(want)}, got ${typeToString(t)}`);
    return t;
  }

  private lookupLocal(name: string): Type | undefined {
    for (let i = this.locals.length - 1; i >= 0; i--) {
      const t = this.locals[i].get(name);
      if (t !== undefined) return t;
    }
    return undefined;
  }

  private identifier(e: A.Identifier): Type {
    const n = e.name;
    const local = this.lookupLocal(n);
    if (local !== undefined) {
      this.names.set(e, { kind: "local" });
      return local;
    }
    const vars = this.currentVars();
    const index = vars ? vars.indexOf(n) : -1;
    if (vars && index >= 0) {
      this.names.set(e, { kind: "variable", ring: this.readingRing()!, index });
      return T.Poly;
    }
    const bound = this.bindings.get(n);
    if (bound !== undefined) {
      this.names.set(e, { kind: "binding" });
      return bound;
    }
    const c = constantIndex.get(n);
    if (c) {
      this.names.set(e, { kind: "constant" });
      return c.type;
    }
    if (lookupFunction(n)) {
      this.names.set(e, { kind: "function" });
      this.error(e.span, `${n} is a built-in function: call it, as in ${lookupFunction(n)!.example}`);
      return T.Any;
    }
    const reading = this.readingRing();
    if (reading !== null && vars === null) {
      // The ring's variables are not known statically: leave it to run time.
      this.names.set(e, { kind: "variable", ring: reading, index: -1 });
      return T.Poly;
    }
    this.names.set(e, { kind: "unknown" });
    if (ORDER_NAMES.includes(n)) {
      this.error(e.span, `${n} names a monomial order; orders are given inside ring brackets, as in Q[x, y; order = ${n}]`);
      return T.Any;
    }
    this.error(e.span, this.unknownNameMessage(n, vars));
    return T.Any;
  }

  private unknownNameMessage(n: string, vars: readonly string[] | null): string {
    const candidates = [...(vars ?? []), ...this.bindings.keys(), ...this.locals.flatMap((m) => [...m.keys()])];
    const guess = nearest(n, candidates);
    const hint = guess ? ` — did you mean ${guess}?` : "";
    if (this.readIn) {
      return `unknown name ${n}: it is not defined and not a variable of ${this.readIn.label}, the ring on the left of / (variables: ${(vars ?? []).join(", ")})${hint}`;
    }
    if (this.currentRing === null) {
      return `unknown name ${n}: it is not defined, and there is no current ring to read it as a variable — define a ring first, e.g. S := Q[${n}]${hint}`;
    }
    return `unknown name ${n}: it is not defined and not a variable of the current ring ${this.currentRing} (variables: ${(vars ?? []).join(", ")})${hint}`;
  }

  private needRing(e: A.Expr, what: string): void {
    if (this.readingRing() === null) {
      this.error(e.span, `${what} is read in the current ring, and there is none — define a ring first, e.g. S := Q[x, y]`);
    }
  }

  private idealLiteral(e: A.IdealLit): Type {
    this.needRing(e, "an ideal literal");
    for (const g of e.gens) {
      const t = this.infer(g);
      if (!isAssignable(t, T.Poly)) {
        const fix = t.kind === "Ideal" ? ` — to add ideals write ${this.text(g)} + …` : "";
        this.error(g.span, `the generators of an ideal must be polynomials, got ${typeToString(t)}${fix}`);
      }
    }
    return T.Ideal;
  }

  private matrixLiteral(e: A.MatrixLit): Type {
    this.needRing(e, "a matrix literal");
    const width = e.rows[0]?.length ?? 0;
    e.rows.forEach((row, i) => {
      for (const x of row) {
        const t = this.infer(x);
        if (!isAssignable(t, T.Poly)) this.error(x.span, `the entries of a matrix must be polynomials, got ${typeToString(t)}`);
      }
      if (row.length !== width && row.length > 0) {
        const from = row[0].span.from;
        this.error(
          { from, to: row[row.length - 1].span.to },
          `every row of a matrix needs the same number of entries: row ${i + 1} has ${row.length}, row 1 has ${width}`,
        );
      }
    });
    return T.Matrix;
  }

  private comprehension(e: A.Comprehension): Type {
    const scope = new Map<string, Type>();
    this.locals.push(scope);
    for (const c of e.clauses) {
      const src = this.infer(c.source);
      let item: Type = T.Any;
      if (src.kind === "List") item = src.item;
      else if (src.kind === "Family") item = src.member;
      else if (src.kind !== "Any") {
        this.error(c.source.span, `\`for ${c.name.name} in …\` needs a List, a range such as 1..5, or a Family; got ${typeToString(src)}`);
      }
      scope.set(c.name.name, item);
    }
    const t = this.infer(e.element);
    this.locals.pop();
    return T.list(t);
  }

  private recordLiteral(e: A.RecordLit): Type {
    const fields: Record<string, Type> = {};
    for (const f of e.fields) {
      if (f.name.name in fields) this.error(f.name.span, `the field ${f.name.name} appears twice in this record`);
      fields[f.name.name] = this.infer(f.value);
    }
    return T.record(fields);
  }

  private lambda(e: A.Lambda, params?: readonly Type[]): Type {
    const scope = new Map<string, Type>();
    e.params.forEach((p, i) => {
      if (scope.has(p.name)) this.error(p.span, `the parameter ${p.name} appears twice`);
      scope.set(p.name, params?.[i] ?? T.Any);
    });
    this.locals.push(scope);
    const result = this.infer(e.body);
    this.locals.pop();
    const t = T.fn(
      e.params.map((_, i) => params?.[i] ?? T.Any),
      result,
    );
    if (!params) this.lambdas.set(t, { node: e, locals: [...this.locals], ring: this.currentRing });
    return t;
  }

  /// The result of applying a function value to arguments: a lambda is checked again
  /// with the argument types, so `sweep(F, I -> burch_index(I))` is caught.
  private applyFunction(f: Type, args: readonly Type[], at: A.Span, what: string): Type {
    if (f.kind === "Any") return T.Any;
    if (f.kind !== "Function") return T.Any;
    if (f.params !== null && f.params.length !== args.length) {
      this.error(at, `${what} takes ${f.params.length} argument${f.params.length === 1 ? "" : "s"}, got ${args.length}`);
      return f.result;
    }
    const info = this.lambdas.get(f);
    if (!info || this.lambdaDepth >= MAX_LAMBDA_DEPTH) return f.result;
    const saved = { locals: this.locals, ring: this.currentRing, readIn: this.readIn };
    this.locals = [...info.locals];
    this.currentRing = info.ring;
    this.readIn = null;
    this.lambdaDepth++;
    try {
      const t = this.lambda(info.node, args);
      return t.kind === "Function" ? t.result : T.Any;
    } finally {
      this.lambdaDepth--;
      this.locals = saved.locals;
      this.currentRing = saved.ring;
      this.readIn = saved.readIn;
    }
  }

  // ---- operators -----------------------------------------------------------------

  /// The result type for an operator, from the table; undefined when no row fits.
  private operator(op: OperatorName, left: Type | undefined, right: Type): Type | undefined {
    const rows = operatorRows(op, left === undefined);
    const fits = (r: OperatorSig) => {
      const binds = new Map<string, Type>();
      return (left === undefined || matchParam(r.left!, left, binds)) && matchParam(r.right, right, binds) && bindsAgree(binds);
    };
    const matching = rows.filter(fits);
    if (matching.length === 0) return undefined;
    const anyInvolved = left?.kind === "Any" || right.kind === "Any";
    const results = matching.map((r) => {
      const binds = new Map<string, Type>();
      if (left !== undefined) matchParam(r.left!, left, binds);
      matchParam(r.right, right, binds);
      return substitute(r.result, binds);
    });
    if (!anyInvolved) return results[0];
    return results.every((r) => sameType(r, results[0])) ? results[0] : T.Any;
  }

  /// Long sums and products are left-deep trees (a pasted polynomial may have
  /// thousands of terms): walk the left spine with a loop, not recursion.
  private binary(e: A.Binary): Type {
    const spine: A.Binary[] = [];
    let bottom: A.Expr = e;
    while (bottom.kind === "Binary") {
      spine.push(bottom);
      bottom = bottom.left;
    }
    let l = this.infer(bottom);
    for (let i = spine.length - 1; i > 0; i--) {
      l = this.binaryStep(spine[i], l);
      this.types.set(spine[i], l);
    }
    return this.binaryStep(e, l);
  }

  private binaryStep(e: A.Binary, l: Type): Type {
    const r = e.op === "/" && l.kind === "Ring" ? this.inferReadIn(e.right, this.text(e.left), l.vars) : this.infer(e.right);
    if (e.op === "^" && this.checkExponent(e, r)) return l.kind === "Ideal" || l.kind === "Poly" ? l : T.Any;
    if (e.op === "/" && constValue(e.right) === 0n) {
      this.error(e.right.span, `division by zero: ${this.text(e)} divides by ${this.text(e.right)}, which is 0`);
      return l.kind === "Int" ? T.Rat : l;
    }
    if (e.op === "==" || e.op === "!=") {
      if (isAssignable(l, r) || isAssignable(r, l)) return T.Bool;
    }
    const t = this.operator(e.op, l, r);
    // A quotient keeps the variables of the ring it was formed from.
    if (t?.kind === "Ring" && l.kind === "Ring") return l;
    if (t !== undefined) return t;
    this.error(e.opSpan, this.operatorMessage(e, l, r));
    return T.Any;
  }

  /// `A / <f, …>` reads its ideal in A, whatever ring is current (notation: grammar/README.md).
  private inferReadIn(e: A.Expr, label: string, vars: readonly string[] | null): Type {
    const saved = this.readIn;
    this.readIn = { label, vars };
    try {
      return this.infer(e);
    } finally {
      this.readIn = saved;
    }
  }

  /// Reports a bad exponent; true when it did.
  private checkExponent(e: A.Binary, r: Type): boolean {
    const v = constValue(e.right);
    if (v !== null && v < 0n) {
      this.error(
        e.right.span,
        `negative power: ${this.text(e)} — powers must be non-negative integers (there are no inverses of polynomials here)`,
      );
    } else if (v !== null && v > MAX_LITERAL_EXPONENT) {
      this.error(e.right.span, `power too large: the exponent ${v} is above the limit 10^6`);
    } else if (r.kind === "Rat") {
      this.error(e.right.span, `powers must be non-negative integers, got the Rat ${this.text(e.right)}`);
    } else return false;
    return true;
  }

  private operatorMessage(e: A.Binary, l: Type, r: Type): string {
    const ls = typeToString(l);
    const rs = typeToString(r);
    const rows = operatorRows(e.op, false);
    const shapes = [...new Set(rows.map((row) => `${typeToString(row.left!)} ${e.op} ${typeToString(row.right)}`))];
    let fix = "";
    const lt = this.text(e.left);
    const rt = this.text(e.right);
    if (e.op === "/" && l.kind === "Poly" && r.kind === "Poly") {
      return `cannot divide by the polynomial ${rt}: division is only by nonzero constants (for a quotient ring write ${this.ringName()} / <${rt}>)`;
    }
    if (e.op === "/" && l.kind === "Ring" && r.kind === "Poly") fix = ` — did you mean ${lt} / <${rt}>?`;
    else if (e.op === "/" && l.kind === "Ideal" && (r.kind === "Ideal" || r.kind === "Poly"))
      fix = ` — for the colon ideal write ${lt} : ${rt}; for a quotient ring, ${this.ringName()} / ${wrap(e.left, lt)}`;
    else if ((e.op === "+" || e.op === "&") && l.kind === "Ideal" && isAssignable(r, T.Poly))
      fix = ` — did you mean ${lt} ${e.op} <${rt}>?`;
    else if ((e.op === "+" || e.op === "&") && r.kind === "Ideal" && isAssignable(l, T.Poly))
      fix = ` — did you mean <${lt}> ${e.op} ${rt}?`;
    else if (e.op === "in" && isAssignable(l, T.Poly) && isAssignable(r, T.Poly)) fix = ` — did you mean ${lt} in <${rt}>?`;
    else if (e.op === "in" && l.kind === "Ideal" && r.kind === "Ideal") fix = ` — for containment write ${lt} <= ${rt}`;
    const wanted = shapes.length <= 8 ? `; it applies to ${shapes.join(", ")}` : "";
    return `\`${e.op}\` does not apply to ${ls} ${e.op} ${rs}${wanted}${fix}`;
  }

  private unary(e: A.Unary): Type {
    const t = this.infer(e.operand);
    const r = this.operator(e.op, undefined, t);
    if (r !== undefined) return r;
    this.error(e.span, e.op === "not" ? `not expects a Bool, got ${typeToString(t)}` : `\`-\` cannot negate ${withArticle(t)}`);
    return T.Any;
  }

  private range(e: A.Range): Type {
    const a = this.infer(e.from);
    const b = this.infer(e.to);
    if (!isAssignable(a, T.Int) || !isAssignable(b, T.Int)) {
      const vars = e.from.kind === "Identifier" && e.to.kind === "Identifier";
      this.error(
        e.span,
        `a range a..b needs two Int, got ${typeToString(a)} and ${typeToString(b)}${vars ? " (ranges of variable names belong inside ring brackets, as in Q[x1..x6])" : ""}`,
      );
    }
    return T.list(T.Int);
  }

  // ---- calls, properties, subscripts ---------------------------------------------

  private call(e: A.Call): Type {
    const c = e.callee;
    if (c.kind === "Identifier" && this.lookupLocal(c.name) === undefined && !this.bindings.has(c.name)) {
      const sig = lookupFunction(c.name);
      if (sig) {
        this.names.set(c, { kind: "function" });
        return this.builtinCall(e, sig);
      }
      if (!this.currentVars()?.includes(c.name) && !constantIndex.has(c.name)) {
        this.names.set(c, { kind: "unknown" });
        e.args.forEach((a) => this.infer(a));
        e.named.forEach((n) => this.infer(n.value));
        if (c.name === "weights") {
          this.error(c.span, "weights(…) gives a monomial order inside ring brackets, as in Q[x, y; order = weights(1, 2)]");
          return T.Any;
        }
        const guess = nearest(c.name, functionNames);
        this.error(c.span, `unknown function ${c.name}${guess ? ` — did you mean ${guess}?` : " (the reference lists every function)"}`);
        return T.Any;
      }
    }
    if (c.kind === "Property") return this.methodCall(e, c);
    const f = this.infer(c);
    const args = e.args.map((a) => this.infer(a));
    e.named.forEach((n) => {
      this.infer(n.value);
      this.error(n.name.span, `named arguments go only to built-in functions; ${this.text(c)} is a function value`);
    });
    if (f.kind === "Function") return this.applyFunction(f, args, e.span, this.text(c));
    if (f.kind === "Any") return T.Any;
    const times = isAssignable(f, T.Poly) || f.kind === "Ideal" || f.kind === "Matrix";
    const inner = this.source.slice(c.span.to.offset, e.span.to.offset).trim();
    this.error(
      c.span,
      `${this.text(c)} is ${withArticle(f)}, not a function${times ? ` — there is no implicit multiplication; did you mean ${this.text(c)}*${inner}?` : ""}`,
    );
    return T.Any;
  }

  private builtinCall(e: A.Call, sig: FunctionSig): Type {
    const argTypes = e.args.map((a) => this.infer(a));
    this.checkOptions(e, sig);
    this.checkLiteralArguments(e, sig);
    for (const o of sig.overloads) {
      const binds = new Map<string, Type>();
      if (!arityFits(o, argTypes.length)) continue;
      if (argTypes.every((t, i) => matchParam(paramAt(o, i).type, t, binds)) && bindsAgree(binds)) {
        const result = substitute(o.result, binds);
        if (sig.name === "sweep") return this.sweepResult(e, argTypes, binds.get("X") ?? T.Any);
        if (sig.name === "find") return this.findResult(e, argTypes, binds.get("X") ?? T.Any);
        if (result.kind === "Family" && !isFamilyMember(result.member)) {
          this.error(e.args[0].span, `a Family's members are rings, ideals or modules; got ${typeToString(argTypes[0])}`);
        }
        // a local ring has the variables of the ring it localises
        if (sig.name === "localize" && argTypes[0].kind === "Ring") return argTypes[0];
        return result;
      }
    }
    this.reportBadArguments(e, sig, argTypes);
    return sig.overloads.length === 1 ? substitute(sig.overloads[0].result, new Map()) : T.Any;
  }

  /// A sweep's table has the probe's record fields as columns; the probe is checked
  /// on a member of the family (an Ideal for the generated families). Whether the sweep runs
  /// inline (a Table) or becomes a background experiment (an Experiment) is decided when it
  /// runs — by the family's size against inlineSweepMembers, and by where (the CLI always runs
  /// inline) — so the type is `Table or Experiment`, narrowed to Table by `background = false`.
  private sweepResult(e: A.Call, argTypes: Type[], member: Type): Type {
    const fields = this.probeFields(e, argTypes[1], member, "sweep");
    const table = T.table(fields && { index: T.Int, label: T.Str, status: T.Str, seconds: T.Rat, ...fields });
    const background = e.named.find((n) => n.name.name === "background")?.value;
    const inline = background?.kind === "BoolLit" && !background.value;
    return inline ? table : T.union(table, T.Experiment);
  }

  /// The probe's Record fields, or null when not known; reports a probe that returns no Record.
  private probeFields(e: A.Call, probe: Type, member: Type, what: string): Readonly<Record<string, Type>> | null {
    if (probe.kind !== "Function") return null;
    const r = this.applyFunction(probe, [member], e.args[1].span, "the probe");
    if (r.kind === "Record") return r.fields;
    if (r.kind !== "Any") {
      this.error(
        e.args[1].span,
        `${what}'s probe must return a Record (its fields become the columns), e.g. I -> {dim: I.dim}; this one returns ${typeToString(r)}`,
      );
    }
    return null;
  }

  /// `find(F, probe, where = pred)`: pred is checked on the probe's row (a Record) and must
  /// give a Bool; the result is {index, member, row, tried} or none.
  private findResult(e: A.Call, argTypes: Type[], member: Type): Type {
    const fields = this.probeFields(e, argTypes[1], member, "find");
    const row = T.record(fields && { index: T.Int, label: T.Str, status: T.Str, seconds: T.Rat, ...fields });
    const where = e.named.find((n) => n.name.name === "where");
    if (!where) this.error(e.span, "find needs a predicate on the probe's row: find(F, probe, where = r -> r.depth == 0)");
    else {
      const pred = this.types.get(where.value) ?? T.Any;
      if (pred.kind === "Function") {
        const b = this.applyFunction(pred, [row], where.value.span, "the predicate");
        if (!isAssignable(b, T.Bool)) this.error(where.value.span, `find's predicate must give a Bool, this one gives ${typeToString(b)}`);
      }
    }
    return orNone(T.record({ index: T.Int, member, row, tried: T.Int }));
  }

  private reportBadArguments(e: A.Call, sig: FunctionSig, argTypes: Type[]): void {
    const n = argTypes.length;
    const byArity = sig.overloads.filter((o) => arityFits(o, n));
    if (byArity.length === 0) {
      const counts = [...new Set(sig.overloads.map((o) => (o.rest ? `${o.params.length} or more` : String(o.params.length))))];
      const plural = counts.length === 1 && counts[0] === "1" ? "argument" : "arguments";
      this.error(e.span, `${sig.name} expects ${counts.join(" or ")} ${plural}, got ${n} — as in ${sig.example}`);
      return;
    }
    for (let i = 0; i < n; i++) {
      const wanted = makeUnion(byArity.map((o) => paramAt(o, i).type));
      if (byArity.some((o) => matchParam(paramAt(o, i).type, argTypes[i], new Map()))) continue;
      const arg = e.args[i];
      const got = argTypes[i];
      this.error(arg.span, `${sig.name} expects ${withArticle(wanted)}, got ${typeToString(got)}${this.argumentFix(e, arg, wanted, got)}`);
      return;
    }
    this.error(e.span, `${sig.name} cannot take these arguments together — as in ${sig.example}`);
  }

  private argumentFix(call: A.Call, arg: A.Expr, wanted: Type, got: Type): string {
    const at = this.text(arg);
    const wants = (k: string) => (wanted.kind === "Union" ? wanted.options.some((o) => o.kind === k) : wanted.kind === k);
    const quotient = `${this.ringName()} / ${wrap(arg, at)}`;
    if (got.kind === "Ideal" && wants("Ring")) return ` — did you mean ${this.replaced(call, arg, quotient)}?`;
    if (got.kind === "Ideal" && wants("Module")) {
      return ` — did you mean ${this.replaced(call, arg, quotient)} (the quotient) or ${this.replaced(call, arg, `module(${at})`)} (the ideal as a module)?`;
    }
    if (got.kind === "List" && wants("Ideal")) return ` — did you mean ${this.replaced(call, arg, `ideal(${at})`)}?`;
    if (isAssignable(got, T.Poly) && got.kind !== "Any" && wants("Ideal")) return ` — did you mean ${this.replaced(call, arg, `<${at}>`)}?`;
    if (got.kind === "Ring" && wants("Ideal")) return ` — did you mean ${this.replaced(call, arg, `${wrap(arg, at)}.ideal`)}?`;
    if (got.kind === "Field" && wants("Ring")) return ` — a ring is built from a field, as in ${at}[x, y]`;
    return "";
  }

  private checkOptions(e: A.Call, sig: FunctionSig): void {
    const given = new Set<string>();
    for (const n of e.named) {
      const name = n.name.name;
      const vt = this.infer(n.value);
      if (name === "") continue;
      const opt = sig.options.find((o) => o.name === name);
      if (!opt) {
        const valid = sig.options.map((o) => o.name);
        const guess = nearest(name, valid);
        this.error(
          n.name.span,
          valid.length === 0
            ? `${sig.name} takes no named options, got ${name}`
            : `${sig.name} has no option ${name}; its options are ${valid.join(", ")}${guess ? ` — did you mean ${guess}?` : ""}`,
        );
        continue;
      }
      if (given.has(name)) this.error(n.name.span, `the option ${name} is given twice`);
      given.add(name);
      if (!isAssignable(vt, opt.type)) {
        this.error(n.value.span, `the option ${name} of ${sig.name} must be ${withArticle(opt.type)}, got ${typeToString(vt)}`);
      }
      const v = constValue(n.value);
      if (v !== null && v < 0n) this.error(n.value.span, `the option ${name} must not be negative, got ${v}`);
    }
  }

  /// Checks that need the value of a literal argument (non-literal values are checked
  /// by the engine when the program runs).
  private checkLiteralArguments(e: A.Call, sig: FunctionSig): void {
    const lit = (i: number) => (e.args[i] ? constValue(e.args[i]) : null);
    if (sig.name === "GF") {
      const p = lit(0);
      if (p === null) return;
      if (p >= MAX_PRIME) {
        const below = previousPrime(MAX_PRIME - 1n);
        this.error(e.args[0].span, `GF(p) needs a prime p < 2^31, got ${p}, which is too large — the largest allowed is ${below}`);
      } else if (!isPrime(p)) {
        const lower = previousPrime(p - 1n);
        const upper = nextPrime(p + 1n);
        this.error(
          e.args[0].span,
          `GF(p) needs a prime p < 2^31, got ${p}, which is not prime — did you mean GF(${upper})${lower !== undefined && p > 1n ? ` or GF(${lower})` : ""}?`,
        );
      }
    } else if (sig.name === "minors" || sig.name === "pfaffians") {
      const k = lit(1);
      if (k !== null && k < 1n) this.error(e.args[1].span, `${sig.name} needs a size k ≥ 1, got ${k}`);
      else if (k !== null && sig.name === "pfaffians" && k % 2n !== 0n) {
        this.error(
          e.args[1].span,
          `Pfaffians are defined for even sizes k, got ${k} — did you mean pfaffians(${this.text(e.args[0])}, ${k + 1n})?`,
        );
      }
    } else if (["syzygy", "tor", "ext"].includes(sig.name)) {
      const i = sig.name === "syzygy" ? 1 : 0;
      const v = lit(i);
      if (v !== null && v < 0n) this.error(e.args[i].span, `${sig.name} needs a homological degree ≥ 0, got ${v}`);
    }
  }

  private methodCall(e: A.Call, c: A.Property): Type {
    const obj = withoutNone(this.infer(c.object));
    const args = e.args.map((a) => this.infer(a));
    e.named.forEach((n) => {
      this.infer(n.value);
      this.error(n.name.span, `the method ${c.name.name} takes no named options`);
    });
    if (obj.kind === "Any") return T.Any;
    if (obj.kind === "Record") {
      const field = obj.fields?.[c.name.name];
      if (field?.kind === "Function") return this.applyFunction(field, args, e.span, this.text(c));
      if (obj.fields && field === undefined) {
        this.error(c.name.span, this.noFieldMessage(c.name.name, obj.fields));
        return T.Any;
      }
      if (field === undefined || field.kind === "Any") return T.Any;
      this.error(c.name.span, `the field ${c.name.name} is ${withArticle(field)}, not a function`);
      return T.Any;
    }
    const sig = this.propertyOf(obj, c);
    if (!sig) return T.Any;
    if (sig.params === null) {
      this.error(e.span, `${c.name.name} is a property, not a method: write ${this.text(c)}`);
      return sig.result;
    }
    if (args.length !== sig.params.length) {
      const names = sig.params.map((p) => p.name).join(", ");
      this.error(
        e.span,
        `${obj.kind}.${c.name.name} expects ${sig.params.length} argument${sig.params.length === 1 ? "" : "s"} (${names}), got ${args.length}`,
      );
      return sig.result;
    }
    sig.params.forEach((p, i) => {
      if (!isAssignable(args[i], p.type)) {
        this.error(e.args[i].span, `${obj.kind}.${c.name.name} expects ${withArticle(p.type)} for ${p.name}, got ${typeToString(args[i])}`);
      }
    });
    return this.methodResult(obj, sig, args, e);
  }

  /// A method's result, where it depends on the object: F.take / F.filter keep the Family's
  /// member type, T.where keeps the Table's columns; predicates are checked on an item.
  private methodResult(obj: Type, sig: PropertySig, args: Type[], e: A.Call): Type {
    const item = obj.kind === "Family" ? obj.member : obj.kind === "Table" ? T.record(obj.columns) : null;
    if (item && (sig.name === "filter" || sig.name === "where") && args[0]?.kind === "Function") {
      const b = this.applyFunction(args[0], [item], e.args[0].span, "the predicate");
      if (!isAssignable(b, T.Bool))
        this.error(e.args[0].span, `${sig.name} needs a predicate giving a Bool, this one gives ${typeToString(b)}`);
    }
    if (obj.kind === sig.result.kind && (obj.kind === "Family" || obj.kind === "Table")) return obj;
    return sig.result;
  }

  private noFieldMessage(name: string, fields: Readonly<Record<string, Type>>): string {
    const keys = Object.keys(fields);
    const guess = nearest(name, keys);
    return `this record has no field ${name}; its fields are ${keys.join(", ") || "(none)"}${guess ? ` — did you mean ${guess}?` : ""}`;
  }

  /// The property `c.name` of a value of type `obj`, reporting when there is none.
  private propertyOf(obj: Type, c: A.Property) {
    const name = c.name.name;
    if (obj.kind === "Union") {
      const real = obj.options.filter((o) => o.kind !== "None");
      const found = real.map((o) => lookupProperty(o.kind, name));
      if (found.every((f) => f !== undefined) && found.length > 0) return found[0];
    }
    const sig = lookupProperty(obj.kind, name);
    if (sig) return sig;
    const props = propertiesOf(obj.kind).map((q) => q.name);
    const guess = nearest(name, props);
    const list = props.length ? `; its properties are ${[...new Set(props)].join(", ")}` : "";
    this.error(
      c.name.span,
      `${withArticle(obj)} has no property ${name}${guess ? ` — did you mean ${this.text(c.object)}.${guess}?` : ""}${list}`,
    );
    return undefined;
  }

  private property(e: A.Property): Type {
    const obj = withoutNone(this.infer(e.object));
    if (obj.kind === "Any") return T.Any;
    if (obj.kind === "Record") {
      if (obj.fields === null) return T.Any;
      const f = obj.fields[e.name.name];
      if (f !== undefined) return f;
      this.error(e.name.span, this.noFieldMessage(e.name.name, obj.fields));
      return T.Any;
    }
    const sig = this.propertyOf(obj, e);
    if (!sig) return T.Any;
    if (obj.kind === "Ring" && sig.result.kind === "Ring") return obj;
    if (obj.kind === "Family" && sig.result.kind === "Family") return obj;
    if (sig.params !== null) {
      this.error(e.span, `${e.name.name} is a method: call it, as in ${this.text(e)}(${sig.params.map((p) => p.name).join(", ")})`);
    }
    return sig.result;
  }

  private subscript(e: A.Subscript): Type {
    const obj = withoutNone(this.infer(e.object));
    if (obj.kind === "Field") {
      const problems: { message: string; span: A.Span }[] = [];
      const info = readRingLiteral(e, problems);
      for (const p of problems) this.error(p.span, p.message);
      this.subscripts.set(e, info);
      return T.ring(info.vars);
    }
    const items = e.items.map((i) => this.infer(i));
    e.options.forEach((o) => {
      this.infer(o.value);
      this.error(o.name.span, "options after `;` in brackets belong to ring literals, as in Q[x, y; order = lex]");
    });
    if (obj.kind === "Any") return T.Any;
    if (obj.kind === "Ring") {
      this.error(
        e.span,
        `${this.text(e.object)} is a Ring, not a List, so it cannot be indexed — a new polynomial ring is built from a field, as in ${this.text(e.object)}.field[t]`,
      );
      return T.Any;
    }
    if (obj.kind !== "List" && obj.kind !== "Family") {
      this.error(e.span, `indexing with [i] needs a List or a Family, got ${typeToString(obj)}`);
      return T.Any;
    }
    this.subscripts.set(e, { kind: "index" });
    const itemType = obj.kind === "List" ? obj.item : obj.member;
    if (items.length !== 1) {
      this.error(e.span, `a ${obj.kind} takes exactly one index, as in ${this.text(e.object)}[0], got ${items.length}`);
      return itemType;
    }
    if (!isAssignable(items[0], T.Int)) this.error(e.items[0].span, `a ${obj.kind} index must be an Int, got ${typeToString(items[0])}`);
    const v = constValue(e.items[0]);
    if (v !== null && v < 0n) this.error(e.items[0].span, `${obj.kind} indices start at 0 and cannot be negative, got ${v}`);
    return itemType;
  }
}

/// The type of a value that may be `none`, once it is not (checked at run time).
/// The type a value is used as (for its properties, methods and indexing): `none` aside, and
/// a sweep's Experiment aside where it may as well be a Table. Neither is ruled out statically
/// (there is no flow typing, and inline or background is decided when the sweep runs); the
/// evaluator reports `none`, or a background sweep's Experiment, when it is used so.
function withoutNone(t: Type): Type {
  if (t.kind !== "Union") return t;
  const table = t.options.some((o) => o.kind === "Table");
  const real = t.options.filter((o) => o.kind !== "None" && !(table && o.kind === "Experiment"));
  return real.length === 0 ? t : makeUnion(real);
}

function wrap(e: A.Expr, text: string): string {
  if (text.startsWith("(") && text.endsWith(")")) return text;
  const atomic = ["Identifier", "IdealLit", "Call", "Property", "Subscript", "ListLit", "IntLit"].includes(e.kind);
  return atomic ? text : `(${text})`;
}

function arityFits(o: Overload, n: number): boolean {
  return o.rest ? n >= o.params.length : n === o.params.length;
}

function paramAt(o: Overload, i: number) {
  return i < o.params.length ? o.params[i] : o.rest!;
}

/// Whether an argument type fits a parameter type, binding type variables.
function matchParam(param: Type, arg: Type, binds: Map<string, Type>): boolean {
  if (param.kind === "Var") {
    const prev = binds.get(param.name);
    binds.set(param.name, prev ? joinTypes(prev, arg) : arg);
    return true;
  }
  if (param.kind === "List" && arg.kind === "List") return matchParam(param.item, arg.item, binds);
  // Family<X> takes a Family or a List of rings, ideals or modules, binding X to the member type
  if (param.kind === "Family" && arg.kind === "Family") return matchParam(param.member, arg.member, binds);
  if (param.kind === "Family" && arg.kind === "List") return isFamilyMember(arg.item) && matchParam(param.member, arg.item, binds);
  if (param.kind === "Family" && param.member.kind === "Var" && arg.kind === "Any") {
    binds.set(param.member.name, T.Any);
    return true;
  }
  if (param.kind === "List" && param.item.kind === "Var" && arg.kind === "Any") {
    binds.set(param.item.name, T.Any);
    return true;
  }
  return isAssignable(arg, param);
}

/// A type variable bound to unrelated types (e.g. `x in [<x>]`) makes no match.
function bindsAgree(binds: Map<string, Type>): boolean {
  for (const t of binds.values()) if (t.kind === "Union" && t.options.some((o) => o.kind !== "None")) return false;
  return true;
}

function substitute(t: Type, binds: Map<string, Type>): Type {
  if (t.kind === "Var") return binds.get(t.name) ?? T.Any;
  if (t.kind === "List") return T.list(substitute(t.item, binds));
  if (t.kind === "Family") return T.family(substitute(t.member, binds));
  if (t.kind === "Function") return T.fn(t.params && t.params.map((p) => substitute(p, binds)), substitute(t.result, binds));
  return t;
}

/// Checks a parsed program against an initial environment.
export function check(parsed: ParseResult, env: Env, source: string): Analysis {
  const c = new Checker(source, env);
  const marks: { defined: number; ring: string | null }[] = [];
  parsed.program.statements.forEach((s, i) => {
    marks.push({ defined: c.definitions.length, ring: c.ring() });
    c.statement(s, parsed.broken.has(i));
  });
  // Gradings are judged only on a program that is otherwise well typed.
  if (c.errors.length === 0 && parsed.errors.length === 0) c.errors.push(...gradedProblems(parsed.program, source, c.names, c.subscripts));
  const typeErrors = [...c.errors].sort((a, b) => a.span.from.offset - b.span.from.offset);
  let envs: Env[] | undefined;
  // The per-statement environments are rebuilt only when asked for: copying the
  // bindings before every statement would dominate the cost of checking.
  const replay = (): Env[] => {
    const bindings = new Map(Object.entries(env.bindings));
    let done = 0;
    return marks.map((m) => {
      for (; done < m.defined; done++) bindings.set(...c.definitions[done]);
      return { bindings: Object.fromEntries(bindings), currentRing: m.ring };
    });
  };
  return {
    program: parsed.program,
    errors: [...parsed.errors, ...typeErrors],
    types: c.types,
    names: c.names,
    subscripts: c.subscripts,
    get envs() {
      return (envs ??= replay());
    },
    finalEnv: c.env(),
  };
}
