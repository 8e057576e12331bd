/// Built-in functions and properties. Each overload of grammar/signatures.ts FUNCTIONS
/// and each row of PROPERTIES that the evaluator implements has an entry here under its
/// key; the rest (engine parts 2 and 3) end with the runtime Error of pending.ts.
import type { Call, Property, Span } from "../../grammar/ast";
import {
  FUNCTIONS,
  PROPERTIES,
  lookupFunction,
  lookupProperty,
  type FunctionSig,
  type Overload,
  type PropertySig,
} from "../../grammar/signatures";
import { isAssignable, typeToString, type TypeKind } from "../../grammar/types";
import {
  QQ,
  add,
  constant,
  degree,
  det,
  minors,
  pfaffians,
  quotientProperties,
  type QuotientProperties,
  gf,
  groebnerBasis,
  hilbertFunctionAt,
  hilbertFunctionValues,
  hilbertPolynomial,
  ideal as engineIdeal,
  idealDegree,
  idealDimension,
  idealHilbertSeries,
  idealIsHomogeneous,
  idealIsUnit,
  initialIdeal,
  isHomogeneous,
  monomial,
  one,
  sub,
  mul,
  terms,
  variable,
  type HilbertSeries,
  type Ideal,
  ratAdd,
  type Poly,
  type Rat,
  ratOf,
} from "../algebra/index";
import { reduceIn, ringOfOperands, toPoly } from "./coerce";
import { limit, runtime } from "./errors";
import { colonOf, eliminationOf, groebnerOf, idealProductOf, idealValue, quotientIdeal, saturationByElement, saturationOf } from "./ideals";
import type { CallContext, Evaluator, Frame } from "./context";
import { addValues } from "./operators";
import { HOMOLOGY_FUNCTIONS, MODULE_PROPERTIES } from "./homology";
import { MODULE_FUNCTIONS, RESIDUE_PROPERTY } from "./modules";
import { pendingError } from "./pending";
import { FAMILY_FUNCTIONS, FAMILY_PROPERTIES } from "./families";
import { COMPLEX_PROPERTIES, resolveValue } from "./resolutions";
import { QUOTIENT_FUNCTIONS, QUOTIENT_PROPERTIES } from "./quotients";
import { LOCAL_FUNCTIONS, LOCAL_GENERAL_PROPERTIES, localFunction, localProperty } from "./local-dispatch";
import { valueType } from "./value-type";
import { list, type HilbertSeriesValue, type IdealValue, type RingValue, type Value } from "./values";

type FunctionImpl = (args: readonly Value[], c: CallContext) => Value;
type PropertyImpl = (obj: Value, args: readonly Value[], c: CallContext) => Value;

export function overloadKey(f: FunctionSig, o: Overload): string {
  const params = o.params.map((p) => typeToString(p.type));
  if (o.rest) params.push(`${typeToString(o.rest.type)}…`);
  return `${f.name}(${params.join(", ")})`;
}

export const propertyKey = (p: PropertySig): string => `${p.owner}.${p.name}`;

const opts = (c: CallContext) => c.interp.session.compute;
const Int = (value: bigint | number): Value => ({ type: "Int", value: BigInt(value) });
const Bool = (value: boolean): Value => ({ type: "Bool", value });

function ideal(v: Value, span: Span): IdealValue {
  if (v.type !== "Ideal") throw runtime(`expected an Ideal, got ${v.type}`, span);
  return v;
}

function ring(v: Value, span: Span): RingValue {
  if (v.type !== "Ring") throw runtime(`expected a Ring, got ${v.type}`, span);
  return v;
}

function polyList(v: Value, span: Span, fallback: RingValue | null): { ring: RingValue; polys: Poly[] } {
  if (v.type !== "List") throw runtime(`expected a List of polynomials, got ${v.type}`, span);
  const r = ringOfOperands(v.items, span, fallback);
  return { ring: r, polys: v.items.map((x) => toPoly(x, r, span)) };
}

