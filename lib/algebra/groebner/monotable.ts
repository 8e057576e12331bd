import { HEAD, type Mono } from "../monomial/monomial";
import type { OrderSpec } from "../order/order";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// The monomials of one F4 step, each stored once in one flat Int32Array (the packed layout
/// of monomial.ts, `stride` entries per monomial) and found again by a hash that is linear
/// in the exponents, so the hash of a product t·m is the sum of the hashes and a product is
/// looked up before it is built (common practice in matrix-based Gröbner basis codes; hash
/// tables of monomials for building F4 matrices are discussed by B. H. Roune, M. Stillman,
/// "Practical Gröbner basis computation", ISSAC 2012 — from memory). Nothing is allocated
/// per monomial.
export class MonoTable {
  readonly stride: number;
  /// Packed monomials: id k occupies [k·stride, (k+1)·stride).
  exps: Int32Array;
  size = 0;
  private hashes: Int32Array;
  /// Open addressing, at most half full: slot s holds an id at 2s (−1: empty) and its hash at 2s + 1.
  private slots: Int32Array;
  private readonly weights: Int32Array;

  constructor(n: number, capacity = 1 << 12) {
    this.stride = H + n;
    this.exps = new Int32Array(capacity * this.stride);
    this.hashes = new Int32Array(capacity);
    this.slots = new Int32Array(capacity * 4).fill(-1);
    this.weights = new Int32Array(n);
    let s = 0x9e3779b9 | 0;
    for (let i = 0; i < n; i++) {
      s = (Math.imul(s ^ (s >>> 15), 0x85ebca6b) + 0x632be5ab) | 0;
      this.weights[i] = s | 1;
    }
  }

  hash(m: Mono): number {
    let h = 0;
    const w = this.weights;
    for (let i = H, len = m.length; i < len; i++) if (m[i] !== 0) h = (h + Math.imul(w[i - H], m[i])) | 0;
    return h;
  }

  /// The id of t·m (hash(t·m) = ht + hm), inserting it when new; m is the monomial at
  /// offset `mo` of the packed array M (the layout of monomial.ts, `stride` entries each).
  /// A slot holds the id and the hash, so a probe reads the monomial only on a hash match.
  productId(t: Mono, ht: number, M: Int32Array, mo: number, hm: number): number {
    const h = (ht + hm) | 0;
    const slots = this.slots,
      E = this.exps,
      S = this.stride;
    const mask = (slots.length >> 1) - 1;
    let s = (h ^ (h >>> 16)) & mask;
    for (;;) {
      const id = slots[2 * s];
      if (id < 0) break;
      if (slots[2 * s + 1] === h) {
        let same = true;
        for (let i = H, o = id * S; i < S; i++) {
          if (E[o + i] !== t[i] + M[mo + i]) {
            same = false;
            break;
          }
        }
        if (same) return id;
      }
      s = (s + 1) & mask;
    }
    const id = this.size++;
    if (id === this.hashes.length) this.growStore();
    const F = this.exps,
      o = id * S;
    F[o] = t[0] + M[mo];
    F[o + 1] = t[1] + M[mo + 1];
    F[o + 2] = t[2] | M[mo + 2];
    for (let i = H; i < S; i++) F[o + i] = t[i] + M[mo + i];
    this.hashes[id] = h;
    slots[2 * s] = id;
    slots[2 * s + 1] = h;
    if (this.size * 4 > slots.length) this.growSlots();
    return id;
  }

  /// A fresh copy of monomial id.
  mono(id: number): Mono {
    return this.exps.slice(id * this.stride, (id + 1) * this.stride);
  }

  /// The comparison of the ring's monomial order on ids (positive when a > b); the same
  /// order as order.ts, read from the flat store.
  comparator(order: OrderSpec): (a: number, b: number) => number {
    const S = this.stride;
    const revTail = (E: Int32Array, oa: number, ob: number) => {
      for (let i = S - 1; i >= H; i--) {
        const d = E[ob + i] - E[oa + i];
        if (d !== 0) return d;
      }
      return 0;
    };
    const lexTail = (E: Int32Array, oa: number, ob: number) => {
      for (let i = H; i < S; i++) {
        const d = E[oa + i] - E[ob + i];
        if (d !== 0) return d;
      }
      return 0;
    };
    switch (order.kind) {
      case "grevlex":
        return (a, b) => {
          const E = this.exps,
            oa = a * S,
            ob = b * S;
          return E[oa] - E[ob] || revTail(E, oa, ob);
        };
      case "glex":
      case "lex":
        return (a, b) => {
          const E = this.exps,
            oa = a * S,
            ob = b * S;
          return E[oa] - E[ob] || lexTail(E, oa, ob);
        };
      case "weights":
        return (a, b) => {
          const E = this.exps,
            oa = a * S,
            ob = b * S;
          return E[oa] - E[ob] || E[oa + 1] - E[ob + 1] || revTail(E, oa, ob);
        };
    }
  }

  private growStore(): void {
    const cap = this.hashes.length * 2;
    const exps = new Int32Array(cap * this.stride);
    exps.set(this.exps);
    this.exps = exps;
    const hashes = new Int32Array(cap);
    hashes.set(this.hashes);
    this.hashes = hashes;
  }

  private growSlots(): void {
    const slots = new Int32Array(this.slots.length * 2).fill(-1);
    const mask = (slots.length >> 1) - 1;
    for (let id = 0; id < this.size; id++) {
      const h = this.hashes[id];
      let s = (h ^ (h >>> 16)) & mask;
      while (slots[2 * s] >= 0) s = (s + 1) & mask;
      slots[2 * s] = id;
      slots[2 * s + 1] = h;
    }
    this.slots = slots;
  }
}
