/// Dense polynomials in one variable t with integer (BigInt) coefficients:
/// index i holds the coefficient of t^i. Trailing zeros are trimmed, so the zero
/// polynomial is the empty array.
export type TPoly = readonly bigint[];

export function tpolyTrim(c: bigint[]): bigint[] {
  let n = c.length;
  while (n > 0 && c[n - 1] === 0n) n--;
  c.length = n;
  return c;
}

export function tpolyAdd(f: TPoly, g: TPoly): bigint[] {
  const out = new Array<bigint>(Math.max(f.length, g.length)).fill(0n);
  for (let i = 0; i < f.length; i++) out[i] += f[i];
  for (let i = 0; i < g.length; i++) out[i] += g[i];
  return tpolyTrim(out);
}

/// f · t^k
export function tpolyShift(f: TPoly, k: number): bigint[] {
  if (f.length === 0) return [];
  const out = new Array<bigint>(k).fill(0n);
  for (const c of f) out.push(c);
  return out;
}

/// f · (1 − t^d)
export function tpolyMulOneMinusPower(f: TPoly, d: number): bigint[] {
  return tpolyAdd(
    f,
    tpolyShift(
      f.map((c) => -c),
      d,
    ),
  );
}

export function tpolyAtOne(f: TPoly): bigint {
  let s = 0n;
  for (const c of f) s += c;
  return s;
}

/// Exact quotient f / (1 − t); the caller makes sure f(1) = 0.
export function tpolyDivOneMinusT(f: TPoly): bigint[] {
  // f = (1 − t)·q  ⇔  q_i = f_0 + … + f_i
  const q: bigint[] = [];
  let s = 0n;
  for (let i = 0; i + 1 < f.length; i++) {
    s += f[i];
    q.push(s);
  }
  return tpolyTrim(q);
}

/// Coefficients of t^0..t^d in the power series f(t) / ∏ (1 − t^{w_i}).
export function tpolySeriesUpTo(f: TPoly, weights: readonly number[], d: number): bigint[] {
  const s = new Array<bigint>(d + 1).fill(0n);
  for (let i = 0; i <= d && i < f.length; i++) s[i] = f[i];
  // dividing by (1 − t^w) is a running sum with step w
  for (const w of weights) for (let i = w; i <= d; i++) s[i] += s[i - w];
  return s;
}
