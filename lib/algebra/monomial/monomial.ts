/// Packed monomials: an Int32Array [key, degree, mask, e_1, …, e_n].
///   key    — the order's primary weight (the degree for grevlex/glex, w·e for weights, 0 for lex)
///   degree — the weighted degree in the ring's grading
///   mask   — bit (i mod 32) set when e_i > 0, so most failed divisibility tests are one AND
/// All header slots but the mask are linear in the exponents, so products add slot by slot.
export type Mono = Int32Array;

export const HEAD = 3;
const KEY = 0,
  DEG = 1,
  MASK = 2;

/// What packing needs to know about a ring: its grading and its order's primary weight.
export interface MonoLayout {
  readonly n: number;
  readonly degrees: Int32Array;
  /// null: the key is the degree (grevlex, glex) — or unused (lex, see keyIsZero).
  readonly keyWeights: Int32Array | null;
  readonly keyIsZero: boolean;
}

/// Exponents beyond this would risk overflowing the 32-bit header slots.
export const MAX_EXPONENT = 1 << 24;

export function monoFromExps(L: MonoLayout, exps: ArrayLike<number>): Mono {
  const m = new Int32Array(HEAD + L.n);
  for (let i = 0; i < L.n; i++) m[HEAD + i] = exps[i];
  return finishMono(L, m);
}

/// Recomputes the header of m from its exponents.
export function finishMono(L: MonoLayout, m: Mono): Mono {
  let deg = 0,
    key = 0,
    mask = 0;
  const kw = L.keyWeights;
  for (let i = 0; i < L.n; i++) {
    const e = m[HEAD + i];
    if (e !== 0) {
      deg += e * L.degrees[i];
      if (kw) key += e * kw[i];
      mask |= 1 << (i & 31);
    }
  }
  m[KEY] = L.keyIsZero ? 0 : kw ? key : deg;
  m[DEG] = deg;
  m[MASK] = mask;
  return m;
}

export function monoOne(L: MonoLayout): Mono {
  return new Int32Array(HEAD + L.n);
}

export function monoMul(a: Mono, b: Mono): Mono {
  const len = a.length;
  const r = new Int32Array(len);
  r[KEY] = a[KEY] + b[KEY];
  r[DEG] = a[DEG] + b[DEG];
  r[MASK] = a[MASK] | b[MASK];
  for (let i = HEAD; i < len; i++) r[i] = a[i] + b[i];
  return r;
}

/// Whether a divides b.
export function monoDivides(a: Mono, b: Mono): boolean {
  if ((a[MASK] & ~b[MASK]) !== 0) return false;
  if (a[DEG] > b[DEG]) return false;
  for (let i = HEAD, len = a.length; i < len; i++) if (a[i] > b[i]) return false;
  return true;
}

/// b / a, caller guarantees a | b.
export function monoDiv(b: Mono, a: Mono): Mono {
  const len = a.length;
  const r = new Int32Array(len);
  r[KEY] = b[KEY] - a[KEY];
  r[DEG] = b[DEG] - a[DEG];
  let mask = 0;
  for (let i = HEAD; i < len; i++) {
    const e = b[i] - a[i];
    r[i] = e;
    if (e !== 0) mask |= 1 << ((i - HEAD) & 31);
  }
  r[MASK] = mask;
  return r;
}

export function monoLcm(L: MonoLayout, a: Mono, b: Mono): Mono {
  const len = a.length;
  const r = new Int32Array(len);
  for (let i = HEAD; i < len; i++) r[i] = a[i] > b[i] ? a[i] : b[i];
  return finishMono(L, r);
}

/// Whether a and b share no variable.
export function monoCoprime(a: Mono, b: Mono): boolean {
  if ((a[MASK] & b[MASK]) === 0) return true;
  for (let i = HEAD, len = a.length; i < len; i++) if (a[i] !== 0 && b[i] !== 0) return false;
  return true;
}

export function monoEq(a: Mono, b: Mono): boolean {
  for (let i = 0, len = a.length; i < len; i++) if (a[i] !== b[i]) return false;
  return true;
}

export function monoIsOne(a: Mono): boolean {
  for (let i = HEAD, len = a.length; i < len; i++) if (a[i] !== 0) return false;
  return true;
}

export function monoExps(a: Mono): number[] {
  return Array.from(a.subarray(HEAD));
}
