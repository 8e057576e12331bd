/// Texts of series in t: ascending powers as a series is read ("1-3*t^2+2*t^3"), and the
/// Hilbert denominator ∏ (1 − t^{w_i}) read back from the engine's text of it.
import { formatHilbertDenominator, type HilbertSeries } from "../algebra/index";

export function ascendingText(coeffs: readonly bigint[], variable = "t"): string {
  return laurentText(coeffs, 0, variable);
}

/// Inverse of the engine's formatHilbertDenominator ("(1-t)^2*(1-t^3)", "1"): the degrees
/// w_i, ascending; null when the text is not of that form.
export function parseDenominator(text: string): number[] | null {
  if (text === "1") return [];
  const out: number[] = [];
  for (const part of text.split("*")) {
    const m = /^\(1-t(?:\^(\d+))?\)(?:\^(\d+))?$/.exec(part);
    if (!m) return null;
    const w = m[1] === undefined ? 1 : Number(m[1]);
    const k = m[2] === undefined ? 1 : Number(m[2]);
    if (w < 1 || k < 1 || k > 10_000) return null;
    for (let i = 0; i < k; i++) out.push(w);
  }
  return out.sort((a, b) => a - b);
}

/// Ascending text of Σ c_i t^(i + lowest), negative powers written t^-k ("t^-2+2*t^-1+1").
export function laurentText(coeffs: readonly bigint[], lowest: number, variable = "t"): string {
  let out = "";
  coeffs.forEach((c, k) => {
    if (c === 0n) return;
    const i = k + lowest;
    const neg = c < 0n;
    const a = neg ? -c : c;
    const mono = i === 0 ? "" : i === 1 ? variable : `${variable}^${i}`;
    const body = mono === "" ? a.toString() : a === 1n ? mono : `${a}*${mono}`;
    out += neg ? `-${body}` : out === "" ? body : `+${body}`;
  });
  return out === "" ? "0" : out;
}

/// "(1-t^2)/(1-t)^3" — numerator over the ring's full denominator, as the engine keeps it;
/// a denominator with several factors is parenthesised, "(1+t)/((1-t)^2*(1-t^3))", so that the
/// text reads back as the same rational function. `shift` > 0: the numerator is
/// t^(−shift)·numerator (a module generated in negative degrees).
export function hilbertText(hs: HilbertSeries, shift = 0): string {
  const num = laurentText(hs.numerator, -shift);
  const den = formatHilbertDenominator(hs.weights);
  if (den === "1") return num;
  const wrapped = hs.numerator.filter((c) => c !== 0n).length > 1 ? `(${num})` : num;
  return `${wrapped}/${den.includes("*") ? `(${den})` : den}`;
}
