import type { Rat } from "../field/rational";

/// A polynomial in one variable in the canonical text style of notation.md §9: terms in
/// decreasing degree, `*` and `^`, no spaces, coefficient 1 omitted ("-t^3+3*t^2-3*t+1").
export function formatUnivariate(coeffs: readonly (bigint | Rat)[], variable = "t"): string {
  let out = "";
  for (let i = coeffs.length - 1; i >= 0; i--) {
    const c = coeffs[i];
    const { n: num, d: den } = typeof c === "bigint" ? { n: c, d: 1n } : c;
    if (num === 0n) continue;
    const negative = num < 0n;
    const abs = negative ? -num : num;
    const magnitude = den === 1n ? `${abs}` : `${abs}/${den}`;
    const power = i === 0 ? "" : i === 1 ? variable : `${variable}^${i}`;
    const body = power === "" ? magnitude : magnitude === "1" ? power : `${magnitude}*${power}`;
    out += negative ? `-${body}` : out === "" ? body : `+${body}`;
  }
  return out === "" ? "0" : out;
}

/// ∏ (1 − t^{w_i}) as text, equal factors collected: "(1-t)^2*(1-t^3)"; "1" with no variables.
export function formatHilbertDenominator(weights: readonly number[], variable = "t"): string {
  const counts = new Map<number, number>();
  for (const w of weights) counts.set(w, (counts.get(w) ?? 0) + 1);
  const factors = [...counts.entries()]
    .sort(([a], [b]) => a - b)
    .map(([w, k]) => {
      const base = `(1-${w === 1 ? variable : `${variable}^${w}`})`;
      return k === 1 ? base : `${base}^${k}`;
    });
  return factors.length === 0 ? "1" : factors.join("*");
}
