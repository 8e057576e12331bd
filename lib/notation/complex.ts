/// The Complex value of an engine resolution (shared by resolve(…) over S and over modules).
import type { Resolution } from "../algebra/index";
import type { BettiTableValue, ComplexValue, MatrixValue, RingValue } from "./values";

/// The Complex value of a resolution; `shift`: how far the module was moved up in degree
/// before resolving (its Betti numbers are moved back).
export function complexOf(r: Resolution, ring: RingValue, shift = 0): ComplexValue {
  const maps: MatrixValue[] = [];
  for (let i = 1; i <= r.length; i++) {
    const rows = r.map(i);
    maps.push({ type: "Matrix", ring, rows, cols: r.ranks[i] ?? 0 });
  }
  const entries = shift === 0 ? r.betti.entries : r.betti.entries.map(([i, j, b]) => [i, j - shift, b] as const);
  const betti: BettiTableValue = { type: "BettiTable", entries, complete: r.complete };
  return { type: "Complex", ring, ranks: r.ranks, betti, complete: r.complete, maps };
}
