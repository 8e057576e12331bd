/// Local rings in the notation (grammar/README.md, "Local rings"; issue 16): `localize`, the properties a local
/// ring answers at its point, `milnor` and `tjurina`, and the Hilbert–Samuel function,
/// multiplicity and tangent cone (also of a graded ring, at its irrelevant ideal). Engine:
/// lib/algebra/localring (standard bases by Lazard's homogenisation, lib/algebra/standard).
import {
  localAnalysis,
  localDimension,
  localEmbeddingDimension,
  localLength,
  localMultiplicity,
  milnorNumber,
  tangentConeIdeal,
  tjurinaNumber,
  type LocalAnalysis,
  type Point,
} from "../algebra/index";
import { hilbertSeriesFromNumerator } from "../algebra/index";
import { constant, sub as subPoly, variable } from "../algebra/index";
import type { CallContext } from "./context";
import { runtime } from "./errors";
import { colonOf, idealValue } from "./ideals";
import { moduleValue } from "./modules";
import { ratOf, ratToString, type Rat } from "../algebra/index";
import { type HilbertSeriesValue, type RingValue, type Value } from "./values";

const Int = (value: number | bigint): Value => ({ type: "Int", value: BigInt(value) });
const opts = (c: CallContext) => c.interp.session.compute;

/// The point of a local ring; the origin for a graded ring (read at its irrelevant ideal).
function pointOf(r: RingValue): Point {
  return r.local ? r.local.at : r.poly.vars.map(() => ({ n: 0n, d: 1n }));
}

const analyses = new WeakMap<RingValue, LocalAnalysis>();
/// The standard-basis analysis of a ring at its point (cached per ring).
export function analysisOf(r: RingValue, c: CallContext): LocalAnalysis {
  let L = analyses.get(r);
  if (!L) {
    const at = pointOf(r);
    L = localAnalysis(r.poly, r.ideal, at.every((a) => a.n === 0n) ? null : at, opts(c));
    analyses.set(r, L);
  }
  return L;
}

/// The `at = [a1, …, an]` option: one Int or Rat per variable.
function pointOption(c: CallContext, n: number, fallback: readonly Rat[] | null): Rat[] {
  const v = c.named.get("at");
  if (!v) return fallback ? [...fallback] : new Array(n).fill(null).map(() => ratOf(0n));
  if (v.type !== "List") throw runtime(`at must be a List of numbers, one per variable, got ${v.type}`, c.span);
  if (v.items.length !== n) throw runtime(`at needs ${n} coordinates, one per variable, got ${v.items.length}`, c.span);
  return v.items.map((x) => {
    if (x.type === "Int") return ratOf(x.value);
    if (x.type === "Rat") return x.value;
    throw runtime(`the coordinates of at must be Int or Rat, got ${x.type}`, c.span);
  });
}

/// The Hilbert–Samuel function as a HilbertSeries: Σ_d ℓ(R/m^(d+1)) t^d is the tangent cone's
/// series divided by (1 − t), so .at(d) = ℓ(R/m^(d+1)), .values(d) and .polynomial (the
/// Hilbert–Samuel polynomial) read it directly.
function samuelValue(r: RingValue, c: CallContext): HilbertSeriesValue {
  const L = analysisOf(r, c);
  const hs = L.tangentSeries;
  const series = hilbertSeriesFromNumerator(L.zero ? [] : hs.numerator, [...hs.weights, 1]);
  return { type: "HilbertSeries", series, note: "the Hilbert–Samuel function: .at(d) = length R/m^(d+1)" };
}

function tangentCone(r: RingValue, c: CallContext): RingValue {
  const L = analysisOf(r, c);
  const { ring, gens } = tangentConeIdeal(L);
  const rings = c.interp.session.rings;
  const T = rings.polynomialRing(ring.field, ring.vars);
  return gens.length === 0 ? T : rings.quotient(T, gens);
}

/// The maximal ideal of the point: ⟨x_i − a_i⟩.
function pointIdeal(r: RingValue, c: CallContext) {
  const at = pointOf(r);
  return idealValue(
    r,
    r.poly.vars.map((_, i) => subPoly(r.poly, variable(r.poly, i), constant(r.poly, at[i].n, at[i].d))),
    opts(c),
  );
}

