/// Gröbner bases and normal forms for the public interface, with the ring checked first.
import type { ComputeOptions } from "../options";
import { ctxFor } from "../poly/checked";
import type { Poly } from "../poly/poly";
import type { PolyRing } from "../poly/ring";
import { groebnerCtx } from "./index";
import { normalFormCtx } from "./normalform";

/// The reduced Gröbner basis: monic, sorted by increasing leading monomial.
/// Over GF(p) Buchberger's algorithm; over Q the modular method.
export function groebnerBasis(R: PolyRing, gens: readonly Poly[], opts?: ComputeOptions): Poly[] {
  const C = ctxFor(R, "groebnerBasis", ...gens);
  return groebnerCtx(C, gens, opts);
}

/// The remainder of f modulo G; the normal form when G is a Gröbner basis.
export function normalForm(R: PolyRing, f: Poly, G: readonly Poly[], opts?: ComputeOptions): Poly {
  const C = ctxFor(R, "normalForm", f, ...G);
  return normalFormCtx(C, f, G, opts);
}
