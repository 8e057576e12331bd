import { runtimeError } from "../errors";
import type { PolyRing } from "../poly/ring";

/// A graded free module ⊕ R(−d_i): basis element e_i sits in degree d_i.
export interface FreeModule {
  readonly ring: PolyRing;
  readonly degrees: readonly number[];
}

/// R^[d_1, …] from a list of degrees, or R^n (all in degree 0) from a rank.
export function freeModule(R: PolyRing, degrees: number | readonly number[]): FreeModule {
  const ds = typeof degrees === "number" ? rankDegrees(degrees) : [...degrees];
  ds.forEach((d, i) => {
    if (!Number.isSafeInteger(d)) throw runtimeError("freeModule", `degree ${i + 1} is not an integer: ${d}`);
  });
  return Object.freeze({ ring: R, degrees: Object.freeze(ds) });
}

function rankDegrees(n: number): number[] {
  if (!Number.isInteger(n) || n < 0) throw runtimeError("freeModule", `the rank must be a non-negative integer, got ${n}`);
  return new Array<number>(n).fill(0);
}

export function freeRank(F: FreeModule): number {
  return F.degrees.length;
}