/// The index of the variable f is (x, not 2*x or x+1), for eliminate.
function variableIndex(r: RingValue, f: Poly, span: Span): number {
  const t = terms(r.poly, f);
  const k = t.length === 1 && t[0].num === 1n && t[0].den === 1n ? t[0].exps.findIndex((e) => e === 1) : -1;
  if (k < 0 || t[0].exps.some((e, i) => (i === k ? e !== 1 : e !== 0))) {
    throw runtime("eliminate expects a List of variables of the ring", span);
  }
  return k;
}

/// A polynomial in t with the given rational coefficients, in Q[t].
function tPoly(c: CallContext, coeffs: readonly Rat[]): Value {
  const R = c.interp.session.rings.polynomialRing(QQ, ["t"]);
  let f = constant(R.poly, 0n);
  coeffs.forEach((q, i) => {
    if (q.n !== 0n) f = addPoly(R, f, monomial(R.poly, [i], q.n, q.d));
  });
  return { type: "Poly", ring: R, poly: f };
}

const addPoly = (R: RingValue, f: Poly, g: Poly): Poly => add(R.poly, f, g);

function hilbertValue(series: HilbertSeries, note?: string): HilbertSeriesValue {
  return { type: "HilbertSeries", series, ...(note ? { note } : {}) };
}

/// The Hilbert series of S/I. For a non-homogeneous I the engine's answer is the series of
/// S/in(I); under an order that refines the grading this is the associated graded ring of S/I
/// for the degree filtration, whose values are the increments of the affine Hilbert function
/// d ↦ dim_k S_{≤d}/I_{≤d} (D. Cox, J. Little, D. O'Shea, Ideals, Varieties, and Algorithms,
/// ch. 9 §3): the value's note says so. Under lex or a weight order it depends on the order and
/// is refused.
function hilbertOfIdeal(I: Ideal, c: CallContext): HilbertSeriesValue {
  if (idealIsHomogeneous(I, opts(c))) return hilbertValue(idealHilbertSeries(I, opts(c)));
  const order = I.ring.order.kind;
  if (order !== "grevlex" && order !== "glex") {
    throw runtime(
      `the ideal is not homogeneous, and under the ${order} order its initial ideal does not describe S/I degree by degree: use a grevlex or glex ring, or localize(…).samuel for the local Hilbert–Samuel function`,
      c.span,
    );
  }
  return hilbertValue(
    idealHilbertSeries(I, opts(c)),
    "the ideal is not homogeneous: this is the series of S/in(I), the associated graded ring for the degree filtration, whose values are the increments d ↦ dim S_{≤d}/I_{≤d} − dim S_{≤d−1}/I_{≤d−1} of the affine Hilbert function",
  );
}

function series(v: Value): HilbertSeries {
  return (v as HilbertSeriesValue).series;
}

/// How far a Hilbert series value is moved up (its generators' lowest degree is −shift).
const shiftOf = (v: Value): number => (v as HilbertSeriesValue).shift ?? 0;

/// The polynomial p(t + s) for p given by ascending rational coefficients (Taylor shift).
function shiftPolynomial(p: readonly Rat[], s: number): Rat[] {
  let out: Rat[] = [];
  // Horner: out = out·(t + s) + p_i, from the top coefficient down
  for (let i = p.length - 1; i >= 0; i--) {
    const next: Rat[] = Array.from({ length: out.length + 1 }, () => ratOf(0n));
    out.forEach((q, k) => {
      next[k + 1] = ratAdd(next[k + 1], q);
      next[k] = ratAdd(next[k], ratOf(q.n * BigInt(s), q.d));
    });
    next[0] = ratAdd(next[0], p[i]);
    out = next;
  }
  return out;
}

function hilbertDegree(v: Value, span: Span, c: CallContext): number {
  if (v.type !== "Int") throw runtime(`expected an Int degree, got ${v.type}`, span);
  const max = c.interp.session.limits.maxHilbertDegree;
  if (v.value > BigInt(max)) throw limit(`degree ${v.value} is beyond the limit ${max}`, span, "hilbertDegree");
  // below the lowest generator degree every value is 0; clamping keeps the number small
  return Number(v.value < -(1n << 30n) ? -(1n << 30n) : v.value);
}

