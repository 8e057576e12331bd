import { HEAD, monoDiv, monoDivides, monoLcm, monoMul, type Mono } from "../../monomial/monomial";
import { binaryHeap } from "../../module/heap";
import { internalLimit } from "../../module/limits";
import type { ModuleOrder } from "../../module/order";
import type { FrameTerm } from "../../module/syzygy";
import type { Vec } from "../../module/vector";
import type { Ticker } from "../../options";
import type { RingCtx } from "../../poly/ring";

/// Largest integer a double holds exactly.
const EXACT = 2 ** 53;

/// Term keys of the monomials of one level as exact integers (degree, hi, lo): grevlex
/// compares degrees first, and for terms of one degree a > b exactly when the last exponent
/// where they differ is smaller in a (common practice), so reading the exponents as digits
/// base B from the last variable down gives a number that is smaller exactly when the
/// monomial is larger. With B above every exponent the digits never carry: the key of a
/// product is the sum of the keys, and a stream of the division advances by three additions
/// where the packed monomial needs a product of n + 3 slots and a comparison loop.
interface Digits {
  /// The exponent of variable i is the digit at weight[i] of hi (i ≥ split) or of lo.
  readonly weight: Float64Array;
  readonly split: number;
}

function digitsFor(n: number, base: number): Digits | null {
  const high = Math.ceil(n / 2);
  if (base ** high >= EXACT) return null;
  const weight = new Float64Array(n);
  const split = n - high;
  // the last variable is the most significant digit of hi, variable split − 1 that of lo
  let w = 1;
  for (let i = split; i < n; i++, w *= base) weight[i] = w;
  w = 1;
  for (let i = 0; i < split; i++, w *= base) weight[i] = w;
  return { weight, split };
}

function keyHi(D: Digits, m: Mono): number {
  let s = 0;
  for (let i = D.split, n = D.weight.length; i < n; i++) s += m[HEAD + i] * D.weight[i];
  return s;
}

function keyLo(D: Digits, m: Mono): number {
  let s = 0;
  for (let i = 0; i < D.split; i++) s += m[HEAD + i] * D.weight[i];
  return s;
}

/// dst = a·b in the packed layout (monomial.ts: key and degree add, masks or).
function productInto(dst: Mono, a: Mono, b: Mono): Mono {
  dst[0] = a[0] + b[0];
  dst[1] = a[1] + b[1];
  dst[2] = a[2] | b[2];
  for (let i = HEAD, len = dst.length; i < len; i++) dst[i] = a[i] + b[i];
  return dst;
}

/// One summand s·t·v[pos..] of the dividend (or of a subtracted multiple of a divisor),
/// its current term's key (hi, lo) and basis element kept at hand for the heap.
interface Stream<C> {
  readonly t: Mono;
  readonly s: C;
  /// index of v in the level's vectors
  readonly l: number;
  readonly tdg: number;
  readonly thi: number;
  readonly tlo: number;
  pos: number;
  /// the degree (grevlex's first comparison) and the digit keys of the current term
  dg: number;
  hi: number;
  lo: number;
  comp: number;
}

/// The division of the Schreyer frame (schreyerSyzygy of module/syzygy.ts) for one level,
/// when the ring is ordered by grevlex and the module order has one position: the same terms, the
/// same divisor for each term (the shortest, the first among equals), the same quotients in
/// the same order — only the comparisons are on exact integer keys, the packed monomial of
/// a term is formed only when it survives cancellation (in the Plücker ideal of G(2,7) 9 in
/// 10 terms cancel), and the divisors of each basis element are searched shortest first.
/// `frameDivider` returns null when these conditions fail; then the general division runs.
export interface FrameDivider<C> {
  syzygy(t: FrameTerm, next: ModuleOrder, ticker: Ticker, maxTerms: number): Vec<C>;
}

