/// Homological algebra over local rings in the notation (issue 16): resolutions, Poincaré
/// series, syzygies, Tor lengths and Serre's intersection multiplicity over R_m, R = S/J
/// localised at a point; depth, Cohen–Macaulay, Gorenstein and complete intersection of a
/// local ring; the Burch index at the point. Engine: lib/algebra/localring (minimal free
/// resolutions by cancelling units in global resolutions; lengths from tangent cones).
import {
  burchIndexOfRing,
  constant,
  equals as equalsPoly,
  homologyModule,
  ideal as engineIdeal,
  localModuleNumerator,
  localQuotientLength,
  scalarBlocks,
  terms as termsOf,
  variable,
  zero as zeroOf,
} from "../algebra/index";

import {
  bassNumbers,
  kernelColumns,
  localResolution,
  localTorLengths,
  translate,
  type LocalFreeResolution,
  type Point,
} from "../algebra/index";
import { localDimension } from "../algebra/index";
import type { Poly, PolyRing } from "../algebra/index";
import type { CallContext } from "./context";
import { runtime } from "./errors";
import { analysisOf } from "./local";
import { moduleValue } from "./modules";
import { bound } from "./named-options";
import { seriesValue } from "./quotients";
import { list, type ModuleValue, type ComplexValue, type MatrixValue, type RingValue, type Value } from "./values";

const oneOf = (S: PolyRing) => constant(S, 1n);
const Int = (value: number | bigint): Value => ({ type: "Int", value: BigInt(value) });
const Bool = (value: boolean): Value => ({ type: "Bool", value });
const opts = (c: CallContext) => c.interp.session.compute;

const originOf = (at: Point) => at.every((a) => a.n === 0n);
const moveIn = (S: PolyRing, at: Point, f: Poly) => (originOf(at) ? f : translate(S, f, at));
const moveOut = (S: PolyRing, at: Point, f: Poly) =>
  originOf(at)
    ? f
    : translate(
        S,
        f,
        at.map((a) => ({ n: -a.n, d: a.d })),
      );

/// What is resolved over the local ring A_m (A = S/J): a presentation (by columns) moved to the origin.
interface LocalTarget {
  base: RingValue;
  S: PolyRing;
  at: Point;
  J: Poly[];
  rows: number;
  columns: Poly[][];
}

function targetOf(m: Value, c: CallContext, span = c.argSpans[0] ?? c.span): LocalTarget {
  if (m.type === "Ring") {
    // a graded ring (not localised) is read at the origin, its irrelevant ideal
    const at = m.local?.at ?? m.poly.vars.map(() => ({ n: 0n, d: 1n }));
    const rings = c.interp.session.rings;
    const base = m.over ?? (m.local ? rings.localize(rings.ambient(m), at) : rings.ambient(m));
    const S = m.poly;
    const J = base.ideal.map((f) => moveIn(S, at, f));
    const I = m.ideal.slice(base.ideal.length).map((f) => moveIn(S, at, f));
    return { base, S, at, J, rows: 1, columns: I.map((f) => [f]) };
  }
  if (m.type === "Module") {
    const r = m.ring;
    const at = r.local?.at ?? r.poly.vars.map(() => ({ n: 0n, d: 1n }));
    const S = r.poly;
    const P = m.presentation;
    const columns = Array.from({ length: P.cols }, (_, k) => P.rows.map((row) => moveIn(S, at, row[k])));
    return { base: r, S, at, J: r.ideal.map((f) => moveIn(S, at, f)), rows: P.rows.length, columns };
  }
  throw runtime(`expected a Module or a quotient ring, got ${m.type}`, span);
}

const resolutions = new WeakMap<object, Map<number, LocalFreeResolution>>();
function resolveTarget(m: Value, t: LocalTarget, length: number, c: CallContext): LocalFreeResolution {
  let byLength = resolutions.get(m);
  if (!byLength) resolutions.set(m, (byLength = new Map()));
  let F = byLength.get(length);
  if (!F) {
    F = localResolution(t.S, t.rows, t.columns, t.J, length, opts(c));
    byLength.set(length, F);
  }
  return F;
}