/// Krull dimension of R = S/J.
const ringDim = (r: RingValue, c: CallContext) => idealDimension(engineIdeal(r.poly, r.ideal), opts(c));

const FUNCTION_IMPLS: Record<string, FunctionImpl> = {
  "GF(Int)": ([p], c) => {
    const n = (p as { value: bigint }).value;
    if (n >= 2n ** 31n || n < 2n) throw runtime(`the characteristic must be a prime with 2 <= p < 2^31, got ${n}`, c.argSpans[0]);
    try {
      return { type: "Field", field: gf(Number(n)) };
    } catch (e) {
      throw runtime((e as Error).message.replace(/^gf: /, ""), c.argSpans[0]);
    }
  },
  "ideal(List<Poly>)": ([xs], c) => {
    const { ring: r, polys } = polyList(xs, c.argSpans[0], c.frame.ring);
    return idealValue(r, polys, opts(c));
  },
  "matrix(List<Poly>…)": (rows, c) => {
    if (rows.length === 0) throw runtime("a matrix needs at least one row", c.span);
    const r = ringOfOperands(
      rows.flatMap((row) => (row.type === "List" ? row.items : [])),
      c.span,
      c.frame.ring,
    );
    const entries = rows.map((row, i) => polyList(row, c.argSpans[i], r).polys.map((f) => reduceIn(r, f, opts(c))));
    const cols = entries[0].length;
    entries.forEach((row, i) => {
      if (row.length !== cols) throw runtime(`row ${i + 1} has ${row.length} entries, row 1 has ${cols}`, c.argSpans[i]);
    });
    return { type: "Matrix", ring: r, rows: entries, cols };
  },
  "det(Matrix)": ([A], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    if (M.rows.length !== M.cols) throw runtime(`det needs a square matrix, got ${M.rows.length}×${M.cols}`, c.argSpans[0]);
    return { type: "Poly", ring: M.ring, poly: reduceIn(M.ring, det(M.ring.poly, M.rows, opts(c)), opts(c)) };
  },
  "minors(Matrix, Int)": ([A, k], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    // I_k(A) = 0 when k exceeds the number of rows or columns (common practice; C.minors(k)
    // follows the same rule)
    const size = (k as { value: bigint }).value;
    if (size >= 1n && size > BigInt(Math.min(M.rows.length, M.cols))) return idealValue(M.ring, []);
    return idealValue(M.ring, minors(M.ring.poly, M.rows, sizeArg(k, c.argSpans[1], Math.min(M.rows.length, M.cols)), opts(c)), opts(c));
  },
  "pfaffians(Matrix, Int)": ([A, k], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    return idealValue(M.ring, pfaffians(M.ring.poly, M.rows, sizeArg(k, c.argSpans[1], M.cols), opts(c)), opts(c));
  },
  "saturate(Ideal, Ideal)": ([I, J], c) => saturationOf(ideal(I, c.argSpans[0]), ideal(J, c.argSpans[1]), c.span, opts(c)),
  "saturate(Ideal, Poly)": ([I, f], c) => {
    const J = ideal(I, c.argSpans[0]);
    return saturationByElement(J, toPoly(f, J.ring, c.argSpans[1], opts(c)), opts(c));
  },
  "eliminate(Ideal, List<Poly>)": ([I, xs], c) => {
    const J = ideal(I, c.argSpans[0]);
    const { polys } = polyList(xs, c.argSpans[1], J.ring);
    return eliminationOf(
      J,
      polys.map((f) => variableIndex(J.ring, f, c.argSpans[1])),
      opts(c),
    );
  },
  "hilbert(Ring)": ([R], c) => hilbertOfIdeal(engineIdeal(ring(R, c.argSpans[0]).poly, (R as RingValue).ideal), c),
  "sum(List<T>)": ([xs], c) => {
    const items = (xs as { items: readonly Value[] }).items;
    if (items.length === 0) return Int(0);
    return items.slice(1).reduce((acc, x) => addValues(c.interp, acc, x, c.span, c.frame), items[0]);
  },
  "all(List<Bool>)": ([xs]) => Bool((xs as { items: readonly Value[] }).items.every((x) => x.type === "Bool" && x.value)),
  "any(List<Bool>)": ([xs]) => Bool((xs as { items: readonly Value[] }).items.some((x) => x.type === "Bool" && x.value)),
  "resolve(Module or Ring)": resolveValue,
  ...MODULE_FUNCTIONS,
  ...HOMOLOGY_FUNCTIONS,
  ...QUOTIENT_FUNCTIONS,
  ...FAMILY_FUNCTIONS,
  ...LOCAL_FUNCTIONS,
};

