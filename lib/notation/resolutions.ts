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


/// The Complex value of a resolution; `shift`: how far the module was moved up in degree
/// before resolving (its Betti numbers are moved back).
export function complexOf(r: Resolution, ring: RingValue, shift = 0): ComplexValue {
  const maps: MatrixValue[] = [];
  for (let i = 1; i <= r.length; i++) {
    const rows = r.map(i);
    maps.push({ type: "Matrix", ring, rows, cols: r.ranks[i] ?? 0 });
  }
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
  const length = bound(c, "length", "homologicalIndex");
  const degree = bound(c, "degree", "internalDegree");
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