/// The length bound: required over a local quotient ring (resolutions are usually infinite);
/// over the local ring of S at a point the resolution ends by n + 1 (Hilbert's syzygy theorem).
function lengthOf(t: LocalTarget, c: CallContext, what: string): number {
  const n = bound(c, "length", "homologicalIndex");
  if (n !== undefined) return n;
  if (t.J.length === 0) return t.S.vars.length + 1;
  throw runtime(`over a local quotient ring a ${what} is usually infinite: give a bound, e.g. ${what}(M, length = 6)`, c.span);
}

const pointText = (at: Point) => (originOf(at) ? "the origin" : `(${at.map((a) => (a.d === 1n ? `${a.n}` : `${a.n}/${a.d}`)).join(", ")})`);

function complexValue(t: LocalTarget, F: LocalFreeResolution, length: number): ComplexValue {
  const where = `over the local ring at ${pointText(t.at)}, ungraded: the Betti table lists β_i under internal degree 0; the maps are determined up to units of the local ring`;
  const note = F.complete ? where : `only homological degrees ≤ ${length} were computed; the resolution goes on; ${where}`;
  const ranks = F.ranks.slice(0, length + 1);
  const maps: MatrixValue[] = F.maps.slice(0, length).map((rows, i) => ({
    type: "Matrix",
    ring: t.base,
    rows: rows.map((row) => row.map((f) => moveOut(t.S, t.at, f))),
    cols: ranks[i + 1],
  }));
  const entries = ranks.flatMap((b, i) => (b > 0 ? [[i, 0, b] as const] : []));
  return {
    type: "Complex",
    ring: t.base,
    ranks,
    betti: { type: "BettiTable", entries, complete: F.complete, note },
    complete: F.complete,
    maps,
    note,
  };
}

/// The minimal resolution of S/I over S_m (I the defining ideal of the local ring r).
function ringResolution(r: RingValue, c: CallContext): LocalFreeResolution {
  const L = analysisOf(r, c);
  if (L.zero)
    throw runtime(
      "this local ring is zero (its point is not on the zero set of the ideal): depth, Cohen–Macaulay, Gorenstein and complete intersection are not defined for it",
      c.span,
    );
  const S = r.poly;
  const columns = L.ideal.map((f) => [f]);
  let byLength = resolutions.get(r);
  if (!byLength) resolutions.set(r, (byLength = new Map()));
  let F = byLength.get(-1);
  if (!F) {
    F = localResolution(S, 1, columns, [], S.vars.length + 1, opts(c));
    byLength.set(-1, F);
  }
  return F;
}

/// Depth and friends of the local ring S_m/I from its minimal resolution over the regular
/// local ring S_m: depth = n − pd (M. Auslander, D. Buchsbaum, Trans. AMS 85, 1957), CM when
/// depth = dim, Gorenstein when CM with last Betti number 1 and complete intersection when
/// β_1 = codim (D. Eisenbud, Commutative Algebra, Cor. 21.16 and §21.2; from memory).
function ringInvariants(r: RingValue, c: CallContext) {
  const F = ringResolution(r, c);
  const n = r.poly.vars.length;
  let pd = F.ranks.length - 1;
  while (pd > 0 && F.ranks[pd] === 0) pd--;
  const depth = n - pd;
  const dim = localDimension(analysisOf(r, c));
  const cm = depth === dim;
  return { depth, dim, cm, gorenstein: cm && F.ranks[pd] === 1, ci: (F.ranks[1] ?? 0) === n - dim };
}

