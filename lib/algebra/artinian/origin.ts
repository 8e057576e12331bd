import { runtimeError } from "../errors";
import { type Ideal, ideal } from "../ideal/ideal";
import { idealContains } from "../ideal/compare";
import { idealPower, idealSum } from "../ideal/arith";
import { one, variable } from "../poly/checked";
import { checkpoint, type ComputeOptions } from "../options";
import { FiniteAlgebra } from "./algebra";

/// The ideal m of the origin in the ring of I.
export function originIdeal(I: Ideal): Ideal {
  const S = I.ring;
  return ideal(
    S,
    S.vars.map((_, i) => variable(S, i)),
  );
}

/// The component of I at the origin: the ideal Q of S with S/Q ≅ S_m/I·S_m, the local ring
/// of S/I at the origin, for I whose zero set has the origin as an isolated point.
/// S/I may be a product of several local rings; this keeps the factor at the origin.
/// Q = I + m^N once dim_k S/(I + m^N) = dim_k S/(I + m^{N+1}): then m^N ⊆ I + m^{N+1} and, in
/// the local ring, m^N ⊆ I·S_m by Nakayama, so I + m^N and I agree at the origin, and
/// I + m^N is m-primary. Also returns N.
export function componentAtOrigin(
  I: Ideal,
  opts?: ComputeOptions & { maxPower?: number },
): { ideal: Ideal; power: number; length: number } {
  const S = I.ring;
  const m = originIdeal(I);
  if (idealContains(idealSum(I, m), one(S)))
    throw runtimeError("artinian", "the origin is not a zero of the ideal: the local ring there is zero");
  const cap = opts?.maxPower ?? 64;
  let prev = -1;
  for (let N = 1; N <= cap; N++) {
    checkpoint(opts, { stage: "component at the origin", detail: `I + m^${N}` });
    const Q = idealSum(I, idealPower(m, N, opts));
    const len = new FiniteAlgebra(S, Q, opts).dim;
    if (len === prev) return { ideal: idealSum(I, idealPower(m, N - 1, opts)), power: N - 1, length: len };
    prev = len;
  }
  throw runtimeError(
    "artinian",
    `the local ring at the origin did not stabilise up to m^${cap}: the origin may not be an isolated point (this way of reading a ring needs it Artinian there; localize(R) reads any ring at a point)`,
  );
}

/// The local ring S_m/I·S_m at the origin as a finite-dimensional algebra.
export function localAlgebraAtOrigin(I: Ideal, opts?: ComputeOptions): FiniteAlgebra {
  return new FiniteAlgebra(I.ring, componentAtOrigin(I, opts).ideal, opts);
}
