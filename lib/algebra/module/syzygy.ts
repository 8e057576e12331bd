import { monoDiv, monoDivides, monoEq, monoLcm, monoMul, type Mono } from "../monomial/monomial";
import type { Ticker } from "../options";
import type { RingCtx } from "../poly/ring";
import { heapDivide, makeStream, type Divisors } from "./divide";
import { lexCompare } from "./groebner";
import type { ModuleOrder } from "./order";
import type { Vec } from "./vector";

/// The leading term m·e_i of a syzygy τ of a Gröbner basis, with j the partner of the pair.
export interface FrameTerm {
  readonly i: number;
  readonly j: number;
  readonly mono: Mono;
}

/// Orders a Gröbner basis so that elements with leading terms on the same basis element
/// come in lexicographically decreasing order of their leading monomials; then the Schreyer
/// resolution ends after at most n steps (Eisenbud, Cor. 15.11). Returns the permutation.
export function schreyerSort<C>(gens: readonly Vec<C>[]): number[] {
  const idx = gens.map((_, k) => k);
  idx.sort((a, b) => gens[a].comp[0] - gens[b].comp[0] || lexCompare(gens[b].mono[0], gens[a].mono[0]) || a - b);
  return idx;
}

/// The leading terms of a Gröbner basis of the syzygies of g_1..g_s under the Schreyer
/// order: for each i the minimal generators of (lcm(in g_i, in g_j)/in g_i : j > i, same
/// basis element) (Schreyer's theorem; Eisenbud, Thm. 15.10), sorted as in schreyerSort.
export function schreyerFrame<C>(R: RingCtx<C>, gens: readonly Vec<C>[]): FrameTerm[] {
  const out: FrameTerm[] = [];
  const byComp = new Map<number, number[]>();
  gens.forEach((g, l) => {
    const list = byComp.get(g.comp[0]);
    if (list) list.push(l);
    else byComp.set(g.comp[0], [l]);
  });
  for (let i = 0; i < gens.length; i++) {
    const ui = gens[i].mono[0];
    const cands: FrameTerm[] = [];
    for (const j of byComp.get(gens[i].comp[0]) as number[]) {
      if (j <= i) continue;
      cands.push({ i, j, mono: monoDiv(monoLcm(R.layout, ui, gens[j].mono[0]), ui) });
    }
    const minimal = cands.filter((t, x) =>
      cands.every((s, y) => y === x || !monoDivides(s.mono, t.mono) || (monoEq(s.mono, t.mono) && y > x)),
    );
    minimal.sort((a, b) => lexCompare(b.mono, a.mono));
    out.push(...minimal);
  }
  return out;
}

/// The syzygy with leading term m·e_i: m·e_i − m'·e_j minus the quotients of dividing
/// m·g_i − m'·g_j by the Gröbner basis g (monic), as a vector sorted in the Schreyer order
/// `next` (so that its comparison monomials are those of `next`).
export function schreyerSyzygy<C>(
  R: RingCtx<C>,
  O: ModuleOrder,
  gens: readonly Vec<C>[],
  D: Divisors<C>,
  next: ModuleOrder,
  t: FrameTerm,
  ticker: Ticker,
  maxTerms: number,
): Vec<C> {
  const K = R.K;
  const gi = gens[t.i],
    gj = gens[t.j];
  const lcm = monoLcm(R.layout, gi.tot[0], gj.tot[0]);
  const mj = monoDiv(lcm, gj.tot[0]);
  const minusOne = K.neg(K.one);
  const streams = [makeStream(t.mono, K.one, gi, 1), makeStream(mj, minusOne, gj, 1)];
  const { quotient } = heapDivide(R, O, streams, D, false, ticker, maxTerms);
  const mono: Mono[] = [t.mono, mj],
    comp: number[] = [t.i, t.j],
    coef: C[] = [K.one, minusOne];
  for (const q of quotient) {
    mono.push(q.mono);
    comp.push(q.index);
    coef.push(K.neg(q.coef));
  }
  return { mono, comp, coef, tot: mono.map((m, k) => monoMul(m, next.T[comp[k]])) };
}
