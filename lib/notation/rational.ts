/// Exact rational numbers on BigInt, always normalised: den > 0 and gcd(num, den) = 1.
export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

export class DivisionByZero extends Error {
  constructor() {
    super("division by zero");
  }
}

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function rational(num: bigint, den: bigint = 1n): Rational {
  if (den === 0n) throw new DivisionByZero();
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  const g = gcd(num, den);
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
