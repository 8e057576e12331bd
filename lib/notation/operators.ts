/// The notation's operators. Each row of the signature table (grammar/signatures.ts
/// OPERATORS) that the evaluator implements has an entry here under its key; the first
/// row whose operand types accept the runtime values is applied, as in the checker.
import type { Binary, Span, Unary } from "../../grammar/ast";
import { OPERATORS, type OperatorName, type OperatorSig } from "../../grammar/signatures";
import { isAssignable, typeToString } from "../../grammar/types";
import { add, equals, isZero, mul, neg, one, pow, scale, sub, zero, type Poly } from "../algebra/index";
import { reduceIn, ringOfOperands, toPoly } from "./coerce";
import { limit, runtime } from "./errors";
import {
  colonByElement,
  colonOf,
  containsPoly,
  idealPowerOf,
  idealProductOf,
  idealSumOf,
  idealValue,
  idealsEqual,
  intersectionOf,
  isSubsetOf,
} from "./ideals";
import type { Evaluator, Frame, OpContext } from "./context";
import { MODULE_OPERATORS } from "./modules";
import { pendingError } from "./pending";
// The number type is imported as RatNumber: `Rat` and `rat` below name this file's Value helpers.
import { ratOf, ratAdd, ratCompare, ratDiv, ratMul, ratNeg, ratSub, type Rat as RatNumber } from "../algebra/index";
import { ringText } from "./text";
import { valueType } from "./value-type";
import type { MatrixValue, RingValue, Value } from "./values";

type BinaryImpl = (l: Value, r: Value, c: OpContext) => Value;
type UnaryImpl = (v: Value, c: OpContext) => Value;

export function operatorKey(row: OperatorSig): string {
  return row.left ? `${typeToString(row.left)} ${row.op} ${typeToString(row.right)}` : `${row.op} ${typeToString(row.right)}`;
}

const rat = (v: Value): RatNumber => (v.type === "Int" ? ratOf(v.value) : v.type === "Rat" ? v.value : ratOf(0n));
const intOf = (v: Value): bigint => (v.type === "Int" ? v.value : 0n);
const Int = (value: bigint): Value => ({ type: "Int", value });
const Rat = (value: RatNumber): Value => ({ type: "Rat", value });
const Bool = (value: boolean): Value => ({ type: "Bool", value });

/// Operands of a polynomial operation, in their common ring.
function polys(l: Value, r: Value, c: OpContext): { ring: RingValue; f: Poly; g: Poly } {
  const ring = ringOfOperands([l, r], c.span, c.frame.ring);
  const opts = c.interp.session.compute;
  return { ring, f: toPoly(l, ring, c.leftSpan, opts), g: toPoly(r, ring, c.rightSpan, opts) };
}

function polyResult(ring: RingValue, f: Poly, c: OpContext): Value {
  return { type: "Poly", ring, poly: reduceIn(ring, f, c.interp.session.compute) };
}

function ideal(v: Value, span: Span) {
  if (v.type !== "Ideal") throw runtime(`expected an Ideal, got ${v.type}`, span);
  return v;
}

function matrix(v: Value, span: Span): MatrixValue {
  if (v.type !== "Matrix") throw runtime(`expected a Matrix, got ${v.type}`, span);
  return v;
}

function exponent(r: Value, c: OpContext, max: number, what: string, name: "polyExponent" | "idealPower"): number {
  const k = intOf(r);
  if (k < 0n) throw runtime(`the exponent must be non-negative, got ${k}`, c.rightSpan);
  if (k > BigInt(max)) throw limit(`${what} ${k} is beyond the limit ${max}`, c.rightSpan, name);
  return Number(k);
}

