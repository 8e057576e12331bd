import { checkLimit, Ticker, type ComputeOptions } from "../options";
import { monoDiv, monoMul, type Mono } from "../monomial/monomial";
import { asTyped, makePoly, type Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { BasisElt, Reduced } from "./basis";
import { Geobucket } from "./geobucket";

/// A reducer: among the given elements, one whose leading monomial divides m (shortest first).
/// The mask and degree tests are inlined: this is the hottest search of the engine.
export function findReducer(elts: readonly BasisElt[], ids: readonly number[], m: Mono): number {
  let best = -1,
    bestLen = Infinity;
  const mask = m[2],
    deg = m[1],
    len = m.length;
  outer: for (let k = 0; k < ids.length; k++) {
    const e = elts[ids[k]];
    const lm = e.lm;
    if ((lm[2] & ~mask) !== 0 || lm[1] > deg || e.poly.m.length >= bestLen) continue;
    for (let i = 3; i < len; i++) if (lm[i] > m[i]) continue outer;
    best = ids[k];
    bestLen = e.poly.m.length;
  }
  return best;
}

/// Adds s·t·tail(g) to the bucket, where tail(g) omits g's leading term.
export function addMultipleOfTail<C>(R: RingCtx<C>, B: Geobucket<C>, g: Poly, s: C, t: Mono): void {
  const G = asTyped<C>(g),
    K = R.K;
  const len = G.m.length;
  if (len <= 1) return;
  const m: Mono[] = new Array(len - 1),
    c: C[] = new Array(len - 1);
  for (let k = 1; k < len; k++) {
    m[k - 1] = monoMul(G.m[k], t);
    c[k - 1] = K.mul(s, G.c[k]);
  }
  B.add(m, c);
}

/// Full reduction of the sum held in `bucket` by the elements `ids` (monic reducers).
/// Returns the remainder (not normalised) and the sugar grown by the reductions.
export function reduceBucket<C>(
  R: RingCtx<C>,
  bucket: Geobucket<C>,
  elts: readonly BasisElt[],
  ids: readonly number[],
  sugar: number,
  opts: ComputeOptions | undefined,
  ticker: Ticker,
): Reduced<C> {
  const K = R.K;
  const m: Mono[] = [],
    c: C[] = [];
  for (;;) {
    ticker.tick();
    const lt = bucket.popLead();
    if (!lt) break;
    const r = findReducer(elts, ids, lt.m);
    if (r < 0) {
      m.push(lt.m);
      c.push(lt.c);
      continue;
    }
    const g = elts[r];
    const t = monoDiv(lt.m, g.lm);
    const gs = t[1] + g.sugar;
    if (gs > sugar) sugar = gs;
    addMultipleOfTail(R, bucket, g.poly, K.neg(lt.c), t);
    checkLimit(opts, "maxTerms", bucket.size, "an intermediate polynomial's number of terms");
  }
  return { m, c, sugar };
}

/// The monic multiple of a non-zero polynomial.
export function makeMonic<C>(R: RingCtx<C>, m: Mono[], c: C[]): Poly {
  const K = R.K;
  const inv = K.inv(c[0]);
  if (K.isOne(inv)) return makePoly(m, c);
  return makePoly(
    m,
    c.map((x) => K.mul(inv, x)),
  );
}
