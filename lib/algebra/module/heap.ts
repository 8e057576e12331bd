/// A binary heap of pending streams (the heap division of divide.ts and of the Schreyer frame):
/// `items[0]` is the element no other comes `before`; push and pop restore that in
/// O(log n) comparisons (J. W. J. Williams, "Algorithm 232: Heapsort", CACM 7, 1964).
export function binaryHeap<T>(before: (a: T, b: T) => boolean): { items: T[]; push: (x: T) => void; pop: () => T } {
  const items: T[] = [];
  const push = (x: T) => {
    let i = items.length;
    items.push(x);
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!before(x, items[p])) break;
      items[i] = items[p];
      i = p;
    }
    items[i] = x;
  };
  const pop = (): T => {
    const top = items[0];
    const last = items.pop() as T;
    const n = items.length;
    if (n > 0) {
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= n) break;
        const r = l + 1;
        const c = r < n && before(items[r], items[l]) ? r : l;
        if (!before(items[c], last)) break;
        items[i] = items[c];
        i = c;
      }
      items[i] = last;
    }
    return top;
  };
  return { items, push, pop };
}
