/// Engine part 3 in the notation: syzygies, presentations and pd over quotient rings
/// (degree by degree, see lib/algebra/resolution/graded-quotient), Poincaré series, socles, the residue field as a summand, Burch
/// index, minors along a resolution and eventual periods.
import type { Span } from "../../grammar/ast";
import {
  QQ,
  add,
  burchIndexOfRing,
  equals,
  localAlgebraAtOrigin,
  minimalResolution,
  eventualPeriod,
  formatPoly,
  guessRational,
  ideal as engineIdeal,
  idealColon,
  idealIsHomogeneous,
  idealIsSubset,
  idealSum,
  minors,
  moduleSocle,
  monomial,
  quotientProperties,
  resolveDegreewise,
  projectiveDimension,
  resolveCoker,
  truncatedSeries,
  variable,
  zero,
  type Ideal,
  type ModulePresentation,
  type QuotientResolution,
} from "../algebra/index";
import type { CallContext } from "./context";
import { bound } from "./named-options";
import { runtime } from "./errors";
import { colonOf, groebnerOf, idealsEqual, idealValue } from "./ideals";
import { encodeValue } from "./json";
import { moduleValue, presentationOverS } from "./modules";
import { ascendingText } from "./series-text";
import { entriesOf, firstInexact } from "./complex";
import { requireCyclicAtOrigin, resolutionTarget } from "./resolution-input";
import {
  list,
  type ComplexValue,
  type IdealValue,
  type MatrixValue,
  type ModuleValue,
  type RingValue,
  type SeriesValue,
  type Value,
} from "./values";

const Int = (value: number | bigint): Value => ({ type: "Int", value: BigInt(value) });
const Bool = (value: boolean): Value => ({ type: "Bool", value });
const opts = (c: CallContext) => c.interp.session.compute;

/// A quotient ring m = A / I read as the cyclic A-module A/I (notation.md §5): the defining
/// ideal J of A and the ideal I + J of m, both in the ambient polynomial ring S.
interface CyclicModule {
  base: RingValue;
  J: Ideal;
  I: Ideal;
}

function cyclicModule(m: RingValue, c: CallContext): CyclicModule {
  const base = m.over ?? c.interp.session.rings.ambient(m);
  return { base, J: engineIdeal(base.poly, base.ideal), I: engineIdeal(m.poly, m.ideal) };
}

function requireGraded(M: CyclicModule, what: string, span: Span, c: CallContext): void {
  if (!idealIsHomogeneous(M.J, opts(c)) || !idealIsHomogeneous(M.I, opts(c))) {
    throw runtime(
      `${what} over a quotient ring needs homogeneous ideals (a graded ring and module); a ring given by a non-homogeneous ideal is read at the origin only by resolve, poincare, socle and the Burch index, and only when the origin is an isolated point`,
      span,
    );
  }
}

/// What to resolve over A = S/J: R/I given by I, or a presented module (generators moved
/// up by `shift` into degrees ≥ 0; the Betti numbers are moved back).
interface Target {
  base: RingValue;
  J: Ideal;
  module?: Ideal;
  presentation?: ModulePresentation;
  shift: number;
}

function targetOfRing(m: RingValue, span: Span, what: string, c: CallContext): Target {
  const M = cyclicModule(m, c);
  requireGraded(M, what, span, c);
  return { base: M.base, J: M.J, module: M.I, shift: 0 };
}

function targetOfModule(M: ModuleValue, span: Span, what: string, c: CallContext): Target {
  const J = engineIdeal(M.ring.poly, M.ring.ideal);
  if (!idealIsHomogeneous(J, opts(c))) throw runtime(`${what} over a quotient ring needs a homogeneous defining ideal`, span);
  // One generator in degree 0: coker [g1 … gk] is R/(g1, …, gk), the same graded module, and
  // the cyclic form lets the engine split every degree by multidegree when both ideals are
  // monomial (k over R: the residue field R.residue) instead of working on whole pieces.
  // (The presentation stays for the callers that read it, e.g. the socle.)
  const shift = -Math.min(0, ...M.degrees);
  const presentation = { rows: M.presentation.rows, degrees: M.degrees.map((d) => d + shift) };
  if (M.degrees.length === 1 && M.degrees[0] === 0) {
    const I = engineIdeal(M.ring.poly, M.presentation.rows[0]);
    if (idealIsHomogeneous(I, opts(c))) return { base: M.ring, J, module: I, presentation, shift: 0 };
  }
  return { base: M.ring, J, presentation, shift };
}

