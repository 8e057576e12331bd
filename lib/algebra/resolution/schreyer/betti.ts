/// A Betti table: β_{i,j} = dim_k Tor_i(M, k)_j, j the internal degree (notation.md §9).
export interface BettiTable {
  /// Nonzero entries [i, j, β_{i,j}], sorted by i then j.
  readonly entries: readonly (readonly [number, number, number])[];
  /// False when a length or degree bound cut the computation short.
  readonly complete: boolean;
}

/// One finished column i of a Betti table: the pairs [j, β_{i,j}] with β_{i,j} ≠ 0.
export interface BettiColumn {
  readonly i: number;
  readonly entries: readonly (readonly [number, number])[];
}

export function bettiTable(columns: readonly BettiColumn[], complete: boolean): BettiTable {
  const entries: [number, number, number][] = [];
  for (const c of columns) for (const [j, b] of c.entries) entries.push([c.i, j, b]);
  entries.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  return Object.freeze({ entries: Object.freeze(entries), complete });
}

/// β_{i,j} (0 when absent).
export function bettiNumber(B: BettiTable, i: number, j: number): number {
  for (const [a, b, v] of B.entries) if (a === i && b === j) return v;
  return 0;
}

/// The total Betti numbers β_i = Σ_j β_{i,j}, i = 0…(last nonzero column).
export function bettiTotals(B: BettiTable): number[] {
  const out: number[] = [];
  for (const [i, , v] of B.entries) {
    while (out.length <= i) out.push(0);
    out[i] += v;
  }
  return out;
}

/// Castelnuovo–Mumford regularity max{j − i : β_{i,j} ≠ 0} (D. Eisenbud, The Geometry of
/// Syzygies, 2005, Ch. 4); −Infinity for the zero module.
export function bettiRegularity(B: BettiTable): number {
  let r = -Infinity;
  for (const [i, j] of B.entries) if (j - i > r) r = j - i;
  return r;
}

/// Σ_i (−1)^i Σ_j β_{i,j} t^j as coefficients of t^0, t^1, … (the K-polynomial, which is
/// the Hilbert series numerator over ∏(1 − t^{deg x_i}); common practice). Needs j ≥ 0.
export function bettiAlternatingSum(B: BettiTable): bigint[] {
  const out: bigint[] = [];
  for (const [i, j, v] of B.entries) {
    if (j < 0) throw new Error("bettiAlternatingSum: negative internal degree");
    while (out.length <= j) out.push(0n);
    out[j] += (i % 2 === 0 ? 1n : -1n) * BigInt(v);
  }
  while (out.length > 0 && out[out.length - 1] === 0n) out.pop();
  return out;
}