function matrixSum(A: MatrixValue, B: MatrixValue, c: OpContext, sign: 1 | -1): Value {
  const ring = ringOfOperands([A, B], c.span, null);
  if (A.rows.length !== B.rows.length || A.cols !== B.cols) {
    throw runtime(`the matrices have different shapes: ${A.rows.length}×${A.cols} and ${B.rows.length}×${B.cols}`, c.span);
  }
  const opts = c.interp.session.compute;
  const rows = A.rows.map((row, i) =>
    row.map((f, j) => {
      const g = reduceIn(ring, B.rows[i][j], opts);
      return reduceIn(ring, sign === 1 ? add(ring.poly, f, g) : sub(ring.poly, f, g), opts);
    }),
  );
  return { type: "Matrix", ring, rows, cols: A.cols };
}

function matrixProduct(A: MatrixValue, B: MatrixValue, c: OpContext): Value {
  const ring = ringOfOperands([A, B], c.span, null);
  if (A.cols !== B.rows.length) {
    throw runtime(`cannot multiply a ${A.rows.length}×${A.cols} matrix by a ${B.rows.length}×${B.cols} matrix`, c.span);
  }
  const opts = c.interp.session.compute;
  const rows = A.rows.map((row) =>
    Array.from({ length: B.cols }, (_, j) =>
      reduceIn(
        ring,
        row.reduce((acc, f, k) => add(ring.poly, acc, mul(ring.poly, f, B.rows[k][j], opts)), zero(ring.poly)),
        opts,
      ),
    ),
  );
  return { type: "Matrix", ring, rows, cols: B.cols };
}

function intPower(base: bigint, r: Value, c: OpContext): Value {
  const k = intOf(r);
  if (k < 0n) throw runtime(`the exponent must be non-negative, got ${k}`, c.rightSpan);
  const a = base < 0n ? -base : base;
  if (a > 1n && BigInt(a.toString(2).length) * k > BigInt(c.interp.session.limits.maxIntegerBits)) {
    throw limit(`${base}^${k} would have more than ${c.interp.session.limits.maxIntegerBits} bits`, c.span, "integerBits");
  }
  if (a <= 1n) return Int(base === 0n ? (k === 0n ? 1n : 0n) : base === 1n ? 1n : k % 2n === 0n ? 1n : -1n);
  return Int(base ** k);
}

const compare =
  (test: (d: number) => boolean): BinaryImpl =>
  (l, r) =>
    Bool(test(ratCompare(rat(l), rat(r))));

