import { runtimeError } from "../errors";
import type { Rat } from "../field/rational";
import type { ComputeOptions } from "../options";
import type { Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import { buchberger } from "./buchberger";
import { groebnerModular } from "./modular";

export { buchberger } from "./buchberger";
export { reducePairwise } from "./reduce-pairwise";
export type { ReductionStep, Strategy } from "./basis";
export { interreduce } from "./interreduce";
export { reduceF4 } from "./f4";
export { chooseStrategy, f4Strategy, normalStrategy, pairwiseStrategy } from "./strategy";
export { normalFormCtx } from "./normalform";

/// The reduced Gröbner basis; picks the method by the field.
export function groebnerCtx<C>(R: RingCtx<C>, gens: readonly Poly[], opts?: ComputeOptions): Poly[] {
  if (!Array.isArray(gens)) throw runtimeError("groebnerBasis", "the generators must be a list of polynomials");
  if (R.ring.field.kind === "Q") return groebnerModular(R as RingCtx<Rat>, gens, opts);
  return buchberger(R, gens, opts);
}