function matrixArg(v: Value, span: Span): Extract<Value, { type: "Matrix" }> {
  if (v.type !== "Matrix") throw runtime(`expected a Matrix, got ${v.type}`, span);
  return v;
}

/// The size k of k×k minors: 1 ≤ k ≤ max.
function sizeArg(v: Value, span: Span, max: number): number {
  const k = (v as { value: bigint }).value;
  if (k < 1n || k > BigInt(max)) throw runtime(`the size must be between 1 and ${max}, got ${k}`, span);
  return Number(k);
}

/// Depth, Cohen–Macaulayness, Gorensteinness and complete intersection of R = S/J, from
/// the minimal resolution of S/J over S (J homogeneous); cached per ring.
const propertiesCache = new WeakMap<RingValue, QuotientProperties>();
function ringProperties(r: RingValue, c: CallContext): QuotientProperties {
  let q = propertiesCache.get(r);
  if (!q) {
    const J = engineIdeal(r.poly, r.ideal);
    // the zero ring has no maximal ideal: its depth (∞ by convention) is not an Int
    if (idealIsUnit(J, opts(c)))
      throw runtime(
        "this is the zero ring (its defining ideal contains 1): depth, Cohen–Macaulay, Gorenstein and complete intersection are not defined for it",
        c.span,
      );
    q = quotientProperties(J, opts(c));
    propertiesCache.set(r, q);
  }
  return q;
}

/// The ideal of R generated by its variables.
function maximalIdeal(r: RingValue, c: CallContext): IdealValue {
  return idealValue(
    r,
    r.poly.vars.map((_, i) => variable(r.poly, i)),
    opts(c),
  );
}

/// dim_k m/m² = n − rank of the linear parts of the generators of J (for J inside m).
function embeddingDimension(r: RingValue, c: CallContext): number {
  const n = r.poly.vars.length;
  const linear: Poly[] = [];
  for (const g of r.ideal) {
    const ts = terms(r.poly, g);
    if (ts.some((t) => t.exps.every((e) => e === 0))) {
      throw runtime(
        "embdim: the defining ideal has an element with a nonzero constant term, so it is not inside the maximal ideal of the variables",
        c.span,
      );
    }
    const lin = ts.filter((t) => t.exps.reduce((a, b) => a + b, 0) === 1);
    if (lin.length > 0) linear.push(lin.map((t) => monomial(r.poly, t.exps, t.num, t.den)).reduce((a, b) => addPoly(r, a, b)));
  }
  // a reduced Gröbner basis of linear forms is their row echelon form: its size is the rank
  return n - (linear.length === 0 ? 0 : groebnerBasis(r.poly, linear, opts(c)).length);
}

function integerDegree(q: Rat, c: CallContext): Value {
  if (q.d !== 1n) throw runtime(`the degree is ${q.n}/${q.d}, not an integer, in this weighted grading`, c.span);
  return Int(q.n);
}

