/// Exact rationals n/d with d > 0 and gcd(n, d) = 1.
export interface Rat {
  readonly n: bigint;
  readonly d: bigint;
}

export function bigGcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function rat(n: bigint, d: bigint = 1n): Rat {
  if (d === 1n) return { n, d };
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  const g = bigGcd(n, d);
  return g === 1n ? { n, d } : { n: n / g, d: d / g };
}

export const RAT_ZERO: Rat = { n: 0n, d: 1n };
export const RAT_ONE: Rat = { n: 1n, d: 1n };

export function ratAdd(a: Rat, b: Rat): Rat {
  if (a.d === 1n && b.d === 1n) return { n: a.n + b.n, d: 1n };
  return rat(a.n * b.d + b.n * a.d, a.d * b.d);
}

export function ratSub(a: Rat, b: Rat): Rat {
  if (a.d === 1n && b.d === 1n) return { n: a.n - b.n, d: 1n };
  return rat(a.n * b.d - b.n * a.d, a.d * b.d);
}

export function ratMul(a: Rat, b: Rat): Rat {
  if (a.d === 1n && b.d === 1n) return { n: a.n * b.n, d: 1n };
  return rat(a.n * b.n, a.d * b.d);
}

export function ratNeg(a: Rat): Rat {
  return { n: -a.n, d: a.d };
}

/// Caller guarantees a != 0.
export function ratInv(a: Rat): Rat {
  return a.n < 0n ? { n: -a.d, d: -a.n } : { n: a.d, d: a.n };
}

export function ratToString(a: Rat): string {
  return a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`;
}
