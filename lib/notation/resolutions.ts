/// resolve(…) and the properties of complexes and Betti tables. The engine's dispatcher
/// (lib/algebra/resolution/dispatch.ts) chooses how to resolve: Schreyer over S, degree by
/// degree over a graded quotient, or at the origin over a local Artinian ring.
import type { Span } from "../../grammar/ast";
import { bettiNumber, bettiTotals, minimalResolution } from "../algebra/index";
import { runtime } from "./errors";
import type { CallContext } from "./context";
import { bound } from "./named-options";
import { complexOf, gradedQuotientComplex, localComplex, MAX_MAP_ENTRIES } from "./complex";
import { requireCyclicAtOrigin, resolutionTarget } from "./resolution-input";
import type { BettiTableValue, ComplexValue, Value } from "./values";

const Int = (value: number): Value => ({ type: "Int", value: BigInt(value) });

/// resolve(M, length = n, degree = d): M a module or a quotient ring A / I read as the
/// cyclic module A/I. The engine's dispatcher chooses the method; here its options are
/// checked (with the user's spans) and its result rendered.
export function resolveValue([m]: readonly Value[], c: CallContext): Value {
  if (m.type !== "Module" && m.type !== "Ring")
    throw runtime(`resolve expects a Module or a quotient ring, got ${m.type}`, c.argSpans[0] ?? c.span);
  const t = resolutionTarget(m, c);
  const length = bound(c, "length", "homologicalIndex");
  if (t.method !== "schreyer" && length === undefined) {
    throw runtime("over a quotient ring a resolution is usually infinite: give a bound, e.g. resolve(M, length = 6)", c.span);
  }
  requireCyclicAtOrigin(t, "resolve", c);
  if (t.method === "artinian" && c.named.has("degree"))
    throw runtime("degree bounds need a graded ring; this one is read at the origin, ungraded", c.span);
  const degree = bound(c, "degree", "internalDegree");
  const partial = c.interp.session.partial;
  // each finished column streams as a one-column, still-incomplete Betti table
  const running = t.method === "graded-quotient" ? { note: "the resolution is still running" } : {};
  // resolve(…).betti and the like: the value is read for its Betti numbers only
  const bettiOnly = c.interp.bettiOnlyCall === c.span;
  const r = minimalResolution({
    ...t.input,
    length,
    degree: degree === undefined ? undefined : degree + t.shift,
    ...(bettiOnly ? { bettiOnly } : { keepMaps: MAX_MAP_ENTRIES }),
    partial: partial
      ? (col) =>
          partial({
            type: "BettiTable",
            entries: col.entries.map(([j, b]) => [col.index, j - t.shift, b] as const),
            complete: false,
            ...running,
          })
      : undefined,
    opts: c.interp.session.compute,
  });
  if (r.method === "schreyer") return complexOf(r.resolution, t.base, t.shift);
  if (r.method === "graded-quotient") return gradedQuotientComplex(r.resolution, t.base, length!, t.shift);
  return localComplex(r.resolution, r.overGivenRing, t.base, length!);
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
  "BettiTable.at": (v, [i, j]) =>
    Int(bettiNumber(v as BettiTableValue, Number((i as { value: bigint }).value), Number((j as { value: bigint }).value))),
  "BettiTable.totals": (v) => ({ type: "List", items: bettiTotals(v as BettiTableValue).map(Int) }),
};
