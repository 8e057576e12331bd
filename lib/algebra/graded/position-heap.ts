/// The coordinates of a sparse vector still to visit, smallest first: a binary min-heap of
/// positions in [0, dim) in which each position is held at most once (common practice).
export class PositionHeap {
  private heap: Int32Array;
  private readonly held: Uint8Array;
  size = 0;

  constructor(dim: number) {
    this.heap = new Int32Array(Math.min(dim, 64) || 1);
    this.held = new Uint8Array(dim);
  }

  /// Adds position k unless it is already held.
  push(k: number): void {
    if (this.held[k]) return;
    this.held[k] = 1;
    if (this.size === this.heap.length) {
      const bigger = new Int32Array(this.heap.length * 2);
      bigger.set(this.heap);
      this.heap = bigger;
    }
    const h = this.heap;
    let i = this.size++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (h[parent] <= k) break;
      h[i] = h[parent];
      i = parent;
    }
    h[i] = k;
  }

  /// Removes and returns the smallest position held (the heap must not be empty).
  pop(): number {
    const h = this.heap;
    const top = h[0];
    this.held[top] = 0;
    const last = h[--this.size];
    let i = 0;
    const n = this.size;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && h[c + 1] < h[c]) c++;
      if (h[c] >= last) break;
      h[i] = h[c];
      i = c;
    }
    if (n > 0) h[i] = last;
    return top;
  }
}
