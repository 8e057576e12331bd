import { runtimeError } from "../../errors";
import { bettiRegularity } from "./betti";
import type { Resolution } from "./resolve";

function requireComplete(C: Resolution, where: string): void {
  if (!C.complete) throw runtimeError(where, "the resolution was cut short by a bound; resolve without bounds first");
}

/// pd M: the length of the minimal free resolution (−Infinity for the zero module).
export function projectiveDimension(C: Resolution): number {
  requireComplete(C, "projectiveDimension");
  return C.betti.entries.length === 0 ? -Infinity : C.length;
}

/// depth M = n − pd M over S = k[x_1..x_n] (M. Auslander, D. Buchsbaum, "Homological
/// dimension in local rings", Trans. AMS 1957); Infinity for the zero module.
export function depthByAuslanderBuchsbaum(C: Resolution): number {
  return C.ring.vars.length - projectiveDimension(C);
}

/// reg M = max{j − i : β_{i,j} ≠ 0}.
export function regularity(C: Resolution): number {
  requireComplete(C, "regularity");
  return bettiRegularity(C.betti);
}
