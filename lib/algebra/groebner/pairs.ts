import { finishMono, HEAD, monoCoprime, monoDivides, type Mono, type MonoLayout } from "../monomial/monomial";
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
  // The lcms are built in one flat array (exponents, with their degree and mask — the header
  // slots of monomial.ts, as finishMono computes them — beside them in typed arrays), so the
  // quadratic search rejects most candidates on two numbers (the tests of monoDivides, in
  // its order) and only the lcms of kept pairs become monomials.
  const n = active.length,
    nv = L.n,
    degrees = L.degrees;
  const ex = new Int32Array(n * nv);
  const degs = new Int32Array(n),
    masks = new Int32Array(n),
    coprime = new Uint8Array(n);
  for (let k = 0; k < n; k++) {
    const lm = elts[active[k]].lm;
    let deg = 0,
      mask = 0;
    for (let i = 0, o = k * nv; i < nv; i++) {
      const a = lmh[H + i],
        b = lm[H + i];
      const e = a > b ? a : b;
      ex[o + i] = e;
      if (e !== 0) {
        deg += e * degrees[i];
        mask |= 1 << (i & 31);
      }
    }
    degs[k] = deg;
    masks[k] = mask;
    coprime[k] = monoCoprime(lmh, lm) ? 1 : 0;
  }
  const divides = (q: number, k: number) => {
    if ((masks[q] & ~masks[k]) !== 0 || degs[q] > degs[k]) return false;
    for (let i = 0, oq = q * nv, ok = k * nv; i < nv; i++) if (ex[oq + i] > ex[ok + i]) return false;
    return true;
  };
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
    const l = new Int32Array(H + nv);
    l.set(ex.subarray(k * nv, (k + 1) * nv), H);
    finishMono(L, l);
    const g = active[k],
      eg = elts[g];
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
