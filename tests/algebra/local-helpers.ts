import * as A from "../../lib/algebra/index";

export const F = A.gf(32003);

export function ring(n: number, field: A.Field = F): A.PolyRing {
  return A.polyRing(
    field,
    Array.from({ length: n }, (_, i) => `x${i + 1}`),
  );
}

export function vars(S: A.PolyRing): A.Poly[] {
  return S.vars.map((_, i) => A.variable(S, i));
}

export function maximal(S: A.PolyRing): A.Ideal {
  return A.ideal(S, vars(S));
}

/// A seeded pseudo-random homogeneous form of degree d with small coefficients.
export function randomForm(S: A.PolyRing, d: number, next: () => number): A.Poly {
  let f = A.zero(S);
  const rec = (start: number, left: number, m: A.Poly) => {
    if (left === 0) {
      f = A.add(S, f, A.scale(S, m, BigInt((next() % 19) - 9)));
      return;
    }
    for (let i = start; i < S.vars.length; i++) rec(i, left - 1, A.mul(S, m, A.variable(S, i)));
  };
  rec(0, d, A.one(S));
  return f;
}

export function seeded(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647);
}

export function binomial(n: number, k: number): number {
  if (k < 0 || k > n) return 0;
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}
