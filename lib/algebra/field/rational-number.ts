/// `Rational`: the exact rational number that the engine's interface, the Hilbert code and the
/// evaluator share — num/den in lowest terms with den > 0. (Coefficients of polynomials over Q
/// use the packed `Rat` of rational.ts, tuned for the inner loops.)
import { AlgebraError } from "../errors";
import { bigGcd } from "./rational";

export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

/// num/den in lowest terms; a zero denominator is the runtime error "division by zero".
export function rational(num: bigint, den: bigint = 1n): Rational {
  if (den === 0n) throw new AlgebraError("runtime", "division by zero");
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  const g = bigGcd(num, den);
  return g > 1n ? { num: num / g, den: den / g } : { num, den };
}

export const ratAdd = (a: Rational, b: Rational): Rational => rational(a.num * b.den + b.num * a.den, a.den * b.den);
export const ratSub = (a: Rational, b: Rational): Rational => rational(a.num * b.den - b.num * a.den, a.den * b.den);
export const ratMul = (a: Rational, b: Rational): Rational => rational(a.num * b.num, a.den * b.den);
export const ratDiv = (a: Rational, b: Rational): Rational => rational(a.num * b.den, a.den * b.num);
export const ratNeg = (a: Rational): Rational => ({ num: -a.num, den: a.den });
export const ratCompare = (a: Rational, b: Rational): number => {
  const d = a.num * b.den - b.num * a.den;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
};

/// Integer power; negative exponents invert (and so fail on zero).
export function ratPow(a: Rational, k: bigint): Rational {
  if (k < 0n) return ratPow(ratDiv(rational(1n), a), -k);
  let num = 1n;
  let den = 1n;
  for (let i = 0n; i < k; i++) {
    num *= a.num;
    den *= a.den;
  }
  return rational(num, den);
}

export function ratToString(a: Rational): string {
  return a.den === 1n ? a.num.toString() : `${a.num}/${a.den}`;
}

/// Reads "42", "-3/4"; null when the text is not a decimal rational with non-zero denominator.
export function parseRational(text: string): Rational | null {
  const m = /^(-?\d+)(?:\/(\d+))?$/.exec(text);
  if (!m) return null;
  const den = m[2] === undefined ? 1n : BigInt(m[2]);
  if (den === 0n) return null;
  return rational(BigInt(m[1]), den);
}
