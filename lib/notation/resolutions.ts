/// resolve(…) and the properties of complexes and Betti tables, over engine part 2: the
/// minimal graded free resolution over a polynomial ring (Schreyer frame, minimised; see
/// lib/algebra/resolution). Resolutions over quotient rings belong to engine part 3.
import type { Span } from "../../grammar/ast";
import { bettiNumber, bettiTotals, ideal as engineIdeal, resolveQuotient, type Resolution } from "../algebra/index";
import { runtime } from "./errors";
import type { CallContext } from "./builtins";
import { bound } from "./named-options";
import { resolveModule } from "./homology";
import { resolveOverQuotient } from "./quotients";
import type { BettiTableValue, ComplexValue, MatrixValue, RingValue, Value } from "./values";

const Int = (value: number): Value => ({ type: "Int", value: BigInt(value) });


/// A list of n items each built on first reading (and then kept): the differentials of a
/// resolution are dense matrices of polynomials, far larger than its Betti numbers, and most
/// programs read only those (resolve(…).betti, poincare). Writing the value out (a named
/// object, a statement's result) reads every item.
export function lazyList<T>(n: number, build: (i: number) => T): readonly T[] {
  const items: T[] = new Array<T>(n);
  const cache = new Map<number, T>();
  for (let i = 0; i < n; i++) {
    Object.defineProperty(items, i, {
      enumerable: true,
      get: () => {
        let v = cache.get(i);
        if (v === undefined) cache.set(i, (v = build(i)));
        return v;
      },
    });
  }
  return Object.freeze(items);
}

/// The Complex value of a resolution; `shift`: how far the module was moved up in degree
/// before resolving (its Betti numbers are moved back). The differentials are built only
/// when read (lazyList).
export function complexOf(r: Resolution, ring: RingValue, shift = 0): ComplexValue {
  const maps = lazyList<MatrixValue>(r.length, (k) => ({ type: "Matrix", ring, rows: r.map(k + 1), cols: r.ranks[k + 1] ?? 0 }));
  const entries = shift === 0 ? r.betti.entries : r.betti.entries.map(([i, j, b]) => [i, j - shift, b] as const);
  const betti: BettiTableValue = { type: "BettiTable", entries, complete: r.complete };
  return { type: "Complex", ring, ranks: r.ranks, betti, complete: r.complete, maps };
}

/// resolve(A / I) for A a polynomial ring: the resolution of the cyclic module S/I over S.
export function resolveValue([m]: readonly Value[], c: CallContext): Value {
  if (m.type === "Module") return resolveModule(m, c);
  if (m.type !== "Ring") throw runtime(`resolve expects a Module or a quotient ring, got ${m.type}`, c.argSpans[0] ?? c.span);
  // over a quotient ring (the ring this quotient was formed from is itself one): engine part 3
  if (m.over) return resolveOverQuotient(m, c);
  const S = c.interp.session.rings.ambient(m);
  const length = bound(c, "length", 1000);
  const degree = bound(c, "degree", 100_000);
  const partial = c.interp.session.partial;
  const res = resolveQuotient(engineIdeal(m.poly, m.ideal), {
    ...c.interp.session.compute,
    ...(length !== undefined ? { length } : {}),
    ...(degree !== undefined ? { degree } : {}),
    // each finished column streams as a one-column, still-incomplete Betti table
    partial: partial
      ? (col) => partial({ type: "BettiTable", entries: col.entries.map(([j, b]) => [col.i, j, b] as const), complete: false })
      : undefined,
  });
  return complexOf(res, S);
}

function complex(v: Value): ComplexValue {
  return v as ComplexValue;
}

function indexArg(v: Value, span: Span, lo: number, hi: number, what: string): number {
  const k = (v as { value: bigint }).value;
  if (k < BigInt(lo) || k > BigInt(hi)) throw runtime(`${what} must be between ${lo} and ${hi}, got ${k}`, span);
  return Number(k);
}

export const COMPLEX_PROPERTIES: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  "Complex.betti": (v) => complex(v).betti,
  "Complex.ranks": (v) => ({ type: "List", items: complex(v).ranks.map(Int) }),
  "Complex.length": (v) => Int(complex(v).ranks.length - 1),
  "Complex.complete": (v) => ({ type: "Bool", value: complex(v).complete }),
  "Complex.map": (v, [i], c) => {
    const C = complex(v);
    const maps = C.maps ?? [];
    if (maps.length === 0) throw runtime("this complex has no differentials (its length is 0)", c.span);
    return maps[indexArg(i, c.argSpans[0] ?? c.span, 1, maps.length, "the index of the differential") - 1];
  },
  "BettiTable.at": (v, [i, j]) => Int(bettiNumber(v as BettiTableValue, Number((i as { value: bigint }).value), Number((j as { value: bigint }).value))),
  "BettiTable.totals": (v) => ({ type: "List", items: bettiTotals(v as BettiTableValue).map(Int) }),
};
