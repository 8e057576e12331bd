/// Helpers for error messages: nearest names, primes, source snippets.

/// Levenshtein distance, stopping early once it exceeds `max`.
export function editDistance(a: string, b: string, max = 3): number {
  if (Math.abs(a.length - b.length) > max) return max + 1;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    let best = i;
    for (let j = 1; j <= b.length; j++) {
      const v = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
      cur.push(v);
      if (v < best) best = v;
    }
    if (best > max) return max + 1;
    prev = cur;
  }
  return prev[b.length];
}

/// The closest candidate within a distance that grows with the name's length.
export function nearest(name: string, candidates: Iterable<string>): string | undefined {
  if (name.length <= 2) return undefined; // every short name is close to every other
  const limit = name.length <= 3 ? 1 : name.length <= 6 ? 2 : 3;
  let best: string | undefined;
  let bestD = limit + 1;
  for (const c of candidates) {
    if (c === name) continue;
    const d = editDistance(name.toLowerCase(), c.toLowerCase(), limit);
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return best;
}

export function isPrime(n: bigint): boolean {
  if (n < 2n) return false;
  if (n < 4n) return true;
  if (n % 2n === 0n || n % 3n === 0n) return false;
  for (let d = 5n; d * d <= n; d += 6n) if (n % d === 0n || n % (d + 2n) === 0n) return false;
  return true;
}

/// The smallest prime ≥ n (n below 2^31, so this stays fast).
export function nextPrime(n: bigint): bigint {
  let c = n < 2n ? 2n : n;
  while (!isPrime(c)) c += 1n;
  return c;
}

/// The largest prime ≤ n, or undefined below 2.
export function previousPrime(n: bigint): bigint | undefined {
  for (let c = n; c >= 2n; c -= 1n) if (isPrime(c)) return c;
  return undefined;
}