function torLengths(a: Value, b: Value, length: number, c: CallContext): bigint[] {
  const ta = targetOf(a, c, c.argSpans[0]);
  // the second module must be cyclic: a quotient ring L / I, or coker of one row (R.residue)
  if (b.type !== "Ring" && !(b.type === "Module" && b.presentation.rows.length === 1)) {
    throw runtime(
      "over a local or quotient ring tor_lengths and serre take a cyclic second module: a quotient ring L / I or a module with one generator",
      c.argSpans[1] ?? c.span,
    );
  }
  const tb = targetOf(b, c, c.argSpans[1]);
  const sameBase =
    ta.base === tb.base ||
    (ta.base.ideal.length === tb.base.ideal.length &&
      ta.base.ideal.every((f, i) => f === tb.base.ideal[i]) &&
      ta.at.every((x, i) => x.n === tb.at[i].n && x.d === tb.at[i].d));
  if (!sameBase) throw runtime("both modules must live over the same local ring", c.span);
  // F resolved one step further, so that the image of d_{length+1} is known
  const F = resolveTarget(a, ta, length + 1, c);
  const K = tb.columns.map((col) => col[0]);
  // tb.J is the ring's ideal, the same as ta.J; K adds the module's own relations
  return localTorLengths(ta.S, F, ta.J, K, length, opts(c));
}

/// A finite sum needs M ⊗ N of finite length: checked through the length of the quotient.
function requireFiniteLength(a: Value, b: Value, c: CallContext, what: string): void {
  if (a.type !== "Ring" || b.type !== "Ring") return;
  const rings = c.interp.session.rings;
  const sum = rings.quotient(a, b.ideal);
  const L = analysisOf(sum, c);
  if (!L.zero && L.tangentSeries.dimension > 0) {
    throw runtime(
      `${what}: M ⊗ N does not have finite length at ${pointText(a.local?.at ?? a.poly.vars.map(() => ({ n: 0n, d: 1n })))} (the ideals' sum is not primary to the maximal ideal there), so the intersection multiplicity is not defined`,
      c.span,
    );
  }
}

type PropertyImpl = (obj: Value, args: readonly Value[], c: CallContext) => Value;
type FunctionImpl = (args: readonly Value[], c: CallContext) => Value;

export const LOCAL_HOMOLOGY_PROPERTIES: Record<string, PropertyImpl> = {
  "Ring.depth": (v, _a, c) => Int(ringInvariants(v as RingValue, c).depth),
  "Ring.is_cm": (v, _a, c) => Bool(ringInvariants(v as RingValue, c).cm),
  "Ring.is_gorenstein": (v, _a, c) => Bool(ringInvariants(v as RingValue, c).gorenstein),
  "Ring.is_ci": (v, _a, c) => Bool(ringInvariants(v as RingValue, c).ci),
  "Ring.burch_index": (v, _a, c) => burchValue(v as RingValue, c),
  "Ring.is_burch": (v, _a, c) => Bool((burchValue(v as RingValue, c) as { value: bigint }).value >= 1n),
  // ℓ(M_m), dim and depth of M at the point, read as a module over S_m presented by [U | J·1]:
  // length and dimension from the tangent cone of M; depth = n − pd over the regular ring S_m
  // (Auslander–Buchsbaum; the grade of m on M is the same over S_m and R_m)
  "Module.length": (v, _a, c) => {
    const t = targetOf(v, c, c.span);
    const all = [...t.columns, ...scalarBlocks(t.S, t.rows, t.J)];
    const units = Array.from({ length: t.rows }, (_, k) => Array.from({ length: t.rows }, (__, j) => (j === k ? oneOf(t.S) : zeroOf(t.S))));
    try {
      return Int(localQuotientLength(t.S, t.rows, units, all, opts(c)));
    } catch {
      throw runtime("the module does not have finite length at the point", c.span);
    }
  },
  "Module.dim": (v, _a, c) => {
    const t = targetOf(v, c, c.span);
    let num = localModuleNumerator(t.S, t.rows, [...t.columns, ...scalarBlocks(t.S, t.rows, t.J)], opts(c));
    if (num.every((x) => x === 0n)) return Int(-1);
    let d = t.S.vars.length;
    while (d > 0 && num.reduce((a, x) => a + x, 0n) === 0n) {
      num = divideOneMinusT(num);
      d--;
    }
    return Int(d);
  },
  "Module.depth": (v, _a, c) => {
    const t = targetOf(v, c, c.span);
    const F = localResolution(t.S, t.rows, [...t.columns, ...scalarBlocks(t.S, t.rows, t.J)], [], t.S.vars.length + 1, opts(c));
    if (F.ranks[0] === 0) throw runtime("the module is zero at the point: its depth is not defined", c.span);
    let pd = F.ranks.length - 1;
    while (pd > 0 && F.ranks[pd] === 0) pd--;
    return Int(t.S.vars.length - pd);
  },
  "Module.pd": (v, _a, c) => pdValue(v, c),
  "Ring.pd": (v, _a, c) => pdValue(v, c),
  "Module.socle": (v, _a, c) => {
    // the k-vector space 0 :_M m as a module: one copy of k per basis element (ungraded)
    const M = v as ModuleValue;
    const { dim } = socleData(M, c);
    const P = M.ring.poly;
    const at = M.ring.local?.at ?? P.vars.map(() => ({ n: 0n, d: 1n }));
    const mGens = P.vars.map((_, i) => moveOut(P, at, variable(P, i)));
    const rows = Array.from({ length: dim }, (_, g) =>
      Array.from({ length: dim }, (__, h) => mGens.map((x) => (g === h ? x : zeroOf(P)))).flat(),
    );
    return moduleValue(M.ring, rows, new Array<number>(dim).fill(0));
  },
  "Module.splits_residue": (v, _a, c) => Bool(socleData(v, c).splits),
  "Ring.splits_residue": (v, _a, c) => Bool(socleData(v, c).splits),
  "Ring.min_gens": (v, _a, c) => {
    const t = targetOf(v, c, c.span);
    return Int(resolveTarget(v, t, 0, c).ranks[0]);
  },
  "Module.min_gens": (v, _a, c) => {
    const t = targetOf(v, c, c.span);
    return Int(resolveTarget(v, t, 0, c).ranks[0]);
  },
};

