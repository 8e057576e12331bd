/// Monomial ideals as lists of exponent vectors, all of the same length n.
export type Exponents = readonly number[];

export function monomialDivides(a: Exponents, b: Exponents): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] > b[i]) return false;
  return true;
}

export function monomialTotalDegree(a: Exponents): number {
  let s = 0;
  for (const e of a) s += e;
  return s;
}

export function monomialWeightedDegree(a: Exponents, weights: readonly number[]): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * weights[i];
  return s;
}

export function monomialLcm(a: Exponents, b: Exponents): number[] {
  return a.map((e, i) => Math.max(e, b[i]));
}

/// a / gcd(a, b): the generator of (a) : (b).
export function monomialColon(a: Exponents, b: Exponents): number[] {
  return a.map((e, i) => Math.max(0, e - b[i]));
}

/// The minimal generators of the ideal spanned by `gens` (duplicates and multiples
/// removed), sorted by total degree.
export function minimalMonomialGenerators(gens: readonly Exponents[]): Exponents[] {
  const sorted = [...gens].sort((a, b) => monomialTotalDegree(a) - monomialTotalDegree(b));
  const kept: Exponents[] = [];
  for (const g of sorted) {
    if (!kept.some((k) => monomialDivides(k, g))) kept.push(g);
  }
  return kept;
}