const BINARY: Record<string, BinaryImpl> = {
  "Int + Int": (l, r) => Int(intOf(l) + intOf(r)),
  "Rat + Rat": (l, r) => Rat(ratAdd(rat(l), rat(r))),
  "Poly + Poly": (l, r, c) => {
    const { ring, f, g } = polys(l, r, c);
    return polyResult(ring, add(ring.poly, f, g), c);
  },
  "Ideal + Ideal": (l, r, c) => idealSumOf(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span),
  "Matrix + Matrix": (l, r, c) => matrixSum(matrix(l, c.leftSpan), matrix(r, c.rightSpan), c, 1),
  "Int - Int": (l, r) => Int(intOf(l) - intOf(r)),
  "Rat - Rat": (l, r) => Rat(ratSub(rat(l), rat(r))),
  "Poly - Poly": (l, r, c) => {
    const { ring, f, g } = polys(l, r, c);
    return polyResult(ring, sub(ring.poly, f, g), c);
  },
  "Matrix - Matrix": (l, r, c) => matrixSum(matrix(l, c.leftSpan), matrix(r, c.rightSpan), c, -1),
  "Int * Int": (l, r) => Int(intOf(l) * intOf(r)),
  "Rat * Rat": (l, r) => Rat(ratMul(rat(l), rat(r))),
  "Poly * Poly": (l, r, c) => {
    const { ring, f, g } = polys(l, r, c);
    return polyResult(ring, mul(ring.poly, f, g, c.interp.session.compute), c);
  },
  "Ideal * Ideal": (l, r, c) => idealProductOf(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute),
  "Poly * Ideal": (l, r, c) => {
    const I = ideal(r, c.rightSpan);
    const f = toPoly(l, I.ring, c.leftSpan, c.interp.session.compute);
    return idealValue(
      I.ring,
      I.gens.map((g) => mul(I.ring.poly, f, g, c.interp.session.compute)),
      c.interp.session.compute,
    );
  },
  "Ideal * Poly": (l, r, c) => BINARY["Poly * Ideal"](r, l, { ...c, leftSpan: c.rightSpan, rightSpan: c.leftSpan }),
  "Matrix * Matrix": (l, r, c) => matrixProduct(matrix(l, c.leftSpan), matrix(r, c.rightSpan), c),
  "Poly * Matrix": (l, r, c) => {
    const A = matrix(r, c.rightSpan);
    const opts = c.interp.session.compute;
    const f = toPoly(l, A.ring, c.leftSpan, opts);
    return {
      type: "Matrix",
      ring: A.ring,
      rows: A.rows.map((row) => row.map((g) => reduceIn(A.ring, mul(A.ring.poly, f, g, opts), opts))),
      cols: A.cols,
    };
  },
  "Matrix * Poly": (l, r, c) => BINARY["Poly * Matrix"](r, l, { ...c, leftSpan: c.rightSpan, rightSpan: c.leftSpan }),
  "Int / Int": (l, r, c) => {
    if (intOf(r) === 0n) throw runtime("division by zero", c.rightSpan);
    return Rat(ratOf(intOf(l), intOf(r)));
  },
  "Rat / Rat": (l, r, c) => {
    if (rat(r).n === 0n) throw runtime("division by zero", c.rightSpan);
    return Rat(ratDiv(rat(l), rat(r)));
  },
  "Poly / Rat": (l, r, c) => {
    const q = rat(r);
    if (q.n === 0n) throw runtime("division by zero", c.rightSpan);
    const ring = ringOfOperands([l], c.span, c.frame.ring);
    if (ring.poly.field.kind === "gf" && q.n % BigInt(ring.poly.field.p) === 0n) {
      throw runtime(`division by zero: ${q.n} is 0 in GF(${ring.poly.field.p})`, c.rightSpan);
    }
    const f = toPoly(l, ring, c.leftSpan, c.interp.session.compute);
    return polyResult(ring, scale(ring.poly, f, q.d, q.n), c);
  },
  "Ring / Ideal": (l, r, c) => {
    if (l.type !== "Ring") throw runtime(`expected a Ring, got ${l.type}`, c.leftSpan);
    const I = ideal(r, c.rightSpan);
    if (!(I.ring === l || (I.ring.poly === l.poly && I.ring.ideal.length === 0))) {
      throw runtime(`this is an ideal of ${ringText(I.ring)}, not of ${ringText(l)}`, c.rightSpan);
    }
    const rings = c.interp.session.rings;
    return rings.quotient(
      l,
      I.gens.map((g) => reduceIn(l, g, c.interp.session.compute)).filter((g) => !isZero(g)),
    );
  },
  "Int ^ Int": (l, r, c) => intPower(intOf(l), r, c),
  "Rat ^ Int": (l, r, c) => {
    const q = rat(l);
    const num = intPower(q.n, r, c);
    const den = intPower(q.d, r, c);
    return Rat(ratOf(intOf(num), intOf(den)));
  },
  "Poly ^ Int": (l, r, c) => {
    const ring = ringOfOperands([l], c.span, c.frame.ring);
    const k = exponent(r, c, c.interp.session.limits.maxPolyExponent, "the exponent", "polyExponent");
    const opts = c.interp.session.compute;
    const f = toPoly(l, ring, c.leftSpan, opts);
    return polyResult(ring, ring.ideal.length === 0 ? pow(ring.poly, f, k, opts) : powerModulo(ring, f, k, c), c);
  },
  "Ideal ^ Int": (l, r, c) =>
    idealPowerOf(
      ideal(l, c.leftSpan),
      exponent(r, c, c.interp.session.limits.maxIdealPower, "the power of an ideal", "idealPower"),
      c.interp.session.compute,
    ),
  "Ideal & Ideal": (l, r, c) => intersectionOf(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute),
  "Ideal : Ideal": (l, r, c) => colonOf(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute),
  "Ideal : Poly": (l, r, c) => {
    const I = ideal(l, c.leftSpan);
    return colonByElement(I, toPoly(r, I.ring, c.rightSpan, c.interp.session.compute), c.interp.session.compute);
  },
  "Ideal == Ideal": (l, r, c) => Bool(idealsEqual(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute)),
  "Poly == Poly": (l, r, c) => Bool(c.interp.equal(l, r, c.span)),
  "T == T": (l, r, c) => Bool(c.interp.equal(l, r, c.span)),
  "Ideal != Ideal": (l, r, c) => Bool(!idealsEqual(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute)),
  "Poly != Poly": (l, r, c) => Bool(!c.interp.equal(l, r, c.span)),
  "T != T": (l, r, c) => Bool(!c.interp.equal(l, r, c.span)),
  "Ideal <= Ideal": (l, r, c) => Bool(isSubsetOf(ideal(l, c.leftSpan), ideal(r, c.rightSpan), c.span, c.interp.session.compute)),
  "Int or Rat <= Int or Rat": compare((d) => d <= 0),
  "Int or Rat < Int or Rat": compare((d) => d < 0),
  "Int or Rat > Int or Rat": compare((d) => d > 0),
  "Int or Rat >= Int or Rat": compare((d) => d >= 0),
  "Poly in Ideal": (l, r, c) => {
    const I = ideal(r, c.rightSpan);
    const opts = c.interp.session.compute;
    return Bool(containsPoly(I, toPoly(l, I.ring, c.leftSpan, opts), opts));
  },
  "T in List<T>": (l, r, c) => Bool(r.type === "List" && r.items.some((x) => c.interp.equal(l, x, c.span))),
  ...MODULE_OPERATORS,
};