export function frameDivider<C>(
  R: RingCtx<C>,
  O: ModuleOrder,
  gens: readonly Vec<C>[],
  kept: readonly FrameTerm[],
): FrameDivider<C> | null {
  if (R.ring.order.kind !== "grevlex" || gens.length === 0) return null;
  for (let a = 1; a < O.pos.length; a++) if (O.pos[a] !== O.pos[0]) return null;
  // grevlex compares degrees first, so a vector's first term has its largest degree and
  // the degree of a division's first term bounds every exponent met in it
  let top = 0;
  for (const t of kept) top = Math.max(top, t.mono[0] + gens[t.i].tot[0][0]);
  const D = digitsFor(R.n, top + 1);
  if (!D) return null;
  // Keys of every term of the level's vectors (those of degree > top are never used: a
  // divisor of a term has at most its degree).
  const dgs = gens.map((v) => Int32Array.from(v.tot, (m) => m[0]));
  const his = gens.map((v) => Float64Array.from(v.tot, (m) => keyHi(D, m)));
  const los = gens.map((v) => Float64Array.from(v.tot, (m) => keyLo(D, m)));
  const byComp = new Map<number, number[]>();
  gens.forEach((v, l) => {
    const list = byComp.get(v.comp[0]);
    if (list) list.push(l);
    else byComp.set(v.comp[0], [l]);
  });
  // shortest first, stable: the first that divides is the one the general division picks
  for (const list of byComp.values()) list.sort((a, b) => gens[a].mono.length - gens[b].mono.length || a - b);
  const rank = O.rank;
  const K = R.K;
  // the packed monomial of the current term, only read before the next one
  const scratch = new Int32Array(HEAD + R.n);

  // degree first (larger is bigger), then the digits (smaller is bigger), then the rank
  const before = (x: Stream<C>, y: Stream<C>): boolean =>
    x.dg > y.dg || (x.dg === y.dg && (x.hi < y.hi || (x.hi === y.hi && (x.lo < y.lo || (x.lo === y.lo && rank[x.comp] > rank[y.comp])))));

  function stream(t: Mono, tdg: number, thi: number, tlo: number, s: C, l: number): Stream<C> {
    return { t, s, l, tdg, thi, tlo, pos: 1, dg: tdg + dgs[l][1], hi: thi + his[l][1], lo: tlo + los[l][1], comp: gens[l].comp[1] };
  }

  function divisor(m: Mono, comp: number): number {
    const list = byComp.get(comp);
    if (list) for (const l of list) if (monoDivides(gens[l].tot[0], m)) return l;
    return -1;
  }

  return {
    syzygy(t, next, ticker, maxTerms) {
      const { items: heap, push, pop } = binaryHeap<Stream<C>>(before);
      const advance = (st: Stream<C>) => {
        const v = gens[st.l];
        if (++st.pos < v.mono.length) {
          st.dg = st.tdg + dgs[st.l][st.pos];
          st.hi = st.thi + his[st.l][st.pos];
          st.lo = st.tlo + los[st.l][st.pos];
          st.comp = v.comp[st.pos];
          push(st);
        }
      };

      const gi = gens[t.i],
        gj = gens[t.j];
      // m·e_i − m'·e_j with m·in(g_i) = m'·in(g_j): the leads cancel, the tails are divided
      const mj = monoDiv(monoLcm(R.layout, gi.tot[0], gj.tot[0]), gj.tot[0]);
      const minusOne = K.neg(K.one);
      if (gi.mono.length > 1) push(stream(t.mono, t.mono[0], keyHi(D, t.mono), keyLo(D, t.mono), K.one, t.i));
      if (gj.mono.length > 1) push(stream(mj, mj[0], keyHi(D, mj), keyLo(D, mj), minusOne, t.j));
      const mono: Mono[] = [t.mono, mj],
        comp: number[] = [t.i, t.j],
        coef: C[] = [K.one, minusOne];
      while (heap.length > 0) {
        ticker.tick();
        const first = pop();
        const { dg, hi, lo, comp: c0, t: ft, pos: fpos } = first;
        const fv = gens[first.l];
        let c = K.mul(first.s, fv.coef[fpos]);
        advance(first);
        while (heap.length > 0) {
          const h = heap[0];
          if (h.comp !== c0 || h.hi !== hi || h.lo !== lo || h.dg !== dg) break;
          pop();
          c = K.add(c, K.mul(h.s, gens[h.l].coef[h.pos]));
          advance(h);
        }
        if (K.isZero(c)) continue;
        const m = productInto(scratch, ft, fv.tot[fpos]);
        const l = divisor(m, c0);
        if (l < 0) throw new Error("frame division: a term of the dividend has no divisor; the level is not a Gröbner basis");
        const g = gens[l];
        const q = monoDiv(m, g.tot[0]);
        mono.push(q);
        comp.push(l);
        coef.push(K.neg(c));
        if (mono.length - 2 > maxTerms) throw internalLimit(mono.length - 2, maxTerms);
        if (g.mono.length > 1) push(stream(q, dg - dgs[l][0], hi - his[l][0], lo - los[l][0], K.neg(c), l));
      }
      return { mono, comp, coef, tot: mono.map((m, k) => monoMul(m, next.T[comp[k]])) };
    },
  };
}
