/// Module and ring-as-module properties, resolve of a module, syzygy, koszul, tor, ext,
/// tor_lengths and serre (notation.md §5–§6) over a polynomial ring (engine part 2). Over a
/// quotient ring S/J the invariants that need resolutions over S/J belong to engine part 3 and
/// end with the pending Error; those that only need the module as an S-module (Hilbert series,
/// dim, degree, length, depth, the number of generators) are answered here.
import type { Span } from "../../grammar/ast";
import {
  AlgebraError,
  checkpoint,
  extModule,
  freeModule,
  koszulComplex,
  minimalPresentation,
  moduleHilbertSeries,
  regularity,
  resolveCoker,
  syzygyPresentation,
  torLengthsOf,
  torModule,
  variable,
  type HilbertSeries,
  type Poly,
  type Presentation,
  type Rat,
  type Resolution,
} from "../algebra/index";
import type { CallContext } from "./context";
import { reduceIn } from "./coerce";
import { limit, runtime } from "./errors";
import { LIMIT_TABLE } from "../limits";
import { matrixOf, moduleOf, moduleValue, presentationOverS } from "./modules";
import { bound } from "./named-options";
import { pdOverQuotient, presentationOverQuotient, syzygyOverQuotient } from "./quotients";
import { ringText } from "./text";
import type { ComplexValue, IdealValue, ModuleValue, RingValue, Value } from "./values";

type PropertyImpl = (obj: Value, args: readonly Value[], c: CallContext) => Value;
type FunctionImpl = (args: readonly Value[], c: CallContext) => Value;

const Int = (value: bigint | number): Value => ({ type: "Int", value: BigInt(value) });
const opts = (c: CallContext) => c.interp.session.compute;
/// The largest homological index of tor, ext and syzygy.
const MAX_INDEX = LIMIT_TABLE.homologicalIndex.value;

/// rank, reg, Tor, Ext and Serre's multiplicity are computed over polynomial rings only: over
/// S/J a resolution is usually infinite, so say what can be computed there instead.
function overPolynomialRing(M: ModuleValue, what: string, span: Span): void {
  if (M.ring.ideal.length > 0) {
    throw runtime(
      `${what} is computed for modules over a polynomial ring only, and this module lives over the quotient ring ${ringText(M.ring)} — there, read its Betti numbers from resolve(M, length = n) or poincare(M, terms = n)`,
      span,
    );
  }
}

const asModule = (v: Value, c: CallContext, span = c.span) => moduleOf(v, span, c);

/// The module as an S-module with its generators moved to degrees ≥ 0 (shift: how far).
function shiftedOverS(M: ModuleValue, span: Span): { P: Presentation; shift: number } {
  const { rows, degrees } = presentationOverS(M, span);
  const shift = -Math.min(0, ...degrees);
  return { P: { rows, rowDegrees: degrees.map((d) => d + shift) }, shift };
}

function seriesOf(P: Presentation, M: ModuleValue, c: CallContext): HilbertSeries {
  const cols = P.rows[0]?.length ?? 0;
  return moduleHilbertSeries(
    freeModule(M.ring.poly, P.rowDegrees),
    Array.from({ length: cols }, (_, q) => P.rows.map((row) => row[q])),
    opts(c),
  );
}

/// The Hilbert series of M shifted into degrees ≥ 0: dimension, degree and length do not move.
const shiftedSeries = new WeakMap<ModuleValue, HilbertSeries>();
function hilbertShifted(M: ModuleValue, c: CallContext): HilbertSeries {
  let h = shiftedSeries.get(M);
  if (!h) {
    h = seriesOf(shiftedOverS(M, c.span).P, M, c);
    shiftedSeries.set(M, h);
  }
  return h;
}