/// f^k in a quotient ring by repeated squaring, reducing after every product so the
/// representatives stay small.
function powerModulo(ring: RingValue, f: Poly, k: number, c: OpContext): Poly {
  const opts = c.interp.session.compute;
  let result = reduceIn(ring, one(ring.poly), opts);
  let base = f;
  for (let e = k; e > 0; e >>= 1) {
    if (e & 1) result = reduceIn(ring, mul(ring.poly, result, base, opts), opts);
    if (e > 1) base = reduceIn(ring, mul(ring.poly, base, base, opts), opts);
  }
  return result;
}

const UNARY: Record<string, UnaryImpl> = {
  "- Int": (v) => Int(-intOf(v)),
  "- Rat": (v) => Rat(ratNeg(rat(v))),
  "- Poly": (v, c) => {
    const ring = ringOfOperands([v], c.span, c.frame.ring);
    return polyResult(ring, neg(ring.poly, toPoly(v, ring, c.rightSpan)), c);
  },
  "- Matrix": (v, c) => {
    const A = matrix(v, c.rightSpan);
    return { type: "Matrix", ring: A.ring, rows: A.rows.map((row) => row.map((f) => neg(A.ring.poly, f))), cols: A.cols };
  },
  "not Bool": (v) => Bool(!(v.type === "Bool" && v.value)),
};

/// Keys of the operator rows the evaluator implements (read by the pending-names test).
export const IMPLEMENTED_OPERATORS: ReadonlySet<string> = new Set([
  ...Object.keys(BINARY),
  ...Object.keys(UNARY),
  "Bool and Bool",
  "Bool or Bool",
  "Int .. Int",
  "List<T> index Int",
]);

function rowFor(op: OperatorName, operands: readonly Value[], prefix: boolean): OperatorSig | undefined {
  const types = operands.map(valueType);
  return OPERATORS.find(
    (row) =>
      row.op === op &&
      (row.left === undefined) === prefix &&
      (prefix ? isAssignable(types[0], row.right) : isAssignable(types[0], row.left!) && isAssignable(types[1], row.right)),
  );
}