export const LOCAL_HOMOLOGY_FUNCTIONS: Record<string, FunctionImpl> = {
  "resolve(Module or Ring)": ([m], c) => {
    const t = targetOf(m, c);
    const length = lengthOf(t, c, "resolve");
    if (c.named.has("degree")) throw runtime("degree bounds need a graded ring; a local ring is ungraded", c.span);
    return complexValue(t, resolveTarget(m, t, length, c), length);
  },
  "poincare(Module or Ring)": ([m], c) => {
    const t = targetOf(m, c);
    const terms = bound(c, "terms", "homologicalIndex") ?? 10;
    if (terms < 1) throw runtime("terms must be at least 1", c.span);
    const F = resolveTarget(m, t, terms - 1, c);
    return seriesValue(
      Array.from({ length: terms }, (_, i) => BigInt(F.ranks[i] ?? 0)),
      terms,
    );
  },
  "syzygy(Module or Ring, Int)": ([m, p], c) => {
    const t = targetOf(m, c);
    const k = Number((p as { value: bigint }).value);
    if (k < 0) throw runtime("the syzygy index must be at least 0", c.argSpans[1] ?? c.span);
    const F = resolveTarget(m, t, k + 1, c);
    const rank = F.ranks[k] ?? 0;
    const rows = (F.maps[k] ?? Array.from({ length: rank }, () => [])).map((row) => row.map((f) => moveOut(t.S, t.at, f)));
    return moduleValue(t.base, rows, new Array<number>(rank).fill(0));
  },
  "tor_lengths(Module or Ring, Module or Ring)": ([a, b], c) => {
    const t = targetOf(a, c);
    const length = lengthOf(t, c, "tor_lengths");
    requireFiniteLength(a, b, c, "tor_lengths");
    return list(torLengths(a, b, length, c).map(Int));
  },
  "serre(Module or Ring, Module or Ring)": ([a, b], c) => {
    const t = targetOf(a, c);
    requireFiniteLength(a, b, c, "serre");
    // over a quotient ring the sum is finite when M has finite projective dimension, which is
    // then at most depth R ≤ n (Auslander–Buchsbaum): a resolution still going at n + 1 says not
    const n = t.S.vars.length;
    if (t.J.length > 0 && !resolveTarget(a, t, n + 1, c).complete) {
      throw runtime(
        `serre: the first module has infinite projective dimension over this quotient ring (its minimal resolution goes beyond ${n + 1} steps), so Σ (−1)^i length Tor_i is not a finite sum; tor_lengths(M, N, length = …) gives the lengths`,
        c.span,
      );
    }
    const lengths = torLengths(a, b, n, c);
    return Int(lengths.reduce((acc, x, i) => (i % 2 === 0 ? acc + x : acc - x), 0n));
  },
  "burch_index(Ring)": ([r], c) => burchValue(r as RingValue, c),
  "tor(Int, Module or Ring, Module or Ring)": ([i, a, b], c) => homologyValue("tor", Number((i as { value: bigint }).value), a, b, c),
  "ext(Int, Module or Ring, Module or Ring)": ([i, a, b], c) => homologyValue("ext", Number((i as { value: bigint }).value), a, b, c),
  "bass(Module or Ring, Int)": ([m, i], c) => bassValue(m, Number((i as { value: bigint }).value), c),
};

