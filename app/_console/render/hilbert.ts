/// What a Hilbert series H(t) = N(t)/(1−t)^n of a standard graded module tells (common
/// practice; Bruns–Herzog, Cohen–Macaulay Rings, §4.1): cancelling the factors (1−t) of N
/// gives the reduced form h(t)/(1−t)^d with h(1) ≠ 0, where d is the Krull dimension,
/// h(t)'s coefficients are the h-vector, h(1) is the degree (multiplicity), and for d ≥ 1
/// the Hilbert polynomial is P(n) = Σ_i h_i·C(n − i + d − 1, d − 1), equal to the Hilbert
/// function for all large n. Only for the standard grading (every variable of degree 1);
/// other gradings are shown as they come.
import { ascendingPolyText } from "./series";
import { texOfExpression } from "./tex";

export interface HilbertFacts {
  /// the reduced form h(t)/(1−t)^d, as notation text
  readonly reduced: string;
  readonly hVector: readonly bigint[];
  readonly dimension: number;
  readonly degree: bigint;
  /// the Hilbert polynomial in n as text (rational coefficients), "0" when d = 0
  readonly polynomial: string;
  /// its coefficients, constant term first, as [numerator, denominator]
  readonly polynomialCoefficients: readonly (readonly [bigint, bigint])[];
}

/// n in (1−t)^n, or null when the denominator is not a power of (1−t).
export function standardDenominatorPower(denominator: string): number | null {
  const d = denominator.replace(/\s+/g, "");
  if (d === "1") return 0;
  if (d === "(1-t)" || d === "1-t") return 1;
  const m = /^\(1-t\)\^(\d+)$/.exec(d);
  return m ? Number(m[1]) : null;
}

/// N(t) / (1 − t) when it divides exactly (synthetic division), else null.
function divideByOneMinusT(coefficients: readonly bigint[]): bigint[] | null {
  // N(t) = (1 − t)·q(t) ⟺ q_k = Σ_{i ≤ k} N_i and Σ N_i = 0
  const total = coefficients.reduce((s, c) => s + c, 0n);
  if (total !== 0n || coefficients.length < 2) return null;
  const q: bigint[] = [];
  let run = 0n;
  for (let k = 0; k < coefficients.length - 1; k++) {
    run += coefficients[k]!;
    q.push(run);
  }
  return q;
}

const gcd = (a: bigint, b: bigint): bigint => {
  a = a < 0n ? -a : a;
  b = b < 0n ? -b : b;
  while (b) [a, b] = [b, a % b];
  return a;
};
function frac(n: bigint, d: bigint): [bigint, bigint] {
  if (d < 0n) [n, d] = [-n, -d];
  const g = gcd(n, d) || 1n;
  return [n / g, d / g];
}
const addF = (a: readonly [bigint, bigint], b: readonly [bigint, bigint]) => frac(a[0] * b[1] + b[0] * a[1], a[1] * b[1]);

/// Coefficients of Π (n + c_m) (constant first), integers.
function productOfLinears(shifts: readonly bigint[]): bigint[] {
  let p: bigint[] = [1n];
  for (const c of shifts) {
    const next: bigint[] = Array(p.length + 1).fill(0n);
    p.forEach((a, k) => {
      next[k]! += a * c;
      next[k + 1]! += a;
    });
    p = next;
  }
  return p;
}

function polynomialText(coefficients: readonly (readonly [bigint, bigint])[]): string {
  const terms: string[] = [];
  for (let k = coefficients.length - 1; k >= 0; k--) {
    const [num, den] = coefficients[k]!;
    if (num === 0n) continue;
    const a = num < 0n ? -num : num;
    const sign = num < 0n ? "-" : terms.length ? "+" : "";
    const c = den === 1n ? a.toString() : `${a}/${den}`;
    const mono = k === 0 ? "" : k === 1 ? "n" : `n^${k}`;
    const body = mono === "" ? c : c === "1" ? mono : `${c}*${mono}`;
    terms.push(`${sign}${body}`);
  }
  return terms.length ? terms.join("") : "0";
}

/// The facts of a Hilbert series t^lowest·N(t)/denominator, N's coefficients ascending
/// (`lowest` < 0 for a module with generators in negative degrees); null when the grading
/// is not standard.
export function hilbertFacts(numerator: readonly string[], denominator: string, lowest = 0): HilbertFacts | null {
  const n = standardDenominatorPower(denominator);
  if (n === null) return null;
  let h = numerator.map((c) => BigInt(c));
  while (h.length > 1 && h[h.length - 1] === 0n) h = h.slice(0, -1);
  let d = n;
  for (;;) {
    if (d === 0) break;
    const q = divideByOneMinusT(h);
    if (!q) break;
    h = q;
    d -= 1;
  }
  const degree = h.reduce((s, c) => s + c, 0n);
  // P(n) = Σ_i h_i C(n − i + d − 1, d − 1) = Σ_i h_i Π_{m=1}^{d−1} (n − i + m) / (d − 1)!
  let coefficients: [bigint, bigint][] = [[0n, 1n]];
  if (d >= 1) {
    let factorial = 1n;
    for (let m = 2n; m <= BigInt(d - 1); m++) factorial *= m;
    coefficients = Array.from({ length: d }, () => [0n, 1n] as [bigint, bigint]);
    h.forEach((hi, i) => {
      if (hi === 0n) return;
      const shifts = Array.from({ length: d - 1 }, (_, m) => BigInt(m + 1 - i - lowest));
      productOfLinears(shifts).forEach((c, k) => {
        coefficients[k] = addF(coefficients[k]!, frac(hi * c, factorial));
      });
    });
  }
  const hText = ascendingPolyText(h.map(String));
  const shifted = lowest === 0 ? hText : `t^(${lowest})*(${hText})`;
  const reduced = d === 0 ? shifted : `${lowest === 0 ? `(${hText})` : shifted}/(1-t)${d === 1 ? "" : `^${d}`}`;
  return { reduced, hVector: h, dimension: d, degree, polynomial: polynomialText(coefficients), polynomialCoefficients: coefficients };
}

/// TeX of the Hilbert polynomial text (n as the variable).
export function texOfHilbertPolynomial(text: string): string {
  return texOfExpression(text) ?? text;
}
