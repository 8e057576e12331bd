/// Evaluation of expressions: walks the checked AST, resolving names the way the checker
/// did (lambda parameters and comprehension variables, then variables of the ring
/// literals are read in, then session bindings, then predefined names).
import type { Call, Comprehension, Expr, ForClause, Identifier, Lambda, Span, Subscript } from "../../grammar/ast";
import type { NameResolution, RingLiteralInfo } from "../../grammar/analysis";
import { QQ, variable } from "../algebra/index";
import { EvalError, asEvalError, limit, runtime } from "./errors";
import { applyBinary, applyUnary, valuesEqual } from "./operators";
import { callFunction, functionExists, getProperty, callMethod } from "./builtins";
import { ringLiteralFromAst } from "./ring-literal";
import { Scope } from "./scope";
import { reduceIn, toPoly } from "./coerce";
import { idealValue } from "./ideals";
import { freeNames } from "./free-names";
import { valueText } from "./text";
import { list, type FunctionValue, type RingValue, type Value } from "./values";
import type { Evaluator, Frame, Session } from "./context";
import { familyIndex } from "./families";

const PREDEFINED: Record<string, Value> = {
  Q: { type: "Field", field: QQ },
  none: { type: "None" },
};

/// Properties of a Complex that read only its Betti numbers.
const BETTI_READS = new Set(["betti", "ranks", "length", "complete"]);

export class Interpreter implements Evaluator {
  constructor(readonly session: Session) {}

  bettiOnlyCall: Span | null = null;

  /// The object of a property access. In resolve(…).betti (and .ranks, .length, .complete)
  /// the call's value is read for its Betti numbers only, so the call is told (through
  /// `bettiOnlyCall`, its own span) and a resolution keeps no differentials (issue 17).
  private evalObjectOf(object: Expr, property: string, f: Frame): Value {
    const saved = this.bettiOnlyCall;
    this.bettiOnlyCall = object.kind === "Call" && BETTI_READS.has(property) ? object.span : null;
    try {
      return this.eval(object, f);
    } finally {
      this.bettiOnlyCall = saved;
    }
  }

  /// Throws a "cancelled" error once the signal fired; called at every node.
  private checkSignal(span: Span): void {
    if (this.session.compute.signal?.aborted) throw new EvalError("cancelled", "evaluation cancelled", span);
  }

  eval(e: Expr, f: Frame): Value {
    this.checkSignal(e.span);
    try {
      return this.evalNode(e, f);
    } catch (err) {
      throw asEvalError(err, e.span);
    }
  }

  private evalNode(e: Expr, f: Frame): Value {
    switch (e.kind) {
      case "IntLit":
        return { type: "Int", value: e.value };
      case "StrLit":
        return { type: "Str", value: e.value };
      case "BoolLit":
        return { type: "Bool", value: e.value };
      case "Identifier":
        return this.identifier(e, f);
      case "Binary":
        if (e.op === "and" || e.op === "or") {
          const l = this.bool(this.eval(e.left, f), e.left.span);
          if (e.op === "and" ? !l : l) return { type: "Bool", value: l };
          return { type: "Bool", value: this.bool(this.eval(e.right, f), e.right.span) };
        }
        {
          const left = this.eval(e.left, f);
          // A / e reads e in A, as the checker does (the ideal of a quotient lives in A).
          const rightFrame = e.op === "/" && left.type === "Ring" ? { ...f, ring: left } : f;
          return applyBinary(this, e, left, this.eval(e.right, rightFrame), f);
        }
      case "Unary":
        return applyUnary(this, e, this.eval(e.operand, f), f);
      case "Range":
        return this.range(this.eval(e.from, f), this.eval(e.to, f), e.span);
      case "IdealLit": {
        const ring = this.literalRing(f, e.span);
        return idealValue(
          ring,
          e.gens.map((g) => toPoly(this.eval(g, f), ring, g.span)),
        );
      }
      case "ListLit":
        return list(e.items.map((x) => this.eval(x, f)));
      case "MatrixLit": {
        const ring = this.literalRing(f, e.span);
        const rows = e.rows.map((row) => row.map((x) => toPoly(this.eval(x, f), ring, x.span)));
        const cols = rows[0]?.length ?? 0;
        rows.forEach((row, i) => {
          if (row.length !== cols) throw runtime(`row ${i + 1} of the matrix has ${row.length} entries, row 1 has ${cols}`, e.span);
        });
        return { type: "Matrix", ring, rows, cols };
      }
      case "Comprehension":
        return list(this.comprehension(e, f));
      case "RecordLit":
        return { type: "Record", fields: new Map(e.fields.map((x) => [x.name.name, this.eval(x.value, f)])) };
      case "Tuple":
        return list(e.items.map((x) => this.eval(x, f)));
      case "Lambda":
        return this.lambda(e, f);
      case "If":
        return this.bool(this.eval(e.cond, f), e.cond.span) ? this.eval(e.then, f) : this.eval(e.else, f);
      case "Call":
        return this.call(e, f);
      case "Property": {
        const obj = this.evalObjectOf(e.object, e.name.name, f);
        if (obj.type === "Record" && obj.fields.has(e.name.name)) return obj.fields.get(e.name.name)!;
        return getProperty(this, obj, e.name.name, e, f);
      }
      case "Subscript":
        return this.subscript(e, f);
      case "ErrorExpr":
        throw new EvalError("parse", "this part of the program could not be read", e.span);
    }
  }

