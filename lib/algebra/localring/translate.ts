import { runtimeError } from "../errors";
import { type Rat } from "../field/rational";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { add, constant, mul, pow, terms, variable, zero } from "../poly/checked";

/// A rational point, coordinate by coordinate.
export type Point = readonly Rat[];

/// f(x + a): the point a moved to the origin, so the local ring of S/I at a is the local ring
/// of S/I(x + a) at the origin (common practice).
export function translate(S: PolyRing, f: Poly, a: Point): Poly {
  if (a.length !== S.vars.length)
    throw runtimeError("localize", `the point needs ${S.vars.length} coordinates, one per variable, got ${a.length}`);
  if (a.every((c) => c.n === 0n)) return f;
  const images = S.vars.map((_, i) => add(S, variable(S, i), constant(S, a[i].n, a[i].d)));
  let out = zero(S);
  for (const t of terms(S, f)) {
    let m = constant(S, t.num, t.den);
    t.exps.forEach((e, i) => {
      if (e > 0) m = mul(S, m, pow(S, images[i], e));
    });
    out = add(S, out, m);
  }
  return out;
}

/// ∂f/∂x_i.
export function derivative(S: PolyRing, f: Poly, i: number): Poly {
  let out = zero(S);
  for (const t of terms(S, f)) {
    if (t.exps[i] === 0) continue;
    const e = t.exps.slice();
    e[i]--;
    let m = constant(S, t.num * BigInt(t.exps[i]), t.den);
    e.forEach((k, j) => {
      if (k > 0) m = mul(S, m, pow(S, variable(S, j), k));
    });
    out = add(S, out, m);
  }
  return out;
}