/// dim_k of the socle 0 :_M m = Hom(k, M) (μ_0), and whether k is a direct summand of M: a
/// socle element outside m·M, i.e. dim soc M > dim soc(m·M), since soc(m·M) = soc M ∩ m·M
/// (common practice). m·M = (m·F + U)/U is presented by the syzygies of [x_i·e_j | U] over R.
function socleData(m: Value, c: CallContext): { dim: number; splits: boolean } {
  const t = targetOf(m, c);
  const S = t.S;
  const F = localResolution(
    S,
    1,
    S.vars.map((_, v) => [variable(S, v)]),
    t.J,
    1,
    opts(c),
  );
  const dim = Number(bassNumbers(S, F, t.J, t.rows, t.columns, 0, opts(c))[0]);
  if (dim === 0) return { dim, splits: false };
  const gens: Poly[][] = [];
  for (let j = 0; j < t.rows; j++)
    for (let v = 0; v < S.vars.length; v++) gens.push(Array.from({ length: t.rows }, (_, k) => (k === j ? variable(S, v) : zeroOf(S))));
  const rel = kernelColumns(S, t.rows, [...gens, ...t.columns], t.J, opts(c)).map((col) => col.slice(0, gens.length));
  const inner = Number(bassNumbers(S, F, t.J, gens.length, rel, 0, opts(c))[0]);
  return { dim, splits: dim > inner };
}

/// pd of M over the local ring it lives over: a finite one is at most depth R ≤ n
/// (Auslander–Buchsbaum), so a minimal resolution still going after n + 1 steps says it is
/// infinite (an Error: an Int cannot say so).
function pdValue(m: Value, c: CallContext): Value {
  const t = targetOf(m, c, c.span);
  const n = t.S.vars.length;
  const F = resolveTarget(m, t, n + 1, c);
  if (!F.complete)
    throw runtime(
      `the projective dimension is infinite: the minimal resolution over this local ring goes beyond ${n + 1} steps, while a finite one is at most depth R ≤ ${n}`,
      c.span,
    );
  let pd = F.ranks.length - 1;
  while (pd > 0 && F.ranks[pd] === 0) pd--;
  return Int(pd);
}

/// f/(1 − t) for f(1) = 0, ascending coefficients.
function divideOneMinusT(f: readonly bigint[]): bigint[] {
  const out: bigint[] = [];
  let acc = 0n;
  for (let k = 0; k < f.length - 1; k++) {
    acc += f[k];
    out.push(acc);
  }
  return out;
}