function hilbertOf(M: ModuleValue, c: CallContext, span: Span): Value {
  void span;
  // generators in negative degrees (Ext modules): the series of M moved up into degrees ≥ 0,
  // times t^low — a Laurent numerator
  const low = Math.min(0, ...M.degrees);
  return { type: "HilbertSeries", series: hilbertShifted(M, c), ...(low < 0 ? { shift: -low } : {}) };
}

function integerOf(q: Rat, span: Span, what: string): Value {
  if (q.d !== 1n) throw runtime(`the ${what} is ${q.n}/${q.d}, not an integer, in this weighted grading`, span);
  return Int(q.n);
}

/// The minimal graded free resolution of M over S (M over a polynomial ring), cached per module.
const resolutions = new WeakMap<ModuleValue, Resolution>();
function resolutionOf(M: ModuleValue, c: CallContext): { C: Resolution; shift: number } {
  const { P, shift } = shiftedOverS(M, c.span);
  let C = resolutions.get(M);
  if (!C) {
    C = resolveCoker(M.ring.poly, P.rows, P.rowDegrees, opts(c));
    resolutions.set(M, C);
  }
  return { C, shift };
}

/// M read as a module over the polynomial ring S (itself when M is over S), cached.
const sModules = new WeakMap<ModuleValue, ModuleValue>();
function asSModule(M: ModuleValue, c: CallContext): ModuleValue {
  if (M.ring.ideal.length === 0) return M;
  let X = sModules.get(M);
  if (!X) {
    const { rows, degrees } = presentationOverS(M, c.span);
    X = moduleValue(c.interp.session.rings.ambient(M.ring), rows, degrees);
    sModules.set(M, X);
  }
  return X;
}

function zeroModuleError(what: string, span: Span): never {
  throw runtime(`the zero module has no ${what} (it is infinite by convention)`, span);
}

function projectiveDimension(M: ModuleValue, c: CallContext): number {
  const { C } = resolutionOf(M, c);
  if (C.betti.entries.length === 0) zeroModuleError("projective dimension", c.span);
  return C.length;
}

/// Modules and quotient rings answer the same properties (notation.md §3, §5).
function moduleProperty(f: (M: ModuleValue, c: CallContext) => Value): PropertyImpl {
  return (v, _a, c) => f(asModule(v, c), c);
}

const MODULE_PROPS: Record<string, (M: ModuleValue, c: CallContext) => Value> = {
  hilbert: (M, c) => hilbertOf(M, c, c.span),
  dim: (M, c) => Int(hilbertShifted(M, c).dimension),
  degree: (M, c) => {
    const h = hilbertShifted(M, c);
    return h.dimension < 0 ? Int(0) : integerOf(h.degree, c.span, "degree");
  },
  length: (M, c) => {
    const h = hilbertShifted(M, c);
    if (h.dimension > 0) throw runtime(`the module is not of finite length: it has dimension ${h.dimension}`, c.span);
    return h.dimension < 0 ? Int(0) : integerOf(h.degree, c.span, "length");
  },
  // rank M = e(M)/e(S) when dim M = dim S, else 0 (common practice): the numerator at t = 1
  rank: (M, c) => {
    overPolynomialRing(M, "rank", c.span);
    const h = hilbertShifted(M, c);
    return Int(h.dimension === M.ring.poly.vars.length ? h.numerator.reduce((s, a) => s + a, 0n) : 0n);
  },
  min_gens: (M, c) => {
    const { P } = shiftedOverS(M, c.span);
    return Int(minimalPresentation(M.ring.poly, P.rows, P.rowDegrees, opts(c)).rowDegrees.length);
  },
  presentation: (M, c) => {
    if (M.ring.ideal.length > 0) return presentationOverQuotient(M, c);
    const P = minimalPresentation(M.ring.poly, M.presentation.rows, M.degrees, opts(c));
    return matrixOf(M.ring, P.rows, P.rows[0]?.length ?? 0);
  },
  pd: (M, c) => {
    // over a quotient ring: Auslander–Buchsbaum decides from a finite piece (quotients.ts)
    if (M.ring.ideal.length > 0) return Int(pdOverQuotient(M, M.ring.poly.vars.length - projectiveDimension(asSModule(M, c), c), c));
    return Int(projectiveDimension(M, c));
  },
  // depth M = n − pd_S M (Auslander–Buchsbaum); depth is the grade of m on M, the same over S and S/J
  depth: (M, c) => Int(M.ring.poly.vars.length - projectiveDimension(asSModule(M, c), c)),
  reg: (M, c) => {
    overPolynomialRing(M, "reg", c.span);
    const { C, shift } = resolutionOf(M, c);
    if (C.betti.entries.length === 0) zeroModuleError("regularity", c.span);
    return Int(regularity(C) - shift);
  },
};

