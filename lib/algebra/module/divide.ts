import { internalLimit } from "./limits";
import { binaryHeap } from "./heap";
import {
  monoDiv as monoDivImported,
  monoDivides as monoDividesImported,
  monoMul as monoMulImported,
  type Mono,
} from "../monomial/monomial";
import type { Ticker } from "../options";
import type { RingCtx } from "../poly/ring";
import { compareKeys, type ModuleOrder } from "./order";
import type { Vec } from "./vector";

// Bound once: transpiled module imports are property reads on every call in the hot loop.
const monoMul = monoMulImported,
  monoDiv = monoDivImported,
  monoDivides = monoDividesImported;

/// The sum s·t·v[pos..] of the terms of v from position pos on, multiplied by the term s·t.
export interface Stream<C> {
  readonly t: Mono;
  readonly s: C;
  readonly v: Vec<C>;
  pos: number;
  key: Mono;
}

/// Monic divisors, indexed by the basis element of their leading term.
export interface Divisors<C> {
  readonly vecs: readonly Vec<C>[];
  readonly byComp: ReadonlyMap<number, readonly number[]>;
}

export function divisorsOf<C>(vecs: readonly Vec<C>[]): Divisors<C> {
  const byComp = new Map<number, number[]>();
  vecs.forEach((v, l) => {
    const a = v.comp[0];
    const list = byComp.get(a);
    if (list) list.push(l);
    else byComp.set(a, [l]);
  });
  return { vecs, byComp };
}

export function makeStream<C>(t: Mono, s: C, v: Vec<C>, pos: number): Stream<C> {
  return { t, s, v, pos, key: pos < v.tot.length ? monoMul(t, v.tot[pos]) : t.slice() };
}

/// dst = a·b in the packed layout (monomial.ts: key and degree add, masks or).
function mulInto(dst: Mono, a: Mono, b: Mono): void {
  dst[0] = a[0] + b[0];
  dst[1] = a[1] + b[1];
  dst[2] = a[2] | b[2];
  for (let i = 3, len = dst.length; i < len; i++) dst[i] = a[i] + b[i];
}

/// One term of a quotient (coef·mono·e_index) or of a remainder (coef·tot at comp).
export interface QuotientTerm<C> {
  readonly mono: Mono;
  readonly index: number;
  readonly coef: C;
}
export interface RemainderTerm<C> {
  readonly tot: Mono;
  readonly comp: number;
  readonly coef: C;
}

export interface Division<C> {
  readonly quotient: QuotientTerm<C>[];
  readonly remainder: RemainderTerm<C>[];
}

/// Divides the sum of the streams by the divisors, term by term from the top, keeping the
/// pending products in a heap instead of expanding them (M. Monagan, R. Pearce, "Polynomial
/// division using dynamic arrays, heaps, and packed exponent vectors", CASC 2007).
/// With `keepRemainder` false every term must be divisible (the dividend lies in a module
/// of which the divisors are a Gröbner basis); otherwise undivisible terms form the remainder.
export function heapDivide<C>(
  R: RingCtx<C>,
  O: ModuleOrder,
  streams: Stream<C>[],
  D: Divisors<C>,
  keepRemainder: boolean,
  ticker: Ticker,
  maxTerms: number,
): Division<C> {
  const K = R.K,
    cmp = R.cmp;
  const before = (x: Stream<C>, y: Stream<C>) => compareKeys(cmp, O, x.key, x.v.comp[x.pos], y.key, y.v.comp[y.pos]) > 0;
  const { items: heap, push, pop } = binaryHeap<Stream<C>>(before);
  // A stream's key is its own array, rewritten in place as the stream advances (one packed
  // monomial per pending term was most of the allocation of a resolution); the current
  // term's key is copied into `key` first, since it outlives the advance.
  const advance = (st: Stream<C>) => {
    st.pos++;
    if (st.pos < st.v.mono.length) {
      mulInto(st.key, st.t, st.v.tot[st.pos]);
      push(st);
    }
  };
  for (const st of streams) if (st.pos < st.v.mono.length) push(st);
  const quotient: QuotientTerm<C>[] = [];
  const remainder: RemainderTerm<C>[] = [];
  let key: Mono = new Int32Array(0);
  while (heap.length > 0) {
    ticker.tick();
    const first = pop();
    const comp = first.v.comp[first.pos];
    if (key.length !== first.key.length) key = new Int32Array(first.key.length);
    key.set(first.key);
    let c = K.mul(first.s, first.v.coef[first.pos]);
    advance(first);
    while (heap.length > 0) {
      const h = heap[0];
      if (h.v.comp[h.pos] !== comp || cmp(h.key, key) !== 0) break;
      pop();
      c = K.add(c, K.mul(h.s, h.v.coef[h.pos]));
      advance(h);
    }
    if (K.isZero(c)) continue;
    const l = findDivisor(D, key, comp);
    if (l < 0) {
      if (!keepRemainder) throw new Error("heapDivide: a term of the dividend has no divisor; the divisors are not a Gröbner basis");
      remainder.push({ tot: key.slice(), comp, coef: c });
      continue;
    }
    const g = D.vecs[l];
    const q = monoDiv(key, g.tot[0]);
    quotient.push({ mono: q, index: l, coef: c });
    if (quotient.length + remainder.length > maxTerms) throw internalLimit(quotient.length + remainder.length, maxTerms);
    if (g.mono.length > 1) push(makeStream(q, K.neg(c), g, 1));
  }
  return { quotient, remainder };
}

function findDivisor<C>(D: Divisors<C>, key: Mono, comp: number): number {
  const list = D.byComp.get(comp);
  if (!list) return -1;
  let best = -1,
    bestLen = Infinity;
  for (const l of list) {
    const v = D.vecs[l];
    if (v.mono.length < bestLen && monoDivides(v.tot[0], key)) {
      best = l;
      bestLen = v.mono.length;
    }
  }
  return best;
}
