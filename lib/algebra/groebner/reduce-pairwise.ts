import { monoDiv } from "../monomial/monomial";
import { asTyped } from "../poly/poly";
import type { ReductionStep } from "./basis";
import { Geobucket } from "./geobucket";
import { addMultipleOfTail, reduceBucket } from "./reduce";

/// Pair-by-pair reduction of S-polynomials with geobuckets.
export const reducePairwise: ReductionStep = (R, batch, inputs, basis, opts, ticker) => {
  const out = [];
  for (const p of batch) {
    const bucket = new Geobucket(R);
    if (p.j < 0) {
      const f = asTyped(inputs[p.i]);
      bucket.add([...f.m], [...f.c] as never[]);
    } else {
      const ei = basis.elts[p.i],
        ej = basis.elts[p.j];
      addMultipleOfTail(R, bucket, ei.poly, R.K.one, monoDiv(p.lcm, ei.lm));
      addMultipleOfTail(R, bucket, ej.poly, R.K.neg(R.K.one), monoDiv(p.lcm, ej.lm));
    }
    const r = reduceBucket(R, bucket, basis.elts, basis.active, p.sugar, opts, ticker);
    if (r.m.length > 0) out.push(r);
  }
  return out;
};
