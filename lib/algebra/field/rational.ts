import { AlgebraError } from "../errors";

/// Exact rationals n/d with d > 0 and gcd(n, d) = 1.
export interface Rat {
  readonly n: bigint;
  readonly d: bigint;
}

const SMALL = 2n ** 53n;
/// Bits of the leading part Lehmer's method works on: every intermediate value stays below 2^53.
const LEAD_BITS = 50;

/// The bit length of a > 0, up to one either way (all Lehmer's method needs: a shift that
/// leaves about 50 leading bits).
function bitLength(a: bigint): number {
  const f = Number(a);
  return f === Infinity ? a.toString(16).length * 4 : Math.floor(Math.log2(f)) + 1;
}

/// gcd of two numbers below 2^53 in floating point (exact there).
function smallGcd(a: number, b: number): number {
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/// gcd by Lehmer's method: the Euclidean steps are simulated on the leading 50 bits in
/// floating point and applied to the full numbers as one 2×2 combination (D. E. Knuth,
/// The Art of Computer Programming, vol. 2, §4.5.2, Algorithm L); exact, and many times
/// fewer BigInt divisions than the plain Euclidean algorithm on numbers of hundreds of bits.
export function bigGcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  if (a < b) [a, b] = [b, a];
  while (b >= SMALL) {
    const shift = BigInt(Math.max(0, bitLength(a) - LEAD_BITS));
    let x = Number(a >> shift),
      y = Number(b >> shift);
    let A = 1,
      B = 0,
      C = 0,
      D = 1;
    for (;;) {
      if (y + C === 0 || y + D === 0) break;
      const q = Math.floor((x + A) / (y + C));
      if (q !== Math.floor((x + B) / (y + D))) break;
      let t = A - q * C;
      A = C;
      C = t;
      t = B - q * D;
      B = D;
      D = t;
      t = x - q * y;
      x = y;
      y = t;
    }
    if (B === 0) {
      [a, b] = [b, a % b];
    } else {
      [a, b] = [BigInt(A) * a + BigInt(B) * b, BigInt(C) * a + BigInt(D) * b];
    }
  }
  if (b === 0n) return a;
  return BigInt(smallGcd(Number(a % b), Number(b)));
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

/// a + b with the gcds taken on the denominators' size, not the sum's (P. Henrici, "A
/// subroutine for computations with rational numbers", J. ACM 1956; Knuth vol. 2, §4.5.1).
export function ratAdd(a: Rat, b: Rat): Rat {
  if (a.d === 1n && b.d === 1n) return { n: a.n + b.n, d: 1n };
  if (a.d === 1n) return { n: a.n * b.d + b.n, d: b.d };
  if (b.d === 1n) return { n: a.n + b.n * a.d, d: a.d };
  const g = bigGcd(a.d, b.d);
  if (g === 1n) return { n: a.n * b.d + b.n * a.d, d: a.d * b.d };
  const bd = b.d / g;
  const t = a.n * bd + b.n * (a.d / g);
  if (t === 0n) return RAT_ZERO;
  const g2 = bigGcd(t, g);
  return g2 === 1n ? { n: t, d: a.d * bd } : { n: t / g2, d: (a.d / g2) * bd };
}

export function ratSub(a: Rat, b: Rat): Rat {
  return ratAdd(a, { n: -b.n, d: b.d });
}

/// a·b with the cross gcds gcd(a.n, b.d), gcd(b.n, a.d) (Henrici; Knuth vol. 2, §4.5.1).
export function ratMul(a: Rat, b: Rat): Rat {
  if (a.d === 1n && b.d === 1n) return { n: a.n * b.n, d: 1n };
  if (a.n === 0n || b.n === 0n) return RAT_ZERO;
  const g1 = b.d === 1n ? 1n : bigGcd(a.n, b.d);
  const g2 = a.d === 1n ? 1n : bigGcd(b.n, a.d);
  const n = (g1 === 1n ? a.n : a.n / g1) * (g2 === 1n ? b.n : b.n / g2);
  const d = (g2 === 1n ? a.d : a.d / g2) * (g1 === 1n ? b.d : b.d / g1);
  return { n, d };
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

// The operations below serve the Hilbert code, the evaluator and the engine's interface; the
// polynomial inner loops use only the ones above. They keep the same invariant (d > 0, lowest terms).

/// n/d in lowest terms for callers outside the inner loops: a zero denominator is the runtime
/// error "division by zero" (`rat` leaves that check to its caller).
export function ratOf(n: bigint, d: bigint = 1n): Rat {
  if (d === 0n) throw new AlgebraError("runtime", "division by zero");
  return rat(n, d);
}

/// a / b; b = 0 is the runtime error "division by zero".
export function ratDiv(a: Rat, b: Rat): Rat {
  if (b.n === 0n) throw new AlgebraError("runtime", "division by zero");
  return ratMul(a, ratInv(b));
}

/// −1, 0 or 1 as a <, =, > b (denominators are positive, so cross-multiplying keeps the order).
export function ratCompare(a: Rat, b: Rat): number {
  const t = a.n * b.d - b.n * a.d;
  return t < 0n ? -1 : t > 0n ? 1 : 0;
}

/// Reads "42", "-3/4" (not necessarily in lowest terms); null when the text is not a decimal
/// rational with non-zero denominator.
export function parseRat(text: string): Rat | null {
  const m = /^(-?\d+)(?:\/(\d+))?$/.exec(text);
  if (!m) return null;
  const d = m[2] === undefined ? 1n : BigInt(m[2]);
  if (d === 0n) return null;
  return rat(BigInt(m[1]), d);
}
