import { runtimeError } from "../errors";
import { type HilbertSeries } from "../hilbert/series";
import { type Rat } from "../field/rational";
import { type Ideal, ideal, idealGroebnerBasis, idealIsUnit } from "../ideal/ideal";
import { idealDimension, idealDegree, idealHilbertSeries } from "../ideal/invariants";
import { idealSum } from "../ideal/arith";
import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing, sameRing } from "../poly/ring";
import { isZero, mul, one, sub, add } from "../poly/checked";
import { normalForm } from "../groebner/checked";

/// The quotient S/J of a polynomial ring S (the ambient ring) by an ideal J of S.
/// Elements are polynomials of S read modulo J.
export interface QuotientRing {
  readonly ambient: PolyRing;
  readonly ideal: Ideal;
}

/// A polynomial ring or a quotient of one.
export type AnyRing = PolyRing | QuotientRing;

export function isQuotientRing(A: AnyRing): A is QuotientRing {
  return "ambient" in A && "ideal" in A;
}

/// The polynomial ring S with A = S/J (A itself for a polynomial ring).
export function ambientRing(A: AnyRing): PolyRing {
  return isQuotientRing(A) ? A.ambient : A;
}

/// The ideal J of the ambient ring with A = S/J (the zero ideal for a polynomial ring).
export function definingIdeal(A: AnyRing): Ideal {
  return isQuotientRing(A) ? A.ideal : ideal(A, []);
}

/// A / I for an ideal I of A, given by polynomials of the ambient ring S (as an Ideal of S
/// or a list of generators). For A = S/J this is S/(J + I).
export function quotientRing(A: AnyRing, I: Ideal | readonly Poly[]): QuotientRing {
  const S = ambientRing(A);
  const extra = Array.isArray(I) ? ideal(S, I as readonly Poly[]) : (I as Ideal);
  if (!sameRing(S, extra.ring)) {
    throw runtimeError(
      "quotientRing",
      `the ideal lives in a ring with variables ${extra.ring.vars.join(", ")}, not in the ambient ring (${S.vars.join(", ")})`,
    );
  }
  const J = isQuotientRing(A) ? idealSum(A.ideal, extra) : extra;
  return Object.freeze({ ambient: S, ideal: J });
}

/// The ideal I + J of S that corresponds to the ideal I of A = S/J (I given by
/// representatives in S). Ideals of A are the ideals of S containing J, and sums,
/// intersections, colons, saturations and membership in A are those of S on such ideals;
/// a product in A is the lift of the product in S.
export function liftIdeal(A: AnyRing, I: Ideal): Ideal {
  const S = ambientRing(A);
  if (!sameRing(S, I.ring)) {
    throw runtimeError(
      "liftIdeal",
      `the ideal lives in a ring with variables ${I.ring.vars.join(", ")}, not in the ambient ring (${S.vars.join(", ")})`,
    );
  }
  return isQuotientRing(A) ? idealSum(A.ideal, I) : I;
}

/// The normal form of f modulo the defining ideal: the unique representative that is a
/// combination of standard monomials (monomials outside the initial ideal).
export function quotientNormalForm(A: AnyRing, f: Poly, opts?: ComputeOptions): Poly {
  if (!isQuotientRing(A)) return f;
  return normalForm(A.ambient, f, [...idealGroebnerBasis(A.ideal, opts)], opts);
}

/// Whether f = g in A.
export function quotientEquals(A: AnyRing, f: Poly, g: Poly, opts?: ComputeOptions): boolean {
  return isZero(quotientNormalForm(A, sub(ambientRing(A), f, g), opts));
}

export function quotientIsZero(A: AnyRing, f: Poly, opts?: ComputeOptions): boolean {
  return isZero(quotientNormalForm(A, f, opts));
}

/// f + g in A, as a normal form.
export function quotientAdd(A: AnyRing, f: Poly, g: Poly, opts?: ComputeOptions): Poly {
  return quotientNormalForm(A, add(ambientRing(A), f, g), opts);
}

/// f · g in A, as a normal form.
export function quotientMul(A: AnyRing, f: Poly, g: Poly, opts?: ComputeOptions): Poly {
  const S = ambientRing(A);
  return quotientNormalForm(A, mul(S, quotientNormalForm(A, f, opts), quotientNormalForm(A, g, opts), opts), opts);
}

/// f^k in A by repeated squaring, reducing after every product.
export function quotientPow(A: AnyRing, f: Poly, k: number, opts?: ComputeOptions): Poly {
  if (!Number.isSafeInteger(k) || k < 0) throw runtimeError("quotientPow", `the exponent must be a non-negative integer, got ${k}`);
  let result = quotientNormalForm(A, one(ambientRing(A)), opts);
  let base = quotientNormalForm(A, f, opts);
  for (let e = k; e > 0; e >>= 1) {
    if (e & 1) result = quotientMul(A, result, base, opts);
    if (e > 1) base = quotientMul(A, base, base, opts);
  }
  return result;
}

/// Whether A is the zero ring (its defining ideal is the unit ideal).
export function quotientIsZeroRing(A: AnyRing, opts?: ComputeOptions): boolean {
  return isQuotientRing(A) && idealIsUnit(A.ideal, opts);
}

/// The Hilbert series of A = S/J in the grading of S.
export function quotientHilbertSeries(A: AnyRing, opts?: ComputeOptions): HilbertSeries {
  return idealHilbertSeries(definingIdeal(A), opts);
}

/// Krull dimension of A (−1 for the zero ring).
export function quotientDimension(A: AnyRing, opts?: ComputeOptions): number {
  return idealDimension(definingIdeal(A), opts);
}

/// The degree (multiplicity) of A.
export function quotientDegree(A: AnyRing, opts?: ComputeOptions): Rat {
  return idealDegree(definingIdeal(A), opts);
}