function degreewise(
  t: Target,
  length: number,
  degree: number | undefined,
  c: CallContext,
  stream: boolean,
  keepMaps?: number,
): QuotientResolution {
  const partial = stream ? c.interp.session.partial : undefined;
  return resolveDegreewise({
    ring: t.J,
    ...(t.module ? { module: t.module } : { presentation: t.presentation! }),
    length,
    degree: degree === undefined ? undefined : degree + t.shift,
    keepMaps,
    opts: {
      ...opts(c),
      // each finished column streams as a one-column, still-incomplete Betti table
      partial: partial
        ? (col) =>
            partial({ type: "BettiTable", entries: entriesOf([col], t.shift), complete: false, note: "the resolution is still running" })
        : undefined,
    },
  });
}

const isGraded = (M: CyclicModule, c: CallContext) => idealIsHomogeneous(M.J, opts(c)) && idealIsHomogeneous(M.I, opts(c));

/// The cyclic module to read at the origin, ungraded, when the ring or the module is not
/// graded (a non-homogeneous ideal); null when both are graded (the degree-by-degree way).
/// A module given by a presentation counts when it has one generator: coker of a row
/// [g1, …, gk] over A is A/(g1, …, gk).
function localCyclic(m: RingValue | ModuleValue, what: string, c: CallContext): CyclicModule | null {
  if (m.type === "Ring") {
    const M = cyclicModule(m, c);
    return isGraded(M, c) ? null : M;
  }
  const J = engineIdeal(m.ring.poly, m.ring.ideal);
  if (idealIsHomogeneous(J, opts(c))) return null;
  if (m.presentation.rows.length !== 1) {
    throw runtime(
      `${what} over a ring given by a non-homogeneous ideal is computed at the origin for cyclic modules only (one generator, such as R.residue or R / I); this module has ${m.presentation.rows.length} generators`,
      c.argSpans[0] ?? c.span,
    );
  }
  return { base: m.ring, J, I: engineIdeal(m.ring.poly, [...m.presentation.rows[0], ...m.ring.ideal]) };
}

/// The finite-dimensional local algebra (A/I) at the origin, with the socle of A/I as a
/// module (0 :_M m is the same whether M = A/I is read as a ring or as an A-module) and
/// whether k splits off it (a socle element outside m·M; common practice).
function localSocle(M: CyclicModule, c: CallContext): { dim: number; splits: boolean } {
  const A = localAlgebraAtOrigin(M.I, opts(c));
  const socle = A.socle();
  const n = A.S.vars.length;
  const mA = A.basis.flatMap((_, k) => {
    const unit = new Array(A.dim).fill(A.K.zero);
    unit[k] = A.K.one;
    return Array.from({ length: n }, (_, v) => A.mulVector(v, unit));
  });
  return { dim: socle.length, splits: A.rank([...mA, ...socle]) > A.rank(mA) };
}

