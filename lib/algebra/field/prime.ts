/// Deterministic primality for n < 2^31 by trial division (at most ~4800 odd divisors).
export function isPrime(n: number): boolean {
  if (!Number.isInteger(n) || n < 2) return false;
  if (n < 4) return true;
  if (n % 2 === 0 || n % 3 === 0) return false;
  for (let d = 5; d * d <= n; d += 6) {
    if (n % d === 0 || n % (d + 2) === 0) return false;
  }
  return true;
}

/// The largest prime strictly below `n`.
export function previousPrime(n: number): number {
  let q = n - 1;
  while (q >= 2 && !isPrime(q)) q--;
  return q;
}