  bool(v: Value, span: Span): boolean {
    if (v.type !== "Bool") throw runtime(`expected a Bool, got ${v.type} ${valueText(v)}`, span);
    return v.value;
  }

  int(v: Value, span: Span): bigint {
    if (v.type !== "Int") throw runtime(`expected an Int, got ${v.type} ${valueText(v)}`, span);
    return v.value;
  }

  /// The ring polynomial, ideal and matrix literals are read in here.
  literalRing(f: Frame, span: Span): RingValue {
    if (!f.ring) throw runtime("there is no current ring: define one (S := Q[x, y]) or choose one with use", span);
    return f.ring;
  }

  private resolution(e: Identifier): NameResolution | undefined {
    return this.session.analysis?.names.get(e);
  }

  private identifier(e: Identifier, f: Frame): Value {
    const how = this.resolution(e);
    const local = f.scope.lookup(e.name);
    if (how?.kind === "local" && local) return local;
    if (!how && local) return local;
    if (how === undefined || how.kind === "variable") {
      const ring = f.ring;
      const i = ring ? ring.poly.vars.indexOf(e.name) : -1;
      if (ring && i >= 0) return this.variable(ring, i);
      if (how) throw runtime(`${e.name} is not a variable of the current ring`, e.span);
    }
    if (local) return local;
    const g = this.session.globals.get(e.name);
    if (g) return g;
    const c = PREDEFINED[e.name];
    if (c) return c;
    if (functionExists(e.name)) throw runtime(`${e.name} is a built-in function: call it, as in ${e.name}(…)`, e.span);
    const ring = f.ring;
    throw runtime(
      `unknown name ${e.name}${ring ? `; the current ring has the variables ${ring.poly.vars.join(", ")}` : "; there is no current ring"}`,
      e.span,
    );
  }

  variable(ring: RingValue, i: number): Value {
    return { type: "Poly", ring, poly: reduceIn(ring, variable(ring.poly, i), this.session.compute) };
  }

  private range(a: Value, b: Value, span: Span): Value {
    const from = this.int(a, span);
    const to = this.int(b, span);
    const n = to >= from ? to - from + 1n : 0n;
    if (n > BigInt(this.session.limits.maxListLength)) {
      throw limit(`the range ${from}..${to} has ${n} items, beyond the limit ${this.session.limits.maxListLength}`, span, "listLength");
    }
    const items: Value[] = [];
    for (let k = from; k <= to; k++) items.push({ type: "Int", value: k });
    return list(items);
  }

  /// Items of a comprehension; `onItem` sees each one as it is computed (partial results).
  comprehension(e: Comprehension, f: Frame, onItem?: (v: Value, k: number) => void): Value[] {
    const out: Value[] = [];
    const loop = (clauses: readonly ForClause[], scope: Scope): void => {
      if (clauses.length === 0) {
        if (out.length >= this.session.limits.maxListLength) {
          throw limit(`the comprehension has more than ${this.session.limits.maxListLength} items`, e.span, "listLength");
        }
        const v = this.eval(e.element, { ...f, scope });
        out.push(v);
        onItem?.(v, out.length - 1);
        return;
      }
      const [c, ...rest] = clauses;
      const src = this.eval(c.source, { ...f, scope });
      const items = src.type === "List" ? src.items : src.type === "Family" ? src.members : null;
      if (!items) throw runtime(`a comprehension runs over a List, got ${src.type}`, c.source.span);
      for (const item of items) loop(rest, scope.with([[c.name.name, item]]));
    };
    loop(e.clauses, f.scope);
    return out;
  }