/// The degrees of the bases of F_0 … F_top, when every map is homogeneous (a graded ring and
/// module); null otherwise (a local ring: everything ungraded, in degree 0).
function resolutionDegrees(S: PolyRing, F: LocalFreeResolution, degrees0: readonly number[], top: number): number[][] | null {
  const degOf = (f: Poly): number | null => {
    const ds = new Set(termsOf(S, f).map((t) => t.exps.reduce((a, e, i) => a + e * S.degrees[i], 0)));
    return ds.size === 1 ? [...ds][0] : ds.size === 0 ? null : NaN;
  };
  const out: number[][] = [[...degrees0]];
  for (let i = 1; i <= top; i++) {
    const d = F.maps[i - 1];
    const cols = F.ranks[i] ?? 0;
    const row: number[] = [];
    for (let k = 0; k < cols; k++) {
      let deg: number | null = null;
      for (let r = 0; r < (F.ranks[i - 1] ?? 0); r++) {
        const e = degOf(d[r][k]);
        if (e === null) continue;
        if (Number.isNaN(e)) return null;
        const candidate = e + out[i - 1][r];
        if (deg !== null && deg !== candidate) return null;
        deg = candidate;
      }
      row.push(deg ?? 0);
    }
    out.push(row);
  }
  return out;
}

/// tor(i, M, N) and ext(i, M, N) over a local ring or a quotient ring, as presented modules
/// over the ring M lives over (graded when everything is; over a local ring in degree 0).
function homologyValue(kind: "tor" | "ext", i: number, a: Value, b: Value, c: CallContext): Value {
  if (i < 0) throw runtime(`${kind}: the index must be at least 0`, c.argSpans[0] ?? c.span);
  const ta = targetOf(a, c, c.argSpans[1]);
  const tb = targetOf(b, c, c.argSpans[2]);
  const sameBase = ta.base === tb.base || (ta.J.length === tb.J.length && ta.J.every((f, k) => equalsPoly(ta.S, f, tb.J[k])));
  if (!sameBase) throw runtime(`${kind}: both modules must live over the same ring`, c.span);
  const S = ta.S;
  const F = resolveTarget(a, ta, i + 1, c);
  const graded = !ta.base.local;
  const degA = a.type === "Module" ? a.degrees : [0];
  const degB = b.type === "Module" ? b.degrees : [0];
  const fDeg =
    (graded ? resolutionDegrees(S, F, degA, i + 1) : null) ??
    Array.from({ length: i + 2 }, (_, k) => new Array<number>(F.ranks[k] ?? 0).fill(0));
  const nDeg = graded && fDeg !== null ? degB : degB.map(() => 0);
  const P = homologyModule(S, ta.J, F, fDeg, tb.rows, tb.columns, nDeg, i, kind, opts(c));
  const rows = Array.from({ length: P.generators }, (_, j) => P.relations.map((col) => moveOut(S, ta.at, col[j])));
  return moduleValue(ta.base, rows, P.degrees);
}

/// μ_i(M) = dim_k Ext^i_R(k, M) at the point (the origin for a graded ring), R the ring M lives over.
function bassValue(m: Value, i: number, c: CallContext): Value {
  if (i < 0) throw runtime("bass: the index must be at least 0", c.argSpans[1] ?? c.span);
  const t = targetOf(m, c);
  const S = t.S;
  // the residue field of the base ring at the point, resolved over it
  const F = localResolution(
    S,
    1,
    S.vars.map((_, v) => [variable(S, v)]),
    t.J,
    i + 1,
    opts(c),
  );
  return Int(bassNumbers(S, F, t.J, t.rows, t.columns, i, opts(c))[i]);
}

/// The Burch index at the point (the ideal moved to the origin; positive depth: general linear
/// forms chosen at random, recorded in the note as for graded rings).
function burchValue(r: RingValue, c: CallContext): Value {
  const at = r.local!.at;
  const I = engineIdeal(
    r.poly,
    r.ideal.map((f) => moveIn(r.poly, at, f)),
  );
  const res = burchIndexOfRing(I, opts(c));
  const note = res.random
    ? `depth ${res.depth}: computed after factoring out general linear forms chosen at random (seed ${res.random.seed}): ${res.random.forms.join(", ")}`
    : undefined;
  if (note) opts(c).progress?.({ stage: "Burch index", detail: note });
  return { type: "Int", value: BigInt(res.index), ...(note ? { note } : {}) };
}