const PROPERTY_IMPLS: Record<string, PropertyImpl> = {
  "Field.characteristic": (v) => Int(v.type === "Field" && v.field.kind === "gf" ? v.field.p : 0),
  "Ring.field": (v) => ({ type: "Field", field: (v as RingValue).poly.field }),
  "Ring.vars": (v, _a, c) => list((v as RingValue).poly.vars.map((_, i) => c.interp.variable(v as RingValue, i))),
  "Ring.ngens": (v) => Int((v as RingValue).poly.vars.length),
  "Ring.maximal": (v, _a, c) => maximalIdeal(v as RingValue, c),
  "Ring.ideal": (v, _a, c) => {
    const r = v as RingValue;
    return idealValue(c.interp.session.rings.ambient(r), r.ideal);
  },
  "Ring.ambient": (v, _a, c) => c.interp.session.rings.ambient(v as RingValue),
  "Ring.dim": (v, _a, c) => Int(ringDim(v as RingValue, c)),
  "Ring.embdim": (v, _a, c) => Int(embeddingDimension(v as RingValue, c)),
  "Ring.codim": (v, _a, c) => Int((v as RingValue).poly.vars.length - ringDim(v as RingValue, c)),
  "Ring.depth": (v, _a, c) => Int(ringProperties(v as RingValue, c).depth),
  "Ring.is_cm": (v, _a, c) => Bool(ringProperties(v as RingValue, c).cohenMacaulay),
  "Ring.is_gorenstein": (v, _a, c) => Bool(ringProperties(v as RingValue, c).gorenstein),
  "Ring.is_ci": (v, _a, c) => Bool(ringProperties(v as RingValue, c).completeIntersection),
  "Ring.hilbert": (v, _a, c) => hilbertOfIdeal(engineIdeal((v as RingValue).poly, (v as RingValue).ideal), c),
  "Poly.degree": (v) => Int(degree((v as { ring: RingValue }).ring.poly, (v as { poly: Poly }).poly)),
  "Poly.is_homogeneous": (v) => Bool(isHomogeneous((v as { ring: RingValue }).ring.poly, (v as { poly: Poly }).poly)),
  "Ideal.gens": (v) => {
    const I = v as IdealValue;
    return list(I.gens.map((poly) => ({ type: "Poly", ring: I.ring, poly })));
  },
  "Ideal.groebner": (v, _a, c) => {
    const I = v as IdealValue;
    return list(groebnerOf(I, opts(c)).map((poly) => ({ type: "Poly", ring: I.ring, poly })));
  },
  "Ideal.initial": (v, _a, c) => {
    const I = v as IdealValue;
    // in(I + J) is a monomial ideal of the ambient ring S
    return idealValue(c.interp.session.rings.ambient(I.ring), initialIdeal(quotientIdeal(I), opts(c)).gens);
  },
  "Ideal.codim": (v, _a, c) => {
    const I = v as IdealValue;
    return Int(ringDim(I.ring, c) - idealDimension(quotientIdeal(I), opts(c)));
  },
  "Ideal.dim": (v, _a, c) => Int(idealDimension(quotientIdeal(v as IdealValue), opts(c))),
  "Ideal.degree": (v, _a, c) => integerDegree(idealDegree(quotientIdeal(v as IdealValue), opts(c)), c),
  "Ideal.hilbert": (v, _a, c) => hilbertOfIdeal(quotientIdeal(v as IdealValue), c),
  // B(I) = (m·I) : (I : m) (H. Dao, T. Kobayashi, R. Takahashi, "Burch ideals and Burch
  // rings", Algebra & Number Theory 2020, Def. 2.1), from the ideal operations alone
  "Ideal.burch": (v, _a, c) => {
    const I = v as IdealValue;
    const m = maximalIdeal(I.ring, c);
    return colonOf(idealProductOf(m, I, c.span, opts(c)), colonOf(I, m, c.span, opts(c)), c.span, opts(c));
  },
  "Ideal.is_homogeneous": (v, _a, c) => Bool(idealIsHomogeneous(quotientIdeal(v as IdealValue), opts(c))),
  "Matrix.t": (v) => {
    const A = v as Extract<Value, { type: "Matrix" }>;
    const rows = Array.from({ length: A.cols }, (_, j) => A.rows.map((row) => row[j]));
    return { type: "Matrix", ring: A.ring, rows, cols: A.rows.length };
  },
  "Matrix.rows": (v) => Int((v as Extract<Value, { type: "Matrix" }>).rows.length),
  "Matrix.cols": (v) => Int((v as Extract<Value, { type: "Matrix" }>).cols),
  "Matrix.entries": (v) => {
    const A = v as Extract<Value, { type: "Matrix" }>;
    return idealValue(A.ring, A.rows.flat());
  },
  "HilbertSeries.numerator": (v, _a, c) => {
    if (shiftOf(v) > 0)
      throw runtime(
        `the numerator has negative powers of t (it starts at t^-${shiftOf(v)}), so it is not a polynomial; t^${shiftOf(v)} times it is the numerator of the module moved into degrees ≥ 0`,
        c.span,
      );
    return tPoly(
      c,
      series(v).numerator.map((n) => ({ n, d: 1n })),
    );
  },
  "HilbertSeries.denominator": (v, _a, c) => {
    const R = c.interp.session.rings.polynomialRing(QQ, ["t"]);
    const f = series(v).weights.reduce((acc, w) => mul(R.poly, acc, sub(R.poly, one(R.poly), monomial(R.poly, [w]))), one(R.poly));
    return { type: "Poly", ring: R, poly: f };
  },
  "HilbertSeries.at": (v, [d], c) => Int(hilbertFunctionAt(series(v), hilbertDegree(d, c.argSpans[0], c) + shiftOf(v), opts(c))),
  "HilbertSeries.values": (v, [d], c) => {
    const n = hilbertDegree(d, c.argSpans[0], c);
    if (n < 0) throw runtime("values(d) needs d ≥ 0", c.argSpans[0]);
    const s = shiftOf(v);
    return list(
      hilbertFunctionValues(series(v), n + s, opts(c))
        .slice(s)
        .map((x) => Int(x)),
    );
  },
  // the module moved up by s has Hilbert polynomial p; the module itself has p(t + s)
  "HilbertSeries.polynomial": (v, _a, c) => tPoly(c, shiftPolynomial(hilbertPolynomial(series(v)), shiftOf(v))),
  "List.length": (v) => Int((v as { items: readonly Value[] }).items.length),
  "Str.length": (v) => Int([...(v as { value: string }).value].length),
  "Table.columns": (v) => list((v as Extract<Value, { type: "Table" }>).columns.map((s) => ({ type: "Str", value: s }) as Value)),
  "Table.rows": (v) => {
    const t = v as Extract<Value, { type: "Table" }>;
    return list(t.rows.map((row) => ({ type: "Record", fields: new Map(t.columns.map((k, i) => [k, row[i]])) }) as Value));
  },
  "Table.length": (v) => Int((v as Extract<Value, { type: "Table" }>).rows.length),
  "Table.column": (v, [name], c) => {
    const t = v as Extract<Value, { type: "Table" }>;
    const k = t.columns.indexOf((name as { value: string }).value);
    if (k < 0) throw runtime(`no column ${(name as { value: string }).value}; the columns are ${t.columns.join(", ")}`, c.argSpans[0]);
    return list(t.rows.map((row) => row[k]));
  },
  ...COMPLEX_PROPERTIES,
  ...RESIDUE_PROPERTY,
  ...MODULE_PROPERTIES,
  ...QUOTIENT_PROPERTIES,
  ...FAMILY_PROPERTIES,
  ...LOCAL_GENERAL_PROPERTIES,
};

