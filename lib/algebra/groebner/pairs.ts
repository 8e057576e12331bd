import { HEAD, monoCoprime, monoDivides, monoLcm, type Mono, type MonoLayout } from "../monomial/monomial";
import type { MonoCompare } from "../order/order";
import type { Basis, Pair } from "./basis";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// How pairs are queued: the sugar strategy (smaller sugar first, then smaller lcm), or the
/// normal strategy (smaller lcm first; B. Buchberger 1985), which does better in orders that
/// do not compare degrees first, where sugar says little about the work.
export interface PairOrder {
  readonly cmp: MonoCompare;
  readonly bySugar: boolean;
}

export function pairBefore(o: PairOrder, a: Pair, b: Pair): number {
  if (o.bySugar && a.sugar !== b.sugar) return a.sugar - b.sugar;
  return o.cmp(a.lcm, b.lcm);
}

/// Whether every exponent of a is at most that of b.
function exponentsDivide(a: Mono, b: Mono): boolean {
  for (let i = H, len = a.length; i < len; i++) if (a[i] > b[i]) return false;
  return true;
}

function lcmEquals(a: Mono, b: Mono, l: Mono): boolean {
  for (let k = H, len = l.length; k < len; k++) if ((a[k] > b[k] ? a[k] : b[k]) !== l[k]) return false;
  return true;
}

/// Sugar of the S-polynomial of elements with leading monomials lmi, lmj.
function pairSugar(lcm: Mono, lmi: Mono, si: number, lmj: Mono, sj: number): number {
  const a = si + lcm[1] - lmi[1],
    b = sj + lcm[1] - lmj[1];
  return a > b ? a : b;
}

/// Adds element h to the basis and updates the pair list by the Gebauer–Möller criteria
/// (R. Gebauer, H. M. Möller, "On an installation of Buchberger's algorithm",
/// J. Symbolic Comput. 1988; in the form of T. Becker, V. Weispfenning, "Gröbner Bases",
/// Springer 1993, procedure UPDATE). `pairs` stays sorted by pairBefore.
export function updatePairs(L: MonoLayout, order: PairOrder, basis: Basis, pairs: Pair[], h: number): Pair[] {
  const { elts, active } = basis;
  const eh = elts[h];
  const lmh = eh.lm;
  // New pairs (h, g) with their lcms; keep those not made redundant by another new pair.
  // The degrees and masks of the lcms sit in typed arrays, so the quadratic search rejects
  // most candidates without reading an lcm (the same tests as monoDivides, in its order).
  const n = active.length;
  const lcms: Mono[] = new Array(n);
  const degs = new Int32Array(n),
    masks = new Int32Array(n),
    coprime = new Uint8Array(n);
  for (let k = 0; k < n; k++) {
    const lm = elts[active[k]].lm;
    const l = monoLcm(L, lmh, lm);
    lcms[k] = l;
    degs[k] = l[1];
    masks[k] = l[2];
    coprime[k] = monoCoprime(lmh, lm) ? 1 : 0;
  }
  const divides = (q: number, k: number) => degs[q] <= degs[k] && (masks[q] & ~masks[k]) === 0 && exponentsDivide(lcms[q], lcms[k]);
  const kept: number[] = [];
  for (let k = 0; k < n; k++) {
    if (!coprime[k]) {
      let redundant = false;
      for (let q = k + 1; q < n && !redundant; q++) redundant = divides(q, k);
      for (let q = 0; q < kept.length && !redundant; q++) redundant = divides(kept[q], k);
      if (redundant) continue;
    }
    kept.push(k);
  }
  // Old pairs whose lcm is a proper multiple of lm(h) in the chain sense are redundant.
  const survivors = pairs.filter(
    (p) => p.j < 0 || !monoDivides(lmh, p.lcm) || lcmEquals(elts[p.i].lm, lmh, p.lcm) || lcmEquals(elts[p.j].lm, lmh, p.lcm),
  );
  const fresh: Pair[] = [];
  for (const k of kept) {
    if (coprime[k]) continue; // Buchberger's product criterion
    const g = active[k],
      eg = elts[g],
      l = lcms[k];
    fresh.push({ i: g, j: h, lcm: l, sugar: pairSugar(l, eg.lm, eg.sugar, lmh, eh.sugar) });
  }
  fresh.sort((a, b) => pairBefore(order, a, b));
  // Basis elements whose leading monomial lm(h) divides are no longer needed as reducers.
  const stillActive = active.filter((g) => !monoDivides(lmh, elts[g].lm));
  stillActive.push(h);
  basis.active.length = 0;
  basis.active.push(...stillActive);
  return mergeSorted(order, survivors, fresh);
}

function mergeSorted(order: PairOrder, a: Pair[], b: Pair[]): Pair[] {
  if (b.length === 0) return a;
  const out: Pair[] = new Array(a.length + b.length);
  let i = 0,
    j = 0,
    k = 0;
  while (i < a.length && j < b.length) out[k++] = pairBefore(order, a[i], b[j]) <= 0 ? a[i++] : b[j++];
  while (i < a.length) out[k++] = a[i++];
  while (j < b.length) out[k++] = b[j++];
  return out;
}