/// syzygy(M, p) over a quotient ring: Ω^p M = image of d_p ≅ coker(d_{p+1}), generated in
/// the degrees of F_p. Needs the columns p and p + 1 exact.
export function syzygyOverQuotient(m: RingValue | ModuleValue, p: number, c: CallContext): ModuleValue {
  const span = c.argSpans[0] ?? c.span;
  const t = m.type === "Ring" ? targetOfRing(m, span, "syzygy", c) : targetOfModule(m, span, "syzygy", c);
  const r = degreewise(t, p + 1, undefined, c, false, Number.MAX_SAFE_INTEGER);
  const k = firstInexact(r);
  if (k !== null && k <= p + 1) {
    throw runtime(
      `syzygy: no degree bound is known that makes F_${k} of this resolution exact (the module has infinite length over a ring that is not Artinian)`,
      span,
    );
  }
  const degrees = (r.columns[p]?.entries ?? []).flatMap((e) => Array.from({ length: e.count }, () => e.degree - t.shift));
  const rows = r.maps && r.maps[p] ? r.maps[p] : degrees.map(() => []);
  return moduleValue(t.base, rows, degrees);
}

/// A minimal presentation of a module over a quotient ring: the first differential of its
/// minimal resolution (columns 0 and 1 must be exact).
export function presentationOverQuotient(M: ModuleValue, c: CallContext): MatrixValue {
  const t = targetOfModule(M, c.span, "a minimal presentation", c);
  const r = degreewise(t, 1, undefined, c, false, Number.MAX_SAFE_INTEGER);
  const k = firstInexact(r);
  if (k !== null)
    throw runtime(
      "a minimal presentation: no degree bound is known that makes the relations exact (the module has infinite length over a ring that is not Artinian)",
      c.span,
    );
  const rows = r.maps![0];
  return { type: "Matrix", ring: M.ring, rows, cols: r.columns[1].total };
}

/// pd_R M over R = S/J. If it is finite it equals depth R − depth M (M. Auslander, D.
/// Buchsbaum, "Homological dimension in local rings", Trans. AMS 85, 1957; the graded case is
/// common practice), so the resolution decides: F_{d+1} = 0 for d = depth R − depth M, or
/// the projective dimension is infinite (a runtime error: an Int cannot say so).
export function pdOverQuotient(M: ModuleValue, depthM: number, c: CallContext): number {
  const t = targetOfModule(M, c.span, "pd", c);
  const d = quotientProperties(t.J, opts(c)).depth - depthM;
  if (d < 0) throw runtime("pd: depth M exceeds depth R, so M is zero or the computation is inconsistent", c.span);
  const r = degreewise(t, d + 1, undefined, c, false);
  const k = firstInexact(r);
  // a lower bound above 0 is enough to see F_{d+1} ≠ 0
  if (k !== null && k <= d + 1 && r.columns[d + 1].total === 0) {
    throw runtime(
      `pd: cannot decide: no degree bound is known that makes F_${k} exact for this module (infinite length over a ring that is not Artinian), and the degrees computed show F_${d + 1} = 0`,
      c.span,
    );
  }
  if (r.columns[d + 1].total > 0) {
    throw runtime(
      `the projective dimension over this quotient ring is infinite: F_${d + 1} ≠ 0, while a finite one would be depth R − depth M = ${d} (Auslander–Buchsbaum)`,
      c.span,
    );
  }
  let pd = d;
  while (pd > 0 && r.columns[pd].total === 0) pd--;
  return pd;
}

/// poincare(M, terms = n): Σ β_i t^i for i < n, with a guessed rational function that fits
/// every exact term (Berlekamp–Massey, accepted only when further terms confirm it).
export function poincareValue([M]: readonly Value[], c: CallContext): Value {
  const span = c.argSpans[0] ?? c.span;
  if (M.type !== "Ring" && M.type !== "Module") throw runtime(`poincare expects a Module or a quotient ring, got ${M.type}`, span);
  const terms = bound(c, "terms", "homologicalIndex") ?? 10;
  if (terms < 1) throw runtime("terms must be at least 1", c.span);
  const t = resolutionTarget(M, c);
  if (t.method === "schreyer" && M.type === "Ring") requireGraded(cyclicModule(M, c), "poincare", span, c);
  requireCyclicAtOrigin(t, "poincare", c);
  const partial = c.interp.session.partial;
  const r = minimalResolution({
    ...t.input,
    length: terms - 1,
    // only the ranks are read: no differential is kept
    bettiOnly: true,
    // degree by degree, each finished column streams as a one-column, still-incomplete Betti table
    partial:
      partial && t.method === "graded-quotient"
        ? (col) =>
            partial({
              type: "BettiTable",
              entries: col.entries.map(([j, b]) => [col.index, j - t.shift, b] as const),
              complete: false,
              note: "the resolution is still running",
            })
        : undefined,
    opts: opts(c),
  });
  // over a polynomial ring the resolution is finite (part 2), every term exact
  if (r.method === "schreyer")
    return seriesValue(
      Array.from({ length: terms }, (_, i) => BigInt(r.resolution.ranks[i] ?? 0)),
      terms,
    );
  if (r.method === "artinian") return seriesValue(r.resolution.ranks.map(BigInt), terms);
  const totals = Array.from({ length: terms }, (_, i) => BigInt(r.resolution.columns[i]?.total ?? 0));
  return seriesValue(totals, firstInexact(r.resolution) ?? terms);
}

