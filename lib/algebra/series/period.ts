/// Where a finite list becomes periodic: the smallest period p, and for it the smallest
/// start s, with list[k] = list[k + p] for every k ≥ s inside the list, the repeating block
/// seen at least twice (s + 2p ≤ length). `null` when the list shows no such pattern.
/// A list that is eventually constant has period 1 (it stabilises).
export function eventualPeriod<T>(
  list: readonly T[],
  eq: (a: T, b: T) => boolean = (a, b) => a === b,
): { start: number; period: number } | null {
  const N = list.length;
  for (let p = 1; 2 * p <= N; p++) {
    // The tail that satisfies the period-p condition, scanning from the end.
    let s = N - p;
    while (s > 0 && eq(list[s - 1], list[s - 1 + p])) s--;
    if (s + 2 * p <= N) return { start: s, period: p };
  }
  return null;
}
