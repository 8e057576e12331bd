import { runtimeError } from "../errors";
import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { isZero, one } from "../poly/checked";
import { exactQuotient } from "./divide";
import { commonRing, ideal, type Ideal } from "./ideal";
import { idealIntersection, idealIntersectionOf } from "./intersect";

/// I : f = { g : g·f ∈ I } = (1/f)·(I ∩ (f)) (D. Cox, J. Little, D. O'Shea, *Ideals,
/// Varieties, and Algorithms*, Ch. 4 §4).
export function idealColonElement(I: Ideal, f: Poly, opts?: ComputeOptions): Ideal {
  const R = I.ring;
  if (!f) throw runtimeError("idealColonElement", "the element is missing");
  if (isZero(f)) return ideal(R, [one(R)]);
  const meet = idealIntersection(I, ideal(R, [f]), opts);
  return ideal(
    R,
    meet.gens.map((h) => exactQuotient(R, h, f, opts)),
  );
}

/// I : J = ⋂_j (I : f_j) over the generators f_j of J (same source); I : 0 is the unit ideal.
export function idealColon(I: Ideal, J: Ideal, opts?: ComputeOptions): Ideal {
  const R = commonRing("idealColon", I, J);
  if (J.gens.length === 0) return ideal(R, [one(R)]);
  return idealIntersectionOf(
    J.gens.map((f) => idealColonElement(I, f, opts)),
    opts,
  );
}