  private lambda(e: Lambda, f: Frame): FunctionValue {
    const captures = new Map<string, Value>();
    for (const id of freeNames(e)) {
      const how = this.resolution(id);
      if (how && how.kind !== "local" && how.kind !== "binding") continue;
      const v = f.scope.lookup(id.name) ?? this.session.globals.get(id.name);
      if (v && !(f.ring && how === undefined && f.ring.poly.vars.includes(id.name))) captures.set(id.name, v);
    }
    return this.closure(e, captures, f.ring, f.source.slice(e.span.from.offset, e.span.to.offset), f.source);
  }

  /// A function value for `e` whose free names are `captures`.
  closure(e: Lambda, captures: ReadonlyMap<string, Value>, ring: RingValue | null, text: string, source: string): FunctionValue {
    const params = e.params.map((p) => p.name);
    return {
      type: "Function",
      params,
      source: text,
      captures,
      ring,
      call: (args, depth = 0) => {
        if (args.length !== params.length) {
          throw runtime(`the function ${text} takes ${params.length} argument(s), got ${args.length}`, e.span);
        }
        if (depth > this.session.limits.maxCallDepth)
          throw limit(`calls nested deeper than ${this.session.limits.maxCallDepth}`, e.span, "callDepth");
        const scope = Scope.EMPTY.with(captures).with(params.map((p, i) => [p, args[i]] as [string, Value]));
        return this.eval(e.body, { scope, ring, depth: depth + 1, source });
      },
    };
  }

  applyFunction(fn: Value, args: Value[], span: Span, f: Frame): Value {
    if (fn.type !== "Function") throw runtime(`expected a function, got ${fn.type}`, span);
    return fn.call(args, f.depth);
  }

  private call(e: Call, f: Frame): Value {
    const callee = e.callee;
    if (callee.kind === "Property") {
      const obj = this.eval(callee.object, f);
      if (!(obj.type === "Record" && obj.fields.has(callee.name.name))) {
        return callMethod(
          this,
          obj,
          callee.name.name,
          e.args.map((a) => this.eval(a, f)),
          e,
          f,
        );
      }
    }
    if (callee.kind === "Identifier") {
      const how = this.resolution(callee);
      const shadowed = f.scope.lookup(callee.name) ?? (how?.kind === "function" ? undefined : this.session.globals.get(callee.name));
      if ((how?.kind === "function" || !shadowed) && functionExists(callee.name)) {
        const named = new Map(e.named.map((n) => [n.name.name, this.eval(n.value, f)]));
        return callFunction(
          this,
          callee.name,
          e.args.map((a) => this.eval(a, f)),
          named,
          e,
          f,
        );
      }
    }
    const fn = this.eval(callee, f);
    return this.applyFunction(
      fn,
      e.args.map((a) => this.eval(a, f)),
      e.span,
      f,
    );
  }

  private subscript(e: Subscript, f: Frame): Value {
    const obj = this.eval(e.object, f);
    if (obj.type === "Field") {
      const info = (this.session.analysis?.subscripts.get(e) as RingLiteralInfo | undefined) ?? ringLiteralFromAst(e);
      const degrees = info.degrees ? [...info.degrees] : undefined;
      const order =
        info.order.kind === "weights" ? { kind: "weights" as const, weights: [...info.order.weights] } : { kind: info.order.kind };
      if (info.vars.length === 0) throw runtime("a polynomial ring needs at least one variable", e.span);
      return this.session.rings.polynomialRing(obj.field, info.vars, { order, ...(degrees ? { degrees } : {}) });
    }
    if (obj.type !== "List" && obj.type !== "Family") throw runtime(`only a List or a Family can be indexed, got ${obj.type}`, e.span);
    if (e.items.length !== 1) throw runtime("an index is one integer: xs[i]", e.span);
    if (obj.type === "Family") return familyIndex(obj, this.int(this.eval(e.items[0], f), e.items[0].span), e.items[0].span);
    const i = this.int(this.eval(e.items[0], f), e.items[0].span);
    if (i < 0n || i >= BigInt(obj.items.length)) {
      throw runtime(
        `index ${i} is out of range: the list has ${obj.items.length} item(s), indices 0…${obj.items.length - 1}`,
        e.items[0].span,
      );
    }
    return obj.items[Number(i)];
  }

  equal(a: Value, b: Value, span: Span): boolean {
    return valuesEqual(this, a, b, span);
  }
}