/// A Series with the rational function guessed from its exact terms: a guess as soon as the
/// terms determine one (2L terms for a recurrence of length L), `checked` counting only the
/// terms beyond those 2L, which it reproduces without having been fitted to them.
export function seriesValue(coeffs: readonly bigint[], exact: number): SeriesValue {
  const g = guessRational(truncatedSeries(coeffs.slice(0, exact)), 0);
  const wrap = (c: readonly bigint[]) => (c.filter((x) => x !== 0n).length > 1 ? `(${ascendingText(c)})` : ascendingText(c));
  const rational = g
    ? g.denominator.length === 1 && g.denominator[0] === 1n
      ? ascendingText(g.numerator)
      : `${wrap(g.numerator)}/${wrap(g.denominator)}`
    : null;
  return {
    type: "Series",
    coefficients: coeffs,
    rational,
    ...(g ? { guess: { numerator: g.numerator, denominator: g.denominator, checked: g.checkedOn - g.determinedBy } } : {}),
    ...(exact < coeffs.length ? { exact } : {}),
  };
}

/// A polynomial in t over Q from ascending integer coefficients.
function tPoly(c: CallContext, coeffs: readonly bigint[]): Value {
  const R = c.interp.session.rings.polynomialRing(QQ, ["t"]);
  let f = zero(R.poly);
  coeffs.forEach((a, i) => {
    if (a !== 0n) f = add(R.poly, f, monomial(R.poly, [i], a, 1n));
  });
  return { type: "Poly", ring: R, poly: f };
}

function series(v: Value): SeriesValue {
  return v as SeriesValue;
}

/// The ideal of R generated by its variables.
function maximalOf(r: RingValue, c: CallContext): IdealValue {
  return idealValue(
    r,
    r.poly.vars.map((_, i) => variable(r.poly, i)),
    opts(c),
  );
}

/// The Burch index of R = S/J (engine: depth 0 by the definition, positive depth after
/// general linear forms chosen at random from a recorded seed). The random choice is stated
/// in the Int's note (its text and JSON) and reported as progress.
function burchOf(v: Value, c: CallContext) {
  const r = v as RingValue;
  const res = burchIndexOfRing(engineIdeal(r.poly, r.ideal), opts(c));
  const note = res.random
    ? `depth ${res.depth}: computed after factoring out general linear forms chosen at random (seed ${res.random.seed}): ${res.random.forms.join(", ")}`
    : undefined;
  if (note) opts(c).progress?.({ stage: "Burch index", detail: note });
  return { ...res, note };
}

const burchValue = (v: Value, c: CallContext): Value => {
  const b = burchOf(v, c);
  return { type: "Int", value: BigInt(b.index), ...(b.note ? { note: b.note } : {}) };
};

