import { runtimeError } from "../errors";
import type { ComputeOptions } from "../options";
import { type Poly, type PolyRing, groebnerBasis } from "./engine";
import { ideal, type Ideal } from "./ideal";
import { avoidsVariables, eliminationRing, identityMap, mapPoly, pullbackPoly } from "./transfer";

/// I ∩ k[other variables]: the elements of a Gröbner basis for an elimination order
/// that involve none of `vars` generate it (elimination theorem; D. Cox, J. Little,
/// D. O'Shea, *Ideals, Varieties, and Algorithms*, Ch. 3 §1 Thm 2). The result is an
/// ideal of the same ring. `vars` are variable names or indices.
export function idealEliminate(I: Ideal, vars: readonly (string | number)[], opts?: ComputeOptions): Ideal {
  const R = I.ring;
  const idx = vars.map((v) => variableIndex("idealEliminate", R, v));
  const E = eliminationRing(R, idx);
  const n = R.vars.length;
  const G = groebnerBasis(E, I.gens.map((g) => mapPoly(R, E, g, identityMap(n))), opts);
  return ideal(
    R,
    G.filter((g) => avoidsVariables(g, idx)).map((g) => mapPoly(E, R, g, identityMap(n))),
  );
}

/// The polynomials of R among the generators of the ideal `gensInT` of taggedRing(R, count)
/// intersected with R: the elimination of the tag variables.
export function eliminateTags(R: PolyRing, T: PolyRing, count: number, gensInT: Poly[], opts?: ComputeOptions): Poly[] {
  const G = groebnerBasis(T, gensInT, opts);
  const tags = identityMap(count);
  const source = identityMap(R.vars.length, count);
  return G.filter((g) => avoidsVariables(g, tags)).map((g) => pullbackPoly(T, R, g, source));
}

/// R embedded in taggedRing(R, count): variable i goes to variable count + i.
export function embedInTagged(R: PolyRing, T: PolyRing, count: number, f: Poly): Poly {
  return mapPoly(R, T, f, identityMap(R.vars.length, count));
}

export function variableIndex(where: string, R: PolyRing, v: string | number): number {
  if (typeof v === "number") {
    if (!Number.isInteger(v) || v < 0 || v >= R.vars.length) {
      throw runtimeError(where, `variable index ${v} is out of range 0..${R.vars.length - 1}`);
    }
    return v;
  }
  const i = R.vars.indexOf(v);
  if (i < 0) throw runtimeError(where, `${v} is not a variable of the ring (variables ${R.vars.join(", ")})`);
  return i;
}