function nonzeroLocal(r: RingValue, c: CallContext, what: string): LocalAnalysis {
  const L = analysisOf(r, c);
  if (L.zero) throw runtime(`${what}: the local ring is zero (its point is not on the zero set of the defining ideal)`, c.span);
  return L;
}

/// Properties that every ring answers at its point (a graded ring at the origin = its
/// irrelevant ideal, which gives the same numbers).
export const LOCAL_GENERAL_PROPERTIES: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  "Ring.multiplicity": (v, _a, c) => Int(localMultiplicity(nonzeroLocal(v as RingValue, c, "multiplicity"))),
  "Ring.samuel": (v, _a, c) => samuelValue(v as RingValue, c),
  "Ring.tangent_cone": (v, _a, c) => tangentCone(v as RingValue, c),
};

/// A property that needs the grading, refused over a local ring with what to use instead.
const refuse =
  (what: string, instead: string) =>
  (_v: Value, _a: readonly Value[], c: CallContext): Value => {
    throw runtime(`${what} is not defined for a local ring (it has no grading)${instead ? `: ${instead}` : ""}`, c.span);
  };

/// Ring properties read at the point of a local ring; these take precedence over the graded
/// ones for a ring made by `localize`.
export const LOCAL_RING_PROPERTIES: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  "Ring.dim": (v, _a, c) => Int(localDimension(nonzeroLocal(v as RingValue, c, "dim"))),
  "Ring.embdim": (v, _a, c) => Int(localEmbeddingDimension(nonzeroLocal(v as RingValue, c, "embdim"), opts(c))),
  "Ring.codim": (v, _a, c) => Int((v as RingValue).poly.vars.length - localDimension(nonzeroLocal(v as RingValue, c, "codim"))),
  "Ring.length": (v, _a, c) => {
    const L = analysisOf(v as RingValue, c);
    const len = localLength(L);
    if (len === null) throw runtime(`the local ring has dimension ${L.tangentSeries.dimension}, so its length is infinite`, c.span);
    return Int(len);
  },
  "Ring.hilbert": refuse("a Hilbert series", "use R.samuel (the Hilbert–Samuel function) or R.tangent_cone.hilbert"),
  "Ring.degree": (v, _a, c) => Int(localMultiplicity(nonzeroLocal(v as RingValue, c, "degree"))),
  "Ring.reg": refuse("the Castelnuovo–Mumford regularity", ""),
  "Ring.residue": (v, _a, c) => {
    const r = v as RingValue;
    return moduleValue(r, [pointIdeal(r, c).gens.slice()], [0]);
  },
  "Ring.maximal": (v, _a, c) => pointIdeal(v as RingValue, c),
  "Ring.socle": (v, _a, c) => {
    const r = v as RingValue;
    // (J : m_a)/J; colon and localisation commute for finitely generated ideals (common practice)
    return colonOf(idealValue(r, []), pointIdeal(r, c), c.span, opts(c));
  },
};

export const LOCAL_FUNCTIONS: Record<string, (args: readonly Value[], c: CallContext) => Value> = {
  "localize(Ring)": ([R], c) => {
    const r = R as RingValue;
    const at = pointOption(c, r.poly.vars.length, null);
    return c.interp.session.rings.localize(r, at);
  },
  "milnor(Poly)": ([f], c) => singularityNumber(f, c, "milnor"),
  "tjurina(Poly)": ([f], c) => singularityNumber(f, c, "tjurina"),
};

function singularityNumber(f: Value, c: CallContext, which: "milnor" | "tjurina"): Value {
  const p = f as Extract<Value, { type: "Poly" }>;
  const r = p.ring;
  if (r.ideal.length > 0)
    throw runtime(
      `${which} needs a polynomial of a polynomial ring (or of a local polynomial ring), not of a quotient ring`,
      c.argSpans[0] ?? c.span,
    );
  const at = pointOption(c, r.poly.vars.length, r.local ? r.local.at : null);
  const point = at.every((a) => a.n === 0n) ? null : at;
  try {
    const n = which === "milnor" ? milnorNumber(r.poly, p.poly, point, opts(c)) : tjurinaNumber(r.poly, p.poly, point, opts(c));
    return Int(n);
  } catch (e) {
    if (e instanceof Error && /not isolated/.test(e.message)) {
      const where = point ? `(${at.map(ratToString).join(", ")})` : "the origin";
      throw runtime(`${which}: the singularity at ${where} is not isolated, so the number is infinite`, c.span);
    }
    throw e;
  }
}