export function applyBinary(interp: Evaluator, e: Binary, l: Value, r: Value, frame: Frame): Value {
  const row = rowFor(e.op, [l, r], false);
  if (!row) throw runtime(`${e.op} does not apply to ${l.type} and ${r.type}`, e.opSpan);
  const impl = BINARY[operatorKey(row)];
  if (!impl) throw pendingError(`${typeToString(row.left!)} ${row.op} ${typeToString(row.right)}`, row.part, e.span);
  return impl(l, r, { interp, frame, span: e.span, leftSpan: e.left.span, rightSpan: e.right.span });
}

export function applyUnary(interp: Evaluator, e: Unary, v: Value, frame: Frame): Value {
  const row = rowFor(e.op, [v], true);
  if (!row) throw runtime(`${e.op} does not apply to ${v.type}`, e.span);
  const impl = UNARY[operatorKey(row)];
  if (!impl) throw pendingError(`${row.op} ${typeToString(row.right)}`, row.part, e.span);
  return impl(v, { interp, frame, span: e.span, leftSpan: e.span, rightSpan: e.operand.span });
}

/// Equality of values: numbers by value (2 == 4/2), polynomials in their common ring,
/// ideals as ideals, lists and records item by item.
export function valuesEqual(interp: Evaluator, a: Value, b: Value, span: Span): boolean {
  const numeric = (v: Value) => v.type === "Int" || v.type === "Rat";
  if (numeric(a) && numeric(b)) return ratCompare(rat(a), rat(b)) === 0;
  if ((a.type === "Poly" || numeric(a)) && (b.type === "Poly" || numeric(b))) {
    const ring = ringOfOperands([a, b], span, null);
    const opts = interp.session.compute;
    return equals(ring.poly, toPoly(a, ring, span, opts), toPoly(b, ring, span, opts));
  }
  if (a.type !== b.type) return false;
  switch (a.type) {
    case "Bool":
    case "Str":
      return a.value === (b as typeof a).value;
    case "Field":
      return (
        a.field.kind === (b as typeof a).field.kind && (a.field.kind === "Q" || a.field.p === ((b as typeof a).field as { p: number }).p)
      );
    case "Ring":
      return a === b;
    case "Ideal":
      return a.ring === (b as typeof a).ring && idealsEqual(a, b as typeof a, span, interp.session.compute);
    case "List": {
      const bl = b as typeof a;
      return a.items.length === bl.items.length && a.items.every((x, i) => valuesEqual(interp, x, bl.items[i], span));
    }
    case "Record": {
      const br = b as typeof a;
      return (
        a.fields.size === br.fields.size &&
        [...a.fields].every(([k, x]) => br.fields.has(k) && valuesEqual(interp, x, br.fields.get(k)!, span))
      );
    }
    case "None":
      return true;
    case "Matrix": {
      const bm = b as typeof a;
      if (a.ring !== bm.ring || a.cols !== bm.cols || a.rows.length !== bm.rows.length) return false;
      return a.rows.every((row, i) => row.every((f, j) => equals(a.ring.poly, f, bm.rows[i][j])));
    }
    case "BettiTable": {
      const bb = b as typeof a;
      return (
        a.complete === bb.complete &&
        a.entries.length === bb.entries.length &&
        a.entries.every((e, k) => e.every((x, i) => x === bb.entries[k][i]))
      );
    }
    case "HilbertSeries": {
      // the same grading and numerator over the same full denominator
      const x = a.series,
        y = (b as typeof a).series;
      return (
        x.weights.join(",") === y.weights.join(",") &&
        x.numerator.join(",") === y.numerator.join(",") &&
        (a.shift ?? 0) === ((b as typeof a).shift ?? 0)
      );
    }
    default:
      return a === b;
  }
}

/// a + b by the `+` rows, for `sum`.
export function addValues(interp: Evaluator, a: Value, b: Value, span: Span, frame: Frame): Value {
  const row = rowFor("+", [a, b], false);
  const impl = row && BINARY[operatorKey(row)];
  if (!impl) throw runtime(`cannot add ${a.type} and ${b.type}`, span);
  return impl(a, b, { interp, frame, span, leftSpan: span, rightSpan: span });
}
