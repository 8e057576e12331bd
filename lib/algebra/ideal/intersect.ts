import { runtimeError } from "../errors";
import { checkpoint, type ComputeOptions } from "../options";
import { mul, one, sub, variable } from "../poly/checked";
import { eliminatedIdeal, eliminateTags, embedInTagged } from "./eliminate";
import { commonRing, ideal, type Ideal } from "./ideal";
import { taggedRing } from "./transfer";

/// I ∩ J = (t·I + (1 − t)·J) ∩ k[x] with a tag variable t (D. Cox, J. Little, D. O'Shea,
/// *Ideals, Varieties, and Algorithms*, Ch. 4 §3).
export function idealIntersection(I: Ideal, J: Ideal, opts?: ComputeOptions): Ideal {
  const R = commonRing("idealIntersection", I, J);
  if (I.gens.length === 0 || J.gens.length === 0) return ideal(R, []);
  const T = taggedRing(R, 1);
  const t = variable(T, 0);
  const oneMinusT = sub(T, one(T), t);
  const gens = [
    ...I.gens.map((f) => mul(T, t, embedInTagged(R, T, 1, f))),
    ...J.gens.map((g) => mul(T, oneMinusT, embedInTagged(R, T, 1, g))),
  ];
  return eliminatedIdeal(R, eliminateTags(R, T, 1, gens, opts));
}

/// I_1 ∩ I_2 ∩ … (at least one ideal).
export function idealIntersectionOf(ideals: readonly Ideal[], opts?: ComputeOptions): Ideal {
  if (ideals.length === 0) throw runtimeError("idealIntersectionOf", "needs at least one ideal");
  commonRing("idealIntersectionOf", ...ideals);
  let acc = ideals[0];
  ideals.slice(1).forEach((J, k) => {
    checkpoint(opts, { stage: "intersection", detail: `ideal ${k + 2} of ${ideals.length}` });
    acc = idealIntersection(acc, J, opts);
  });
  return acc;
}
