import { HEAD, type Mono } from "../monomial/monomial";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// A hash table of monomials with a hash that is linear in the exponents, so the hash of a
/// product t·m is the sum of the hashes and products can be looked up before they are
/// allocated (common practice in matrix-based Gröbner basis codes).
export class MonoTable {
  readonly monos: Mono[] = [];
  private readonly hashes: number[] = [];
  private slots: Int32Array;
  private readonly weights: Int32Array;

  constructor(n: number, capacity = 1 << 12) {
    this.slots = new Int32Array(capacity).fill(-1);
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

  /// The id of t·m (hash(t·m) = ht + hm), inserting it when new.
  productId(t: Mono, ht: number, m: Mono, hm: number): number {
    const h = (ht + hm) | 0;
    const mask = this.slots.length - 1;
    let s = (h ^ (h >>> 16)) & mask;
    for (;;) {
      const id = this.slots[s];
      if (id < 0) break;
      if (this.hashes[id] === h && this.isProduct(this.monos[id], t, m)) return id;
      s = (s + 1) & mask;
    }
    const len = m.length;
    const r = new Int32Array(len);
    r[0] = t[0] + m[0];
    r[1] = t[1] + m[1];
    r[2] = t[2] | m[2];
    for (let i = H; i < len; i++) r[i] = t[i] + m[i];
    const id = this.monos.length;
    this.monos.push(r);
    this.hashes.push(h);
    this.slots[s] = id;
    if (this.monos.length * 2 > this.slots.length) this.grow();
    return id;
  }

  private isProduct(e: Mono, t: Mono, m: Mono): boolean {
    for (let i = H, len = e.length; i < len; i++) if (e[i] !== t[i] + m[i]) return false;
    return true;
  }

  private grow(): void {
    const slots = new Int32Array(this.slots.length * 2).fill(-1);
    const mask = slots.length - 1;
    for (let id = 0; id < this.monos.length; id++) {
      const h = this.hashes[id];
      let s = (h ^ (h >>> 16)) & mask;
      while (slots[s] >= 0) s = (s + 1) & mask;
      slots[s] = id;
    }
    this.slots = slots;
  }
}
