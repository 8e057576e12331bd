import { runtimeError } from "../../errors";
import type { Poly } from "../../poly/poly";
import type { Resolution } from "./resolve";

/// A presentation of a graded module: the matrix (by rows) and the degrees of its target's basis.
export interface Presentation {
  readonly rows: Poly[][];
  readonly rowDegrees: readonly number[];
}

/// The p-th syzygy module Syz_p(M) = image(d_p) ≅ coker(d_{p+1}) of the minimal resolution,
/// presented minimally by d_{p+1} with target F_p (p = 0 gives a minimal presentation of M).
export function syzygyPresentation(C: Resolution, p: number): Presentation {
  if (!Number.isInteger(p) || p < 0) throw runtimeError("syzygyPresentation", `p must be a non-negative integer, got ${p}`);
  if (p > C.length) return { rows: [], rowDegrees: [] };
  if (!C.complete && p + 1 > C.length)
    throw runtimeError("syzygyPresentation", "the resolution was cut short before this syzygy's presentation");
  const rows = p + 1 <= C.length ? C.map(p + 1) : C.degrees[p].map(() => []);
  return { rows, rowDegrees: [...C.degrees[p]] };
}