export const MODULE_PROPERTIES: Record<string, PropertyImpl> = {
  ...Object.fromEntries(Object.entries(MODULE_PROPS).map(([k, f]) => [`Module.${k}`, moduleProperty(f)])),
  ...Object.fromEntries(
    ["rank", "pd", "reg", "degree", "length", "presentation", "min_gens"].map((k) => [`Ring.${k}`, moduleProperty(MODULE_PROPS[k])]),
  ),
};

function indexArg(v: Value, span: Span, what: string): number {
  const k = (v as { value: bigint }).value;
  if (k < 0n) throw runtime(`${what} must be at least 0, got ${k}`, span);
  if (k > BigInt(MAX_INDEX)) throw limit(`${what} ${k} is beyond the limit ${MAX_INDEX}`, span, "homologicalIndex");
  return Number(k);
}

/// Two modules over one polynomial ring, as S-presentations.
function pair(
  a: Value,
  b: Value,
  c: CallContext,
  spans: readonly Span[],
  what: string,
): { ring: RingValue; M: Presentation; N: Presentation } {
  const M = asModule(a, c, spans[0]);
  const N = asModule(b, c, spans[1]);
  if (M.ring !== N.ring)
    throw runtime(`${what} needs two modules over one ring, got modules over ${ringText(M.ring)} and ${ringText(N.ring)}`, c.span);
  overPolynomialRing(M, what, c.span);
  const P = (X: ModuleValue): Presentation => ({ rows: X.presentation.rows.map((r) => [...r]), rowDegrees: X.degrees });
  return { ring: M.ring, M: P(M), N: P(N) };
}

/// The presentation moved into degrees ≥ 0 (lengths of Tor do not see the shift).
function nonNegative(P: Presentation): Presentation {
  const s = -Math.min(0, ...P.rowDegrees);
  return { rows: P.rows, rowDegrees: P.rowDegrees.map((d) => d + s) };
}

function finiteLength<T>(what: string, span: Span, f: () => T): T {
  try {
    return f();
  } catch (e) {
    const dim = e instanceof AlgebraError ? /not of finite length \(it has dimension (\d+)\)/.exec(e.message) : null;
    if (dim) throw runtime(`${what} needs M ⊗ N of finite length, but M ⊗ N has dimension ${dim[1]}`, span);
    throw e;
  }
}

/// The most entries a Koszul complex's differentials may have together (dense matrices).
const MAX_KOSZUL_ENTRIES = LIMIT_TABLE.koszulEntries.value;

