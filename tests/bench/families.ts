import * as A from "@/lib/algebra";

/// The cyclic-n system in variables x0..x(n−1): the elementary cyclic sums
/// Σ_i x_i x_{i+1} ⋯ x_{i+k−1} for k < n, and x_0 ⋯ x_{n−1} − 1
/// (G. Björck, R. Fröberg, "A faster way to count the solutions of inhomogeneous systems
/// of algebraic equations", J. Symbolic Comput. 1991).
export function cyclic(field: A.Field, n: number): { R: A.PolyRing; gens: A.Poly[] } {
  const v = Array.from({ length: n }, (_, i) => `x${i}`);
  const R = A.polyRing(field, v);
  const gens: A.Poly[] = [];
  for (let k = 1; k < n; k++) {
    const sum = v.map((_, i) => Array.from({ length: k }, (_, j) => v[(i + j) % n]).join("*"));
    gens.push(A.parsePoly(R, sum.join("+")));
  }
  gens.push(A.parsePoly(R, `${v.join("*")}-1`));
  return { R, gens };
}

/// The katsura-n system in u0..un: u0 + 2(u1 + … + un) = 1 and, for m = 0..n−1,
/// Σ_{l=−n..n} u_|l| u_|m−l| = u_m with u_k = 0 for k > n (common practice, from memory).
/// The generators as text, read alike by the engine's parsePoly and by the notation (the
/// cell and experiment suites send them as an ideal literal: `katsuraIdealText`).
export function katsuraGenerators(n: number): string[] {
  const v = Array.from({ length: n + 1 }, (_, i) => `u${i}`);
  const u = (k: number) => (Math.abs(k) <= n ? v[Math.abs(k)] : null);
  const gens = [`${v[0]}+2*(${v.slice(1).join("+")})-1`];
  for (let m = 0; m < n; m++) {
    const parts: string[] = [];
    for (let l = -n; l <= n; l++) {
      const a = u(l),
        b = u(m - l);
      if (a && b) parts.push(`${a}*${b}`);
    }
    gens.push(`${parts.join("+")}-${v[m]}`);
  }
  return gens;
}

/// A katsura-n no computation in a test finishes before the tests' time limits (8 s for a
/// cell, 4 s for an experiment member) stop it, with room for engines many times faster: with
/// the F4 kernel katsura-10 takes about 2 s and katsura-11 about 13 s on the development
/// machine, each step some 7–8 times the one before (README, Performance), so katsura-13 needs
/// minutes. Suites that need a computation still running when a limit or a cancel comes use it.
export const OUTLASTING_KATSURA = 13;

/// katsura-n as an ideal literal of the notation, read in a ring with variables u0..un.
export const katsuraIdealText = (n: number): string => `<${katsuraGenerators(n).join(", ")}>`;

export function katsura(field: A.Field, n: number): { R: A.PolyRing; gens: A.Poly[] } {
  const R = A.polyRing(
    field,
    Array.from({ length: n + 1 }, (_, i) => `u${i}`),
  );
  return { R, gens: katsuraGenerators(n).map((g) => A.parsePoly(R, g)) };
}

/// The number of monomials outside the initial ideal of a zero-dimensional ideal
/// (= dim_k S/I, the degree counted with multiplicity), by walking the staircase; null
/// when the ideal is not zero-dimensional.
export function countStandardMonomials(R: A.PolyRing, G: A.Poly[]): number | null {
  const lms = G.map((g) => A.leadExponents(R, g));
  const n = R.vars.length;
  const bound: number[] = [];
  for (let i = 0; i < n; i++) {
    const pure = lms.filter((e) => e.every((x, j) => j === i || x === 0)).map((e) => e[i]);
    if (pure.length === 0) return null;
    bound.push(Math.min(...pure));
  }
  const inIdeal = (e: number[]) => lms.some((l) => l.every((x, j) => x <= e[j]));
  let count = 0;
  const e = new Array<number>(n).fill(0);
  const walk = (i: number): void => {
    if (i === n) {
      count++;
      return;
    }
    for (e[i] = 0; e[i] < bound[i]; e[i]++) {
      // Divisibility is monotone: once e is in the ideal, larger e_i stay in it.
      const rest = e.slice();
      for (let j = i + 1; j < n; j++) rest[j] = 0;
      if (inIdeal(rest)) break;
      walk(i + 1);
    }
    e[i] = 0;
  };
  walk(0);
  return count;
}
