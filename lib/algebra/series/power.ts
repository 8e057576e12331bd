import { runtimeError } from "../errors";
import { rat, ratMul, ratSub, type Rat, RAT_ZERO } from "../field/rational";

/// A power series known up to (not including) t^terms: coeffs[i] is the coefficient of t^i.
export interface TruncatedSeries {
  coeffs: bigint[];
  terms: number;
}

export function truncatedSeries(coeffs: readonly (bigint | number)[]): TruncatedSeries {
  return { coeffs: coeffs.map((c) => BigInt(c)), terms: coeffs.length };
}

/// The coefficient of t^i; an error beyond the known terms.
export function seriesAt(s: TruncatedSeries, i: number): bigint {
  if (!Number.isInteger(i) || i < 0 || i >= s.terms)
    throw runtimeError("series", `the coefficient of t^${i} is not known (${s.terms} terms computed)`);
  return s.coeffs[i];
}

/// The first `terms` coefficients of num/den (integer coefficient lists, den[0] = ±1).
export function expandRational(num: readonly bigint[], den: readonly bigint[], terms: number): bigint[] {
  const q = expandRationalQ(
    num.map((a) => rat(a)),
    den.map((a) => rat(a)),
    terms,
  );
  return q.map((c) => {
    if (c.d !== 1n) throw runtimeError("series", "the expansion is not integral");
    return c.n;
  });
}

/// The first `terms` coefficients of num/den over Q (den[0] ≠ 0).
export function expandRationalQ(num: readonly Rat[], den: readonly Rat[], terms: number): Rat[] {
  if (den.length === 0 || den[0].n === 0n) throw runtimeError("series", "the denominator must have a nonzero constant term");
  const inv0 = rat(den[0].d, den[0].n);
  const out: Rat[] = [];
  for (let i = 0; i < terms; i++) {
    let c = i < num.length ? num[i] : RAT_ZERO;
    for (let k = 1; k <= i && k < den.length; k++) c = ratSub(c, ratMul(den[k], out[i - k]));
    out.push(ratMul(c, inv0));
  }
  return out;
}

/// The product of two integer polynomials (coefficient lists).
export function polyMulZ(a: readonly bigint[], b: readonly bigint[]): bigint[] {
  if (a.length === 0 || b.length === 0) return [];
  const out = new Array<bigint>(a.length + b.length - 1).fill(0n);
  a.forEach((x, i) => b.forEach((y, j) => (out[i + j] += x * y)));
  return out;
}

export function polyPowZ(a: readonly bigint[], k: number): bigint[] {
  let r: bigint[] = [1n];
  for (let i = 0; i < k; i++) r = polyMulZ(r, a);
  return r;
}

/// Whether a/b = c/d as rational functions (cross-multiplication).
export function sameRationalFunction(a: readonly bigint[], b: readonly bigint[], c: readonly bigint[], d: readonly bigint[]): boolean {
  const l = polyMulZ(a, d),
    r = polyMulZ(c, b);
  const len = Math.max(l.length, r.length);
  for (let i = 0; i < len; i++) if ((l[i] ?? 0n) !== (r[i] ?? 0n)) return false;
  return true;
}
