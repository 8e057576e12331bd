// Shared helpers for the resolution, module and invariants tests.
import { expect } from "vitest";
import { mulberry32 } from "./sympy/random-systems";
import {
  add,
  degree,
  gf,
  ideal,
  type Ideal,
  isZero,
  monomial,
  mul,
  neg,
  type Poly,
  polyRing,
  type PolyRing,
  terms,
  variable,
  zero,
  type Field,
} from "@/lib/algebra";
import type { Resolution } from "@/lib/algebra/resolution/schreyer";

export const GF = gf(32003);

/// A small deterministic generator (the sympy cross-check's mulberry32, common practice).
export const rng = mulberry32;

export function ringOf(F: Field, n: number, name = "x"): PolyRing {
  return polyRing(
    F,
    Array.from({ length: n }, (_, i) => `${name}${i + 1}`),
  );
}

export function vars(R: PolyRing): Poly[] {
  return R.vars.map((_, i) => variable(R, i));
}

export function binom(n: number, k: number): number {
  if (k < 0 || k > n) return 0;
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

/// All exponent vectors of total degree d in n variables.
export function monomialsOfDegree(n: number, d: number): number[][] {
  if (n === 0) return d === 0 ? [[]] : [];
  const out: number[][] = [];
  for (let e = d; e >= 0; e--) for (const rest of monomialsOfDegree(n - 1, d - e)) out.push([e, ...rest]);
  return out;
}

/// A random form of degree d with `count` terms (coefficients in [-9, 9]) in the variables
/// with indices in `support` (default all).
export function randomForm(R: PolyRing, d: number, count: number, rand: () => number, support?: number[]): Poly {
  const n = R.vars.length;
  const idx = support ?? Array.from({ length: n }, (_, i) => i);
  const mons = monomialsOfDegree(idx.length, d);
  let f = zero(R);
  for (let t = 0; t < count; t++) {
    const e = mons[Math.floor(rand() * mons.length)];
    const exps = new Array<number>(n).fill(0);
    idx.forEach((v, k) => (exps[v] = e[k]));
    const c = BigInt(Math.floor(rand() * 19) - 9);
    f = add(R, f, monomial(R, exps, c === 0n ? 1n : c));
  }
  return f;
}

/// Generic matrix of variables (rows × cols), x_{i,j} = variable i·cols + j.
export function genericMatrix(R: PolyRing, rows: number, cols: number): Poly[][] {
  return Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => variable(R, i * cols + j)));
}

export function matMul(R: PolyRing, A: Poly[][], B: Poly[][]): Poly[][] {
  return A.map((row) => B[0].map((_, j) => row.reduce((s, a, k) => add(R, s, mul(R, a, B[k][j])), zero(R))));
}

/// The properties every minimal graded free resolution has: consecutive maps compose to
/// zero, every entry lies in the maximal ideal (minimality), and entry (a, b) of map i is
/// homogeneous of degree deg(F_i)_b − deg(F_{i−1})_a (a graded map of degree 0).
export function expectMinimalComplex(R: PolyRing, C: Resolution): void {
  for (let i = 1; i <= C.length; i++) {
    const A = C.map(i);
    expect(A.length).toBe(C.ranks[i - 1]);
    A.forEach((row, a) =>
      row.forEach((f, b) => {
        if (isZero(f)) return;
        for (const t of terms(R, f)) {
          const d = t.exps.reduce((s, e, v) => s + e * R.degrees[v], 0);
          expect(d).toBe(C.degrees[i][b] - C.degrees[i - 1][a]);
          expect(d).toBeGreaterThan(0);
        }
        expect(degree(R, f)).toBeGreaterThan(0);
      }),
    );
    if (i < C.length) {
      const P = matMul(R, A, C.map(i + 1));
      expect(P.every((row) => row.every((f) => isZero(f)))).toBe(true);
    }
  }
}

/// Betti entries as a map "i,j" → β for easy comparison.
export function bettiMap(C: Resolution): Map<string, number> {
  return new Map(C.betti.entries.map(([i, j, b]) => [`${i},${j}`, b]));
}

export function idealOf(R: PolyRing, gens: Poly[]): Ideal {
  return ideal(R, gens);
}

/// The generic alternating n×n matrix: a_{ij} = variable for i < j, a_{ji} = −a_{ij}.
export function alternating(R: PolyRing, n: number): Poly[][] {
  const A: Poly[][] = Array.from({ length: n }, () => new Array<Poly>(n).fill(zero(R)));
  let v = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      A[i][j] = variable(R, v);
      A[j][i] = neg(R, variable(R, v));
      v++;
    }
  }
  return A;
}
