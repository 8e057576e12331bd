import { checkLimit, checkpoint, Ticker, type ComputeOptions } from "../options";
import { monoDiv } from "../monomial/monomial";
import { asTyped, type Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { Basis, BasisElt, Pair } from "./basis";
import { Geobucket } from "./geobucket";
import { pairBefore, updatePairs } from "./pairs";
import { addMultipleOfTail, makeMonic, reduceBucket, type Reduced } from "./reduce";
import { interreduce } from "./interreduce";

/// One reduction step: the remainders of a batch of pairs modulo the current basis.
/// `reducePairwise` handles one pair at a time; a matrix (F4) step may take many.
export type ReductionStep = <C>(
  R: RingCtx<C>,
  batch: Pair[],
  inputs: readonly Poly[],
  basis: Basis,
  opts: ComputeOptions | undefined,
  ticker: Ticker,
) => Reduced<C>[];

/// Pair-by-pair reduction of S-polynomials with geobuckets.
export const reducePairwise: ReductionStep = (R, batch, inputs, basis, opts, ticker) => {
  const out = [];
  for (const p of batch) {
    const bucket = new Geobucket(R);
    if (p.j < 0) {
      const f = asTyped(inputs[p.i]);
      bucket.add([...f.m], [...f.c] as never[]);
    } else {
      const ei = basis.elts[p.i], ej = basis.elts[p.j];
      addMultipleOfTail(R, bucket, ei.poly, R.K.one, monoDiv(p.lcm, ei.lm));
      addMultipleOfTail(R, bucket, ej.poly, R.K.neg(R.K.one), monoDiv(p.lcm, ej.lm));
    }
    const r = reduceBucket(R, bucket, basis.elts, basis.active, p.sugar, opts, ticker);
    if (r.m.length > 0) out.push(r);
  }
  return out;
};

/// How the main loop picks the next batch of pairs and reduces it.
export interface Strategy {
  /// Removes the next batch from the front of the sorted pair list.
  select(pairs: Pair[]): Pair[];
  reduce: ReductionStep;
}

export const pairwiseStrategy: Strategy = {
  select: (pairs) => pairs.splice(0, 1),
  reduce: reducePairwise,
};

/// Buchberger's algorithm with the Gebauer–Möller criteria and the sugar strategy; returns
/// the reduced Gröbner basis (monic, sorted by increasing leading monomial).
export function buchberger<C>(R: RingCtx<C>, gens: readonly Poly[], opts: ComputeOptions | undefined, strategy: Strategy = pairwiseStrategy): Poly[] {
  const inputs = gens.filter((f) => f.m.length > 0);
  const basis: Basis = { elts: [], active: [] };
  let pairs: Pair[] = inputs.map((f, i) => ({ i, j: -1, lcm: f.m[0], sugar: maxDegree(f) }));
  pairs.sort((a, b) => pairBefore(R.cmp, a, b));
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
      pairs = updatePairs(R.layout, R.cmp, basis, pairs, basis.elts.length - 1);
    }
  }
  return interreduce(R, basis.active.map((k) => basis.elts[k].poly), opts);
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
