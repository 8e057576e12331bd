import type { ComputeOptions } from "../options";
import { checkpoint } from "../options";
import { type Poly } from "../poly/poly";
import { isZero } from "../poly/checked";
import { normalForm } from "../groebner/checked";
import { commonRing, idealGroebnerBasis, type Ideal } from "./ideal";

/// f ∈ I: the normal form of f modulo a Gröbner basis of I vanishes.
export function idealContains(I: Ideal, f: Poly, opts?: ComputeOptions): boolean {
  return isZero(normalForm(I.ring, f, [...idealGroebnerBasis(I, opts)]));
}

/// I ⊆ J: every generator of I lies in J.
export function idealIsSubset(I: Ideal, J: Ideal, opts?: ComputeOptions): boolean {
  commonRing("idealIsSubset", I, J);
  return I.gens.every((f) => {
    checkpoint(opts, { stage: "containment" });
    return idealContains(J, f, opts);
  });
}

/// I = J as ideals (both containments).
export function idealEquals(I: Ideal, J: Ideal, opts?: ComputeOptions): boolean {
  return idealIsSubset(I, J, opts) && idealIsSubset(J, I, opts);
}
