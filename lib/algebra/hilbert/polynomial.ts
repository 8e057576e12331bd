import { runtimeError } from "../errors";
import { rat, type Rat } from "../field/rational";
import { type HilbertSeries, isStandardGrading } from "./series";

/// The Hilbert polynomial P with P(d) = dim_k (S/I)_d for all large d, as rational
/// coefficients of d^0, d^1, … (empty for the zero polynomial). Standard grading only:
/// with other degrees the Hilbert function is in general a quasi-polynomial.
export function hilbertPolynomial(hs: HilbertSeries): Rat[] {
  if (!isStandardGrading(hs.weights)) {
    throw runtimeError(
      "hilbertPolynomial",
      `the variables have degrees (${hs.weights.join(", ")}), not all 1: the Hilbert function is a quasi-polynomial, not a polynomial`,
    );
  }
  const D = hs.dimension;
  if (D <= 0) return [];
  // HS = Σ_k q_k t^k / (1 − t)^D, and the coefficient of t^d in t^k / (1 − t)^D is
  // C(d − k + D − 1, D − 1) = ∏_{j=0}^{D−2} (d + D − 1 − k − j) / (D − 1)!
  const sum = new Array<bigint>(D).fill(0n);
  hs.reducedNumerator.forEach((q, k) => {
    if (q === 0n) return;
    let term: bigint[] = [q];
    for (let j = 0; j <= D - 2; j++) term = mulLinear(term, BigInt(D - 1 - k - j));
    term.forEach((c, i) => (sum[i] += c));
  });
  let factorial = 1n;
  for (let i = 2n; i <= BigInt(D - 1); i++) factorial *= i;
  const coeffs = sum.map((c) => rat(c, factorial));
  while (coeffs.length > 0 && coeffs[coeffs.length - 1].n === 0n) coeffs.pop();
  return coeffs;
}

/// p(d) · (d + a)
function mulLinear(p: readonly bigint[], a: bigint): bigint[] {
  const out = new Array<bigint>(p.length + 1).fill(0n);
  p.forEach((c, i) => {
    out[i] += c * a;
    out[i + 1] += c;
  });
  return out;
}

/// P(d) for the polynomial returned by hilbertPolynomial.
export function evaluateHilbertPolynomial(coeffs: readonly Rat[], d: bigint): Rat {
  let num = 0n;
  let den = 1n;
  for (let i = coeffs.length - 1; i >= 0; i--) {
    // (num/den)·d + c
    const c = coeffs[i];
    num = num * d * c.d + c.n * den;
    den = den * c.d;
    const r = rat(num, den);
    num = r.n;
    den = r.d;
  }
  return rat(num, den);
}
