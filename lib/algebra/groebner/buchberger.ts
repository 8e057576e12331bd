import { checkLimit, checkpoint, Ticker, type ComputeOptions } from "../options";
import type { Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { Basis, BasisElt, Pair, Strategy } from "./basis";
import { pairBefore, updatePairs } from "./pairs";
import { makeMonic } from "./reduce";
import { interreduce } from "./interreduce";
import { chooseStrategy } from "./strategy";

/// Buchberger's algorithm with the Gebauer–Möller criteria and the sugar strategy; returns
/// the reduced Gröbner basis (monic, sorted by increasing leading monomial).
export function buchberger<C>(
  R: RingCtx<C>,
  gens: readonly Poly[],
  opts: ComputeOptions | undefined,
  strategy: Strategy = chooseStrategy(R),
): Poly[] {
  const inputs = gens.filter((f) => f.m.length > 0);
  const basis: Basis = { elts: [], active: [] };
  let pairs: Pair[] = inputs.map((f, i) => ({ i, j: -1, lcm: f.m[0], sugar: maxDegree(f) }));
  const order = { cmp: R.cmp, bySugar: strategy.bySugar };
  pairs.sort((a, b) => pairBefore(order, a, b));
  let current = 0;
  const info = () => ({
    stage: "groebner",
    detail: `basis ${basis.active.length}, pairs ${pairs.length}, degree ${current}`,
  });
  const ticker = new Ticker(opts, info);
  while (pairs.length > 0) {
    checkpoint(opts, info);
    const batch = strategy.select(pairs);
    current = batch[0].sugar;
    checkLimit(opts, "maxDegree", current, "the degree of the S-polynomials");
    for (const r of strategy.reduce(R, batch, inputs, basis, opts, ticker)) {
      const poly = makeMonic(R, r.m, r.c);
      const elt: BasisElt = { poly, lm: poly.m[0], sugar: r.sugar };
      if (elt.lm[1] === 0 && isConstantMono(elt.lm)) return [poly];
      basis.elts.push(elt);
      checkLimit(opts, "maxBasisSize", basis.elts.length, "the number of basis elements");
      pairs = updatePairs(R.layout, order, basis, pairs, basis.elts.length - 1);
    }
  }
  const found = basis.active.map((k) => basis.elts[k].poly);
  if (strategy.finish && R.ring.field.kind === "gf") return strategy.finish(R as unknown as RingCtx<number>, found, opts);
  return interreduce(R, found, opts);
}

function isConstantMono(m: Int32Array): boolean {
  for (let i = 3; i < m.length; i++) if (m[i] !== 0) return false;
  return true;
}

export function maxDegree(f: Poly): number {
  let d = 0;
  for (const t of f.m) if (t[1] > d) d = t[1];
  return d;
}
