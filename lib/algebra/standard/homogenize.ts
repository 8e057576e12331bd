import { runtimeError } from "../errors";
import { type Poly } from "../poly/poly";
import { type PolyRing, polyRing } from "../poly/ring";
import { isZero, monomial, terms, zero, add } from "../poly/checked";

/// The ring K[h, x_1..x_n] of Lazard's homogenisation for a local degree order on K[x]: standard
/// degrees, and the order weights(2, 1, …, 1) with grevlex ties. On forms of one total degree D,
/// h^a·x^α has weight D + a, so the monomial with the lowest x-degree is the largest, and equal
/// x-degrees are compared by grevlex: the local order ">_h" of Lazard's method
/// (D. Cox, J. Little, D. O'Shea, Using Algebraic Geometry, ch. 4 §4; the mathematics also in
/// G.-M. Greuel, G. Pfister, A Singular Introduction to Commutative Algebra, §1.7).
export interface Homogenisation {
  readonly S: PolyRing;
  readonly H: PolyRing;
}

const cache = new WeakMap<PolyRing, Homogenisation>();

export function homogenisation(S: PolyRing): Homogenisation {
  let h = cache.get(S);
  if (!h) {
    const n = S.vars.length;
    let name = "h";
    for (let k = 0; S.vars.includes(name); k++) name = `h${k}`;
    const H = polyRing(S.field, [name, ...S.vars], { order: { kind: "weights", weights: [2, ...new Array<number>(n).fill(1)] } });
    h = { S, H };
    cache.set(S, h);
  }
  return h;
}

/// The total (standard) degree of f; −1 for 0.
export function totalDegree(S: PolyRing, f: Poly): number {
  let d = -1;
  for (const t of terms(S, f)) {
    const e = t.exps.reduce((a, b) => a + b, 0);
    if (e > d) d = e;
  }
  return d;
}

/// The lowest total degree of a term of f (its order at the origin); −1 for 0.
export function order(S: PolyRing, f: Poly): number {
  let d = Infinity;
  for (const t of terms(S, f))
    d = Math.min(
      d,
      t.exps.reduce((a, b) => a + b, 0),
    );
  return d === Infinity ? -1 : d;
}

/// h^(D − |α|)·x^α for every term c·x^α of f, with D ≥ deg f (default deg f).
export function homogenise(Z: Homogenisation, f: Poly, D = totalDegree(Z.S, f)): Poly {
  if (isZero(f)) return zero(Z.H);
  let out = zero(Z.H);
  for (const t of terms(Z.S, f)) {
    const e = t.exps.reduce((a, b) => a + b, 0);
    if (e > D) throw runtimeError("homogenise", `a term of degree ${e} above the target degree ${D}`);
    out = add(Z.H, out, monomial(Z.H, [D - e, ...t.exps], t.num, t.den));
  }
  return out;
}

/// f(1, x): the homogenising variable set to 1.
export function dehomogenise(Z: Homogenisation, f: Poly): Poly {
  let out = zero(Z.S);
  for (const t of terms(Z.H, f)) out = add(Z.S, out, monomial(Z.S, t.exps.slice(1), t.num, t.den));
  return out;
}
