import { runtimeError } from "../errors";
import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { isZero, mul, one, sub, variable } from "../poly/checked";
import { eliminatedIdeal, eliminateTags, embedInTagged } from "./eliminate";
import { commonRing, ideal, type Ideal } from "./ideal";
import { idealIntersectionOf } from "./intersect";
import { taggedRing } from "./transfer";

/// I : f^∞ = (I + (1 − y·f)) ∩ k[x] with a tag variable y (D. Cox, J. Little, D. O'Shea,
/// *Ideals, Varieties, and Algorithms*, Ch. 4 §4, saturation; the Rabinowitsch trick).
export function idealSaturationElement(I: Ideal, f: Poly, opts?: ComputeOptions): Ideal {
  const R = I.ring;
  if (!f) throw runtimeError("idealSaturationElement", "the element is missing");
  if (isZero(f)) return ideal(R, [one(R)]);
  const T = taggedRing(R, 1);
  const y = variable(T, 0);
  const gens = [...I.gens.map((g) => embedInTagged(R, T, 1, g)), sub(T, one(T), mul(T, y, embedInTagged(R, T, 1, f)))];
  return eliminatedIdeal(R, eliminateTags(R, T, 1, gens, opts));
}

/// I : J^∞ = ⋂_j (I : f_j^∞) over the generators f_j of J (common practice: a power of J
/// lies in (f_1^N, …, f_r^N) and conversely); I : 0^∞ is the unit ideal.
export function idealSaturation(I: Ideal, J: Ideal, opts?: ComputeOptions): Ideal {
  const R = commonRing("idealSaturation", I, J);
  if (J.gens.length === 0) return ideal(R, [one(R)]);
  return idealIntersectionOf(
    J.gens.map((f) => idealSaturationElement(I, f, opts)),
    opts,
  );
}