/// Keys of everything the evaluator implements (read by the pending-names test).
export const IMPLEMENTED_FUNCTIONS: ReadonlySet<string> = new Set(Object.keys(FUNCTION_IMPLS));
export const IMPLEMENTED_PROPERTIES: ReadonlySet<string> = new Set(Object.keys(PROPERTY_IMPLS));

export const functionExists = (name: string): boolean => lookupFunction(name) !== undefined;

function matchesOverload(o: Overload, args: readonly Value[]): boolean {
  if (args.length < o.params.length || (!o.rest && args.length > o.params.length)) return false;
  return args.every((a, i) => isAssignable(valueType(a), i < o.params.length ? o.params[i].type : o.rest!.type));
}

export function callFunction(interp: Evaluator, name: string, args: Value[], named: Map<string, Value>, e: Call, frame: Frame): Value {
  const sig = lookupFunction(name)!;
  const o = sig.overloads.find((x) => matchesOverload(x, args));
  if (!o) throw runtime(`${name} does not accept (${args.map((a) => a.type).join(", ")})`, e.span);
  const impl = localFunction(overloadKey(sig, o), args) ?? FUNCTION_IMPLS[overloadKey(sig, o)];
  if (!impl) throw pendingError(name, o.part, e.span);
  return impl(args, { interp, frame, span: e.span, argSpans: e.args.map((a) => a.span), named });
}

