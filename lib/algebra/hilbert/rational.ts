/// An exact rational number in lowest terms, den > 0.
export interface RationalNumber {
  readonly num: bigint;
  readonly den: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function rationalOf(num: bigint, den = 1n): RationalNumber {
  if (den < 0n) [num, den] = [-num, -den];
  const g = gcd(num, den);
  return g > 1n ? { num: num / g, den: den / g } : { num, den };
}