function koszulValue(ring: RingValue, fs: readonly Poly[], c: CallContext): ComplexValue {
  const K = koszulComplex(ring.poly, fs);
  const entries0 = K.ranks.slice(1).reduce((s, r, k) => s + r * K.ranks[k], 0);
  if (entries0 > MAX_KOSZUL_ENTRIES) {
    throw limit(
      `the Koszul complex on ${fs.length} elements has ${entries0} matrix entries, beyond the limit ${MAX_KOSZUL_ENTRIES}`,
      c.span,
      "koszulEntries",
    );
  }
  const maps = Array.from({ length: K.length }, (_, k) => {
    checkpoint(opts(c), { stage: "Koszul complex", detail: `differential ${k + 1}` });
    const A = K.map(k + 1).map((row) => row.map((f) => reduceIn(ring, f, opts(c))));
    return matrixOf(ring, A, K.ranks[k + 1]);
  });
  // the graded ranks: β_{i,j} = the number of basis elements e_T of F_i in degree j
  const entries: [number, number, number][] = [];
  K.degrees.forEach((ds, i) => {
    const count = new Map<number, number>();
    for (const d of ds) count.set(d, (count.get(d) ?? 0) + 1);
    for (const [j, b] of [...count].sort((x, y) => x[0] - y[0])) entries.push([i, j, b]);
  });
  return { type: "Complex", ring, ranks: K.ranks, betti: { type: "BettiTable", entries, complete: true }, complete: true, maps };
}

export const HOMOLOGY_FUNCTIONS: Record<string, FunctionImpl> = {
  "hilbert(Module)": ([M], c) => hilbertOf(asModule(M, c, c.argSpans[0]), c, c.argSpans[0]),
  "syzygy(Module or Ring, Int)": ([m, p], c) => {
    const k = indexArg(p, c.argSpans[1], "the syzygy index");
    // over a quotient ring (a module over S/J, or (S/J)/I read as a module): engine part 3
    if ((m.type === "Ring" && m.over) || (m.type === "Module" && m.ring.ideal.length > 0)) return syzygyOverQuotient(m, k, c);
    const M = asModule(m, c, c.argSpans[0]);
    const { P, shift } = shiftedOverS(M, c.span);
    const C = resolveCoker(M.ring.poly, P.rows, P.rowDegrees, { ...opts(c), length: k + 1 });
    const Z = syzygyPresentation(C, k);
    return moduleValue(
      M.ring,
      Z.rows,
      Z.rowDegrees.map((d) => d - shift),
    );
  },
  "koszul(Ring)": ([R], c) => {
    const r = R as RingValue;
    return koszulValue(
      r,
      r.poly.vars.map((_, i) => reduceIn(r, variable(r.poly, i), opts(c))),
      c,
    );
  },
  "koszul(Ideal)": ([I], c) => {
    const J = I as IdealValue;
    return koszulValue(J.ring, J.gens, c);
  },
  "tor(Int, Module or Ring, Module or Ring)": ([i, a, b], c) => {
    const k = indexArg(i, c.argSpans[0], "the index of Tor");
    const { ring, M, N } = pair(a, b, c, c.argSpans.slice(1), "tor");
    const T = torModule(ring.poly, k, M, N, opts(c));
    return moduleValue(ring, T.rows, T.rowDegrees);
  },
  "ext(Int, Module or Ring, Module or Ring)": ([i, a, b], c) => {
    const k = indexArg(i, c.argSpans[0], "the index of Ext");
    const { ring, M, N } = pair(a, b, c, c.argSpans.slice(1), "ext");
    const E = extModule(ring.poly, k, M, N, opts(c));
    return moduleValue(ring, E.rows, E.rowDegrees);
  },
  "tor_lengths(Module or Ring, Module or Ring)": ([a, b], c) => {
    const { ring, M, N } = pair(a, b, c, c.argSpans, "tor_lengths");
    const n = bound(c, "length", "homologicalIndex");
    const lengths = finiteLength("tor_lengths", c.span, () => torLengthsOf(ring.poly, nonNegative(M), nonNegative(N), opts(c)));
    return { type: "List", items: (n === undefined ? lengths : lengths.slice(0, n + 1)).map(Int) };
  },
  "serre(Module or Ring, Module or Ring)": ([a, b], c) => {
    const { ring, M, N } = pair(a, b, c, c.argSpans, "serre");
    const lengths = finiteLength("serre", c.span, () => torLengthsOf(ring.poly, nonNegative(M), nonNegative(N), opts(c)));
    return Int(lengths.reduce((s, l, i) => s + (i % 2 === 0 ? l : -l), 0));
  },
};
