import { runtimeError } from "../errors";
import { Ticker, type ComputeOptions } from "../options";
import { asTyped, makePoly, type Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { BasisElt } from "./basis";
import { Geobucket } from "./geobucket";
import { makeMonic, reduceBucket } from "./reduce";

/// The remainder of f on full reduction by G (the normal form when G is a Gröbner basis).
export function normalFormCtx<C>(R: RingCtx<C>, f: Poly, G: readonly Poly[], opts?: ComputeOptions): Poly {
  if (!Array.isArray(G)) throw runtimeError("normalForm", "G must be a list of polynomials");
  const elts: BasisElt[] = [];
  for (const g of G) {
    if (g.m.length === 0) continue;
    const T = asTyped<C>(g);
    const poly = makeMonic(R, [...T.m], [...T.c]);
    elts.push({ poly, lm: poly.m[0], sugar: 0 });
  }
  const F = asTyped<C>(f);
  if (F.m.length === 0) return f;
  const bucket = new Geobucket(R);
  bucket.add([...F.m], [...F.c]);
  const ids = elts.map((_, i) => i);
  const ticker = new Ticker(opts, () => ({ stage: "normal form" }));
  const r = reduceBucket(R, bucket, elts, ids, 0, opts, ticker);
  return makePoly(r.m, r.c);
}
