import { runtimeError } from "../errors";
import { type ComputeOptions, Ticker, checkLimit } from "../options";
import { type Exponents } from "./monomials";
import { hilbertNumeratorPivot } from "./numerator";
import { rat, type Rat } from "../field/rational";
import { tpolyAtOne, tpolyDivOneMinusT, tpolySeriesUpTo } from "./tpoly";

/// The Hilbert series of a graded quotient S/I, HS(t) = Σ dim_k (S/I)_d t^d, as
/// numerator / ∏ (1 − t^{w_i}) over the degrees w_i of the variables, and in reduced
/// form numerator' / ((1 − t)^dim · ∏ [w_i](t)) with [w](t) = 1 + t + … + t^{w−1}.
export interface HilbertSeries {
  /// Degrees of the variables of S (the grading).
  readonly weights: readonly number[];
  /// Coefficients of t^0, t^1, … of the numerator over ∏ (1 − t^{w_i}); [] for the zero ring.
  readonly numerator: readonly bigint[];
  /// Krull dimension of S/I: the order of the pole at t = 1; −1 for the zero ring.
  readonly dimension: number;
  /// The numerator with every factor (1 − t) cancelled against the denominator: for the
  /// standard grading HS = reducedNumerator / (1 − t)^dimension.
  readonly reducedNumerator: readonly bigint[];
  /// Multiplicity: lim_{t→1} (1 − t)^dim HS(t) = reducedNumerator(1) / ∏ w_i
  /// (an integer for the standard grading); 0 for the zero ring.
  readonly degree: Rat;
}

/// Checks that `weights` is a list of positive integers (a positive grading).
export function validateWeights(where: string, weights: readonly number[]): void {
  weights.forEach((w, i) => {
    if (!Number.isSafeInteger(w) || w < 1) {
      throw runtimeError(
        where,
        `degree ${w} of variable ${i + 1} is not a positive integer (only positive gradings have a Hilbert series here)`,
      );
    }
  });
}

function validateExponents(where: string, gens: readonly Exponents[], n: number): void {
  gens.forEach((g, k) => {
    if (g.length !== n) throw runtimeError(where, `generator ${k + 1} has ${g.length} exponents, the ring has ${n} variables`);
    g.forEach((e, i) => {
      if (!Number.isSafeInteger(e) || e < 0) {
        throw runtimeError(where, `generator ${k + 1}: exponent ${e} of variable ${i + 1} is not a non-negative integer`);
      }
    });
  });
}

/// The Hilbert series of S/I for the monomial ideal I spanned by the exponent vectors
/// `gens` (redundant generators allowed; no generators means I = 0), with the
/// variables in degrees `weights`.
export function hilbertSeriesOfMonomials(gens: readonly Exponents[], weights: readonly number[], opts?: ComputeOptions): HilbertSeries {
  const where = "hilbertSeriesOfMonomials";
  validateWeights(where, weights);
  validateExponents(where, gens, weights.length);
  const ticker = new Ticker(opts, () => ({ stage: "Hilbert series", detail: `${gens.length} monomial generators` }));
  return hilbertSeriesFromNumerator(hilbertNumeratorPivot(gens, weights, ticker), weights);
}

/// Completes a numerator over ∏ (1 − t^{w_i}) to a HilbertSeries.
export function hilbertSeriesFromNumerator(numerator: readonly bigint[], weights: readonly number[]): HilbertSeries {
  const n = weights.length;
  if (numerator.length === 0) {
    return { weights, numerator, dimension: -1, reducedNumerator: [], degree: rat(0n) };
  }
  let reduced: readonly bigint[] = numerator;
  let cancelled = 0;
  while (tpolyAtOne(reduced) === 0n) {
    reduced = tpolyDivOneMinusT(reduced);
    cancelled++;
  }
  if (cancelled > n) throw runtimeError("hilbertSeriesFromNumerator", "numerator vanishes at t = 1 to a higher order than the denominator");
  const weightProduct = weights.reduce((p, w) => p * BigInt(w), 1n);
  return {
    weights,
    numerator,
    dimension: n - cancelled,
    reducedNumerator: reduced,
    degree: rat(tpolyAtOne(reduced), weightProduct),
  };
}

/// dim_k (S/I)_d for d = 0, 1, …, maxDegree.
export function hilbertFunctionValues(hs: HilbertSeries, maxDegree: number, opts?: ComputeOptions): bigint[] {
  if (!Number.isSafeInteger(maxDegree) || maxDegree < 0) {
    throw runtimeError("hilbertFunctionValues", `degree bound ${maxDegree} is not a non-negative integer`);
  }
  checkLimit(opts, "maxDegree", maxDegree, "Hilbert function degree");
  return tpolySeriesUpTo(hs.numerator, hs.weights, maxDegree);
}

/// dim_k (S/I)_d (0 for negative d).
export function hilbertFunctionAt(hs: HilbertSeries, d: number, opts?: ComputeOptions): bigint {
  if (!Number.isSafeInteger(d)) throw runtimeError("hilbertFunctionAt", `degree ${d} is not an integer`);
  if (d < 0) return 0n;
  return hilbertFunctionValues(hs, d, opts)[d];
}

/// True when every variable has degree 1.
export function isStandardGrading(weights: readonly number[]): boolean {
  return weights.every((w) => w === 1);
}