/// Whether k is a direct summand of the cyclic module A/I = S/(I + J): its socle
/// ((I + J) : m)/(I + J) is not inside m·(A/I) = (m + I + J)/(I + J) (common practice: a
/// socle element outside mM generates a copy of k that splits off).
function splitsResidue(m: RingValue, c: CallContext): boolean {
  const local = localCyclic(m, "splits_residue", c);
  if (local) return localSocle(local, c).splits;
  const M = cyclicModule(m, c);
  const S = m.poly;
  const mS = engineIdeal(
    S,
    S.vars.map((_, i) => variable(S, i)),
  );
  if (
    idealIsSubset(
      engineIdeal(S, [
        monomial(
          S,
          S.vars.map(() => 0),
          1n,
          1n,
        ),
      ]),
      M.I,
      opts(c),
    )
  )
    return false; // the zero module
  const socle = idealColon(M.I, mS, opts(c));
  return !idealIsSubset(socle, idealSum(mS, M.I), opts(c));
}

/// A key under which equal values compare equal: ideals by their reduced Gröbner basis
/// (so I_k(φ_i) that agree as ideals count as equal), everything else by its encoding.
function valueKey(v: Value, c: CallContext): string {
  if (v.type === "Ideal")
    return `Ideal:${groebnerOf(v, opts(c))
      .map((f) => formatPoly(v.ring.poly, f))
      .join(",")}`;
  if (v.type === "List") return `[${v.items.map((x) => valueKey(x, c)).join(";")}]`;
  return JSON.stringify(encodeValue(v));
}

function complexMaps(v: Value, c: CallContext): readonly MatrixValue[] {
  const C = v as ComplexValue;
  if (C.maps === null) throw runtime("the differentials of this resolution were not kept (too large); minors need them", c.span);
  return C.maps;
}

export const QUOTIENT_FUNCTIONS: Record<string, (args: readonly Value[], c: CallContext) => Value> = {
  "poincare(Module or Ring)": poincareValue,
  "burch_index(Ring)": ([R], c) => burchValue(R, c),
  "eventual_period(List<Any>)": ([xs], c) => {
    const items = (xs as { items: readonly Value[] }).items;
    const keys = items.map((x) => valueKey(x, c));
    // ideals of a local ring are equal when they agree at the point (issue 16): an ideal takes
    // the key of the first earlier one that is locally equal to it
    items.forEach((x, k) => {
      if (x.type !== "Ideal" || !x.ring.local) return;
      const j = items.findIndex((y, i) => i < k && y.type === "Ideal" && y.ring === x.ring && idealsEqual(y, x, c.span, opts(c)));
      if (j >= 0) keys[k] = keys[j];
    });
    const p = eventualPeriod(keys);
    const none: Value = { type: "None" };
    return {
      type: "Record",
      fields: new Map([
        ["start", p ? Int(p.start) : none],
        ["period", p ? Int(p.period) : none],
      ]),
    };
  },
};

/// The socle of a module (degrees of a basis) and whether k splits off, degree by degree.
function socleOf(M: ModuleValue, c: CallContext): { degrees: number[]; splits: boolean } {
  const local = localCyclic(M, "the socle", c);
  if (local) {
    // ungraded: every socle element is put in degree 0
    const s = localSocle(local, c);
    return { degrees: new Array<number>(s.dim).fill(0), splits: s.splits };
  }
  const t = targetOfModule(M, c.span, "the socle", c);
  const s = moduleSocle(t.J, t.presentation!, opts(c));
  if (s) return { degrees: s.degrees.map((d) => d - t.shift), splits: s.splits };
  // Not of finite length over a ring that is not Artinian: 0 :_M m = 0 exactly when depth M > 0
  // (m is then not an associated prime of M; common practice), and depth is read over S.
  if (depthOverS(M, c) > 0) return { degrees: [], splits: false };
  throw runtime(
    "the socle of a module of depth 0 that is not of finite length, over a ring that is not Artinian, is not computed here (its degrees are not bounded in advance)",
    c.span,
  );
}

