import type { Mono } from "../monomial/monomial";
import type { RingCtx } from "../poly/ring";

/// A geobucket: a sum of sorted term lists of geometrically growing lengths, so that adding
/// many short multiples to a long polynomial costs O(log) merges per term
/// (T. Yan, "The geobucket data structure for polynomials", J. Symbolic Comput. 1998).
interface Level<C> {
  m: Mono[];
  c: C[];
  start: number;
}

const BASE = 4;

export class Geobucket<C> {
  private readonly levels: Level<C>[] = [];
  /// Upper bound on the number of stored terms (before cancellation).
  size = 0;

  constructor(private readonly R: RingCtx<C>) {}

  /// Adds the terms s·m[i]·c[i]... already multiplied by the caller; m sorted decreasingly.
  add(m: Mono[], c: C[]): void {
    if (m.length === 0) return;
    this.size += m.length;
    let i = 0;
    let cap = BASE;
    while (cap < m.length) {
      cap *= BASE;
      i++;
    }
    let cur: Level<C> = { m, c, start: 0 };
    for (;;) {
      while (this.levels.length <= i) this.levels.push({ m: [], c: [], start: 0 });
      const lv = this.levels[i];
      const merged = lv.m.length - lv.start === 0 ? cur : this.merge(lv, cur);
      if (merged.m.length - merged.start <= cap) {
        this.levels[i] = merged;
        return;
      }
      this.levels[i] = { m: [], c: [], start: 0 };
      cur = merged;
      cap *= BASE;
      i++;
    }
  }

  private merge(a: Level<C>, b: Level<C>): Level<C> {
    const K = this.R.K,
      cmp = this.R.cmp;
    const m: Mono[] = [],
      c: C[] = [];
    let i = a.start,
      j = b.start;
    const na = a.m.length,
      nb = b.m.length;
    while (i < na && j < nb) {
      const d = cmp(a.m[i], b.m[j]);
      if (d > 0) {
        m.push(a.m[i]);
        c.push(a.c[i++]);
      } else if (d < 0) {
        m.push(b.m[j]);
        c.push(b.c[j++]);
      } else {
        const v = K.add(a.c[i], b.c[j]);
        if (!K.isZero(v)) {
          m.push(a.m[i]);
          c.push(v);
        }
        i++;
        j++;
      }
    }
    while (i < na) {
      m.push(a.m[i]);
      c.push(a.c[i++]);
    }
    while (j < nb) {
      m.push(b.m[j]);
      c.push(b.c[j++]);
    }
    return { m, c, start: 0 };
  }

  /// Removes and returns the leading term of the sum, or null when the sum is zero.
  popLead(): { m: Mono; c: C } | null {
    const K = this.R.K,
      cmp = this.R.cmp,
      levels = this.levels;
    for (;;) {
      let best = -1;
      let bestM: Mono | null = null;
      for (let i = 0; i < levels.length; i++) {
        const lv = levels[i];
        if (lv.start >= lv.m.length) continue;
        const h = lv.m[lv.start];
        if (bestM === null || cmp(h, bestM) > 0) {
          best = i;
          bestM = h;
        }
      }
      if (bestM === null) return null;
      let sum = levels[best].c[levels[best].start++];
      for (let i = best + 1; i < levels.length; i++) {
        const lv = levels[i];
        if (lv.start < lv.m.length && cmp(lv.m[lv.start], bestM) === 0) {
          sum = K.add(sum, lv.c[lv.start++]);
        }
      }
      if (!K.isZero(sum)) return { m: bestM, c: sum };
    }
  }
}
