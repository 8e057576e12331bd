import { checkpoint, Ticker, type ComputeOptions } from "../options";
import type { Poly } from "../poly/poly";
import { asTyped } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { BasisElt } from "./basis";
import { Geobucket } from "./geobucket";
import { makeMonic, reduceBucket } from "./reduce";
import { monoDivides } from "../monomial/monomial";

/// From a Gröbner basis, the reduced one: drop elements whose leading monomial another
/// divides, reduce every tail by the others, make monic, sort by increasing leading monomial.
export function interreduce<C>(R: RingCtx<C>, G: readonly Poly[], opts: ComputeOptions | undefined): Poly[] {
  const sorted = G.filter((g) => g.m.length > 0).sort((a, b) => R.cmp(a.m[0], b.m[0]));
  const minimal: Poly[] = [];
  for (const g of sorted) {
    if (!minimal.some((h) => monoDivides(h.m[0], g.m[0]))) minimal.push(g);
  }
  const elts: BasisElt[] = minimal.map((poly) => ({ poly, lm: poly.m[0], sugar: 0 }));
  const ticker = new Ticker(opts, () => ({ stage: "groebner", detail: "reducing the basis" }));
  const out: Poly[] = [];
  // Each tail is reduced by all other elements; finished elements replace their originals,
  // which keeps the later reductions short. Leading monomials never change.
  for (let k = 0; k < elts.length; k++) {
    checkpoint(opts, { stage: "groebner", detail: `reducing the basis (${k}/${elts.length})` });
    const g = asTyped<C>(elts[k].poly);
    const others = elts.map((_, i) => i).filter((i) => i !== k);
    const bucket = new Geobucket(R);
    bucket.add(g.m.slice(1), g.c.slice(1));
    const tail = reduceBucket(R, bucket, elts, others, 0, opts, ticker);
    const poly = makeMonic(R, [g.m[0], ...tail.m], [g.c[0], ...tail.c]);
    out.push(poly);
    elts[k] = { poly, lm: poly.m[0], sugar: 0 };
  }
  return out;
}
