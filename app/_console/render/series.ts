/// TeX of the series values of §9: a HilbertSeries (numerator coefficients in t over the
/// denominator text) and the rational function guessed for a Series.
import { texOfExpression, texOrVerbatim } from "./tex";

/// The numerator Σ c_k t^k as canonical text, in ascending powers ("1-3*t^2+2*t^3").
export function ascendingPolyText(coefficients: readonly string[], variable = "t"): string {
  let out = "";
  coefficients.forEach((raw, k) => {
    const c = BigInt(raw);
    if (c === 0n) return;
    const a = c < 0n ? -c : c;
    const mono = k === 0 ? "" : k === 1 ? variable : `${variable}^${k}`;
    const body = mono === "" ? a.toString() : a === 1n ? mono : `${a}*${mono}`;
    out += c < 0n ? `-${body}` : out === "" ? body : `+${body}`;
  });
  return out === "" ? "0" : out;
}

/// TeX of a Hilbert series numerator/denominator as a fraction (just the numerator when
/// the denominator is 1).
/// `lowest` < 0 (a module generated in negative degrees): the numerator starts at t^lowest,
/// drawn as the factor t^lowest in front.
export function texOfHilbertSeries(numerator: readonly string[], denominator: string, lowest = 0): string {
  const num = texOfExpression(ascendingPolyText(numerator)) ?? "0";
  const body = denominator.trim() === "1" ? num : `\\frac{${num}}{${texOrVerbatim(denominator)}}`;
  return lowest < 0 ? `t^{${lowest}} \\cdot ${body}` : body;
}

/// TeX of the first terms of a power series Σ a_i t^i, followed by an order term.
export function texOfSeriesPrefix(coefficients: readonly string[]): string {
  const text = ascendingPolyText(coefficients);
  const head = texOfExpression(text) ?? text;
  return `${head} + O\\!\\left(t^{${coefficients.length}}\\right)`;
}
