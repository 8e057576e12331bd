// Hilbert–Poincaré series numerators of monomial ideals by the pivot recursion of
// A. M. Bigatti, "Computation of Hilbert–Poincaré series", J. Pure Appl. Algebra 119 (1997),
// building on D. Bayer, M. Stillman, "Computation of Hilbert functions",
// J. Symbolic Comput. 14 (1992).
import { type Exponents, minimalMonomialGenerators, monomialWeightedDegree } from "./monomials";
import { type TPoly, tpolyAdd, tpolyMulOneMinusPower, tpolyShift } from "./tpoly";
import type { Ticker } from "../options";

/// N(t) with HS(S/I)(t) = N(t) / ∏ (1 − t^{w_i}), for I spanned by `gens` (any
/// generators: redundant ones are removed first). `weights` are the positive degrees
/// of the variables.
export function hilbertNumeratorPivot(gens: readonly Exponents[], weights: readonly number[], ticker: Ticker): bigint[] {
  return numeratorOfMinimal(minimalMonomialGenerators(gens), weights, ticker);
}

function numeratorOfMinimal(gens: readonly Exponents[], weights: readonly number[], ticker: Ticker): bigint[] {
  ticker.tick();
  if (gens.length === 0) return [1n];
  if (gens.length === 1) return tpolyMulOneMinusPower([1n], monomialWeightedDegree(gens[0], weights));
  const counts = variableCounts(gens);
  // A generator sharing no variable with the others is a nonzerodivisor modulo them:
  // it splits off as a factor (1 − t^{deg g}).
  const isolated = gens.filter((g) => g.every((e, i) => e === 0 || counts[i] === 1));
  if (isolated.length > 0) {
    const rest = gens.filter((g) => !isolated.includes(g));
    return coprimeProduct(isolated, weights, numeratorOfMinimal(rest, weights, ticker));
  }
  let pivotVar = 0;
  for (let i = 1; i < counts.length; i++) if (counts[i] > counts[pivotVar]) pivotVar = i;

  // Pivot x^e with e the median exponent of x among generators that are not pure
  // powers of x. Then x^e ∉ I (a pure power x^a of I has a > e, by minimality) and
  // I : x^e ⊋ I, so both branches are strictly larger ideals.
  const exps = gens
    .filter((g) => g[pivotVar] > 0 && !isPurePower(g, pivotVar))
    .map((g) => g[pivotVar])
    .sort((a, b) => a - b);
  const e = exps[(exps.length - 1) >> 1];

  // 0 → S/(I : p)(−deg p) → S/I → S/(I + p) → 0 with p = x^e
  const pivot = new Array<number>(weights.length).fill(0);
  pivot[pivotVar] = e;
  const withPivot: Exponents[] = gens.filter((g) => g[pivotVar] < e);
  withPivot.push(pivot);
  const colon = minimalMonomialGenerators(
    gens.map((g) => {
      const c = [...g];
      c[pivotVar] = Math.max(0, c[pivotVar] - e);
      return c;
    }),
  );
  const first: TPoly = numeratorOfMinimal(withPivot, weights, ticker);
  const second = tpolyShift(numeratorOfMinimal(colon, weights, ticker), e * weights[pivotVar]);
  return tpolyAdd(first, second);
}

/// How many generators each variable divides.
function variableCounts(gens: readonly Exponents[]): number[] {
  const counts = new Array<number>(gens[0].length).fill(0);
  for (const g of gens) g.forEach((e, i) => e > 0 && counts[i]++);
  return counts;
}

function isPurePower(g: Exponents, i: number): boolean {
  for (let j = 0; j < g.length; j++) if (j !== i && g[j] > 0) return false;
  return true;
}

/// N · ∏ (1 − t^{deg g}) for generators g coprime to each other and to the rest.
function coprimeProduct(gens: readonly Exponents[], weights: readonly number[], rest: bigint[]): bigint[] {
  let out = rest;
  for (const g of gens) out = tpolyMulOneMinusPower(out, monomialWeightedDegree(g, weights));
  return out;
}
