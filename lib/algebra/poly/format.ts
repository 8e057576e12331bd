import { formatCoeff } from "../field/coeffs";
import { HEAD, type Mono } from "../monomial/monomial";
import { asTyped, type Poly } from "./poly";
import type { RingCtx } from "./ring";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// The monomial as text: x^2*y, "" for 1.
export function formatMono(vars: readonly string[], m: Mono): string {
  const parts: string[] = [];
  for (let i = 0; i < vars.length; i++) {
    const e = m[H + i];
    if (e === 1) parts.push(vars[i]);
    else if (e > 1) parts.push(`${vars[i]}^${e}`);
  }
  return parts.join("*");
}

/// Canonical text (notation.md §9): decreasing terms, `*` and `^`, no spaces, coefficient 1
/// omitted, −1 as a leading `-`, GF(p) coefficients in the symmetric range, zero as `0`.
export function formatPoly<C>(R: RingCtx<C>, f: Poly): string {
  const F = asTyped<C>(f);
  if (F.m.length === 0) return "0";
  let out = "";
  for (let i = 0; i < F.m.length; i++) {
    const mono = formatMono(R.ring.vars, F.m[i]);
    const coef = formatCoeff(R.K, F.c[i]);
    let term: string;
    if (mono === "") term = coef;
    else if (coef === "1") term = mono;
    else if (coef === "-1") term = `-${mono}`;
    else term = `${coef}*${mono}`;
    out += i > 0 && !term.startsWith("-") ? `+${term}` : term;
  }
  return out;
}