function propertySig(obj: Value, name: string, span: Span): PropertySig {
  const sig = lookupProperty(obj.type as TypeKind, name);
  // The checker lets a sweep's result be used as a Table (it may be one: grammar/checker.ts
  // sweepResult); a sweep that went to the background says here what it is instead.
  if (!sig && obj.type === "Experiment") {
    throw runtime(
      `this sweep runs in the background, so its value is an Experiment, which has no property ${name}: follow its rows in the experiments room, or write background = false to run the sweep here and get a Table`,
      span,
    );
  }
  if (!sig) {
    const known = PROPERTIES.filter((p) => p.owner === obj.type).map((p) => p.name);
    throw runtime(`${obj.type} has no property ${name}${known.length ? `; its properties are ${known.join(", ")}` : ""}`, span);
  }
  return sig;
}

export function getProperty(interp: Evaluator, obj: Value, name: string, e: Property, frame: Frame): Value {
  const sig = propertySig(obj, name, e.name.span);
  if (sig.params) throw runtime(`${name} takes arguments: write ${name}(…)`, e.name.span);
  const impl = localProperty(obj, propertyKey(sig)) ?? PROPERTY_IMPLS[propertyKey(sig)];
  if (!impl) throw pendingError(`${obj.type}.${name}`, sig.part, e.span);
  return impl(obj, [], { interp, frame, span: e.span, argSpans: [], named: new Map() });
}

export function callMethod(interp: Evaluator, obj: Value, name: string, args: Value[], e: Call, frame: Frame): Value {
  const nameSpan = e.callee.kind === "Property" ? e.callee.name.span : e.span;
  const sig = propertySig(obj, name, nameSpan);
  if (!sig.params) {
    // a plain property holding a function, applied: (r.f)(x)
    const fn = getProperty(interp, obj, name, e.callee as Property, frame);
    return interp.applyFunction(fn, args, e.span, frame);
  }
  if (args.length !== sig.params.length) throw runtime(`${name} takes ${sig.params.length} argument(s), got ${args.length}`, e.span);
  const impl = localProperty(obj, propertyKey(sig)) ?? PROPERTY_IMPLS[propertyKey(sig)];
  if (!impl) throw pendingError(`${obj.type}.${name}`, sig.part, e.span);
  return impl(obj, args, { interp, frame, span: e.span, argSpans: e.args.map((a) => a.span), named: new Map() });
}

/// Every signature entry with its key and part, for the pending-names test and the docs.
export function signatureEntries(): { key: string; part: number; implemented: boolean }[] {
  const out: { key: string; part: number; implemented: boolean }[] = [];
  for (const f of FUNCTIONS)
    for (const o of f.overloads)
      out.push({ key: overloadKey(f, o), part: o.part, implemented: IMPLEMENTED_FUNCTIONS.has(overloadKey(f, o)) });
  for (const p of PROPERTIES) out.push({ key: propertyKey(p), part: p.part, implemented: IMPLEMENTED_PROPERTIES.has(propertyKey(p)) });
  return out;
}