/// depth M = n − pd_S M (Auslander–Buchsbaum over S; depth, the grade of m on M, is the same over S and S/J).
function depthOverS(M: ModuleValue, c: CallContext): number {
  const { rows, degrees } = presentationOverS(M, c.span);
  const shift = -Math.min(0, ...degrees);
  const C = resolveCoker(
    M.ring.poly,
    rows,
    degrees.map((d) => d + shift),
    opts(c),
  );
  return M.ring.poly.vars.length - projectiveDimension(C);
}

export const QUOTIENT_PROPERTIES: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  // (0 :_M m) is a k-vector space: ⊕ k(−j), one copy per basis element, as a module over M's ring
  "Module.socle": (v, _a, c) => {
    const M = v as ModuleValue;
    const { degrees } = socleOf(M, c);
    const P = M.ring.poly;
    // relations x_i·e_g for every generator g and variable x_i
    const rows = degrees.map((_, g) => degrees.flatMap((__, h) => P.vars.map((___, i) => (g === h ? variable(P, i) : zero(P)))));
    return moduleValue(M.ring, rows, degrees);
  },
  "Module.splits_residue": (v, _a, c) => Bool(socleOf(v as ModuleValue, c).splits),
  "Ring.socle": (v, _a, c) => {
    const r = v as RingValue;
    // given by its reduced Gröbner basis (the colon's own generators repeat); two basis
    // elements can have one normal form modulo the defining ideal (y^3 and x^2 when
    // x^2 − y^3 ∈ J), so equal generators are kept once
    const I = idealValue(r, groebnerOf(colonOf(idealValue(r, []), maximalOf(r, c), c.span, opts(c)), opts(c)), opts(c));
    const gens = I.gens.filter((g, i) => I.gens.findIndex((h) => equals(r.poly, g, h)) === i);
    return { ...I, gens };
  },
  "Ring.burch_index": (v, _a, c) => burchValue(v, c),
  "Ring.is_burch": (v, _a, c) => Bool(burchOf(v, c).isBurch),
  "Ring.splits_residue": (v, _a, c) => Bool(splitsResidue(v as RingValue, c)),
  "Series.coefficients": (v) => list(series(v).coefficients.map(Int)),
  "Series.rational": (v, _a, c) => {
    const g = series(v).guess;
    if (!g) return { type: "None" };
    return {
      type: "Record",
      fields: new Map([
        ["numerator", tPoly(c, g.numerator)],
        ["denominator", tPoly(c, g.denominator)],
        ["checked", Int(g.checked)],
      ]),
    };
  },
  "Series.at": (v, [i], c) => {
    const s = series(v);
    const k = (i as { value: bigint }).value;
    const n = s.coefficients.length;
    const span = c.argSpans[0] ?? c.span;
    if (k < 0n) throw runtime(`the index must be at least 0, got ${k}`, span);
    if (k >= BigInt(n)) throw runtime(`only the coefficients of t^0 … t^${n - 1} were computed; ask for more terms`, span);
    if (s.exact !== undefined && k >= BigInt(s.exact)) {
      throw runtime(
        `the coefficient of t^${k} is only a lower bound (a degree bound cut the resolution); t^0 … t^${s.exact - 1} are exact`,
        span,
      );
    }
    return Int(s.coefficients[Number(k)]);
  },
  "Complex.minors": (v, [k], c) => {
    const maps = complexMaps(v, c);
    const size = (k as { value: bigint }).value;
    if (size < 1n) throw runtime(`the size of the minors must be at least 1, got ${size}`, c.argSpans[0] ?? c.span);
    return list(
      maps.map((A) => {
        // I_k(φ) = 0 when φ has fewer than k rows or columns (common practice)
        if (size > BigInt(Math.min(A.rows.length, A.cols))) return idealValue(A.ring, []);
        // the minors, given by the reduced Gröbner basis of the ideal they generate (their list
        // repeats entries up to sign)
        const all = idealValue(A.ring, minors(A.ring.poly, A.rows, Number(size), opts(c)), opts(c));
        return idealValue(A.ring, groebnerOf(all, opts(c)), opts(c));
      }),
    );
  },
};
