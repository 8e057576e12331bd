import { runtimeError } from "../errors";
import { coeffsOf, type Coeffs } from "../field/coeffs";
import type { Field } from "../field/field";
import type { MonoLayout } from "../monomial/monomial";
import { comparatorFor, validateOrder, type MonoCompare, type OrderSpec } from "../order/order";

/// A polynomial ring K[x_1..x_n] with a monomial order and a positive grading.
export interface PolyRing {
  readonly field: Field;
  readonly vars: readonly string[];
  readonly degrees: readonly number[];
  readonly order: OrderSpec;
}

/// Everything the polynomial code derives from a ring, computed once per ring.
export interface RingCtx<C = unknown> {
  readonly ring: PolyRing;
  readonly n: number;
  readonly K: Coeffs<C>;
  readonly cmp: MonoCompare;
  readonly layout: MonoLayout;
}

const VAR_NAME = /^[A-Za-z][A-Za-z0-9_]*$/;

export function polyRing(field: Field, vars: readonly string[], opts?: { order?: OrderSpec; degrees?: number[] }): PolyRing {
  if (!field || (field.kind !== "Q" && field.kind !== "gf")) throw runtimeError("polyRing", "the field must be gf(p) or QQ");
  if (!Array.isArray(vars)) throw runtimeError("polyRing", "the variables must be a list of names");
  const seen = new Set<string>();
  for (const v of vars) {
    if (typeof v !== "string" || !VAR_NAME.test(v)) {
      throw runtimeError("polyRing", `${JSON.stringify(v)} is not a variable name (a letter, then letters, digits or _)`);
    }
    if (seen.has(v)) throw runtimeError("polyRing", `the variable ${v} appears twice`);
    seen.add(v);
  }
  const n = vars.length;
  const degrees = opts?.degrees ?? new Array<number>(n).fill(1);
  if (degrees.length !== n) throw runtimeError("polyRing", `degrees needs ${n} entries, one per variable, got ${degrees.length}`);
  degrees.forEach((d, i) => {
    if (!Number.isInteger(d) || d < 1 || d > 1 << 20) {
      throw runtimeError("polyRing", `the degree of ${vars[i]} must be a positive integer (at most 2^20), got ${d}`);
    }
  });
  const order = opts?.order ?? { kind: "grevlex" as const };
  validateOrder(order, n);
  return Object.freeze({
    field,
    vars: Object.freeze([...vars]),
    degrees: Object.freeze([...degrees]),
    order: Object.freeze(order.kind === "weights" ? { kind: "weights" as const, weights: [...order.weights] } : { kind: order.kind }),
  });
}

const contexts = new WeakMap<PolyRing, RingCtx>();

export function ringCtx(R: PolyRing): RingCtx {
  let c = contexts.get(R);
  if (!c) {
    c = buildCtx(R);
    contexts.set(R, c);
  }
  return c;
}

function buildCtx(R: PolyRing): RingCtx {
  const n = R.vars.length;
  const layout: MonoLayout = {
    n,
    degrees: Int32Array.from(R.degrees),
    keyWeights: R.order.kind === "weights" ? Int32Array.from(R.order.weights) : null,
    keyIsZero: R.order.kind === "lex",
  };
  return { ring: R, n, K: coeffsOf(R.field), cmp: comparatorFor(R.order), layout };
}

/// Whether two rings are the same ring (same field, variables, grading and order).
export function sameRing(A: PolyRing, B: PolyRing): boolean {
  if (A === B) return true;
  const fieldEq = A.field.kind === B.field.kind && (A.field.kind === "Q" || A.field.p === (B.field as { p: number }).p);
  return (
    fieldEq &&
    A.vars.length === B.vars.length &&
    A.vars.every((v, i) => v === B.vars[i] && A.degrees[i] === B.degrees[i]) &&
    JSON.stringify(A.order) === JSON.stringify(B.order)
  );
}
