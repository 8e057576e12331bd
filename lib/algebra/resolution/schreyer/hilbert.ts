import { runtimeError } from "../../errors";
import { hilbertSeriesFromNumerator, type HilbertSeries } from "../../hilbert/series";
import { bettiAlternatingSum } from "./betti";
import type { Resolution } from "./resolve";

/// The Hilbert series of the resolved module: numerator Σ_i (−1)^i Σ_j β_{i,j} t^j over
/// ∏ (1 − t^{deg x_k}) (Hilbert's syzygy theorem; Eisenbud, The Geometry of Syzygies, Cor. 1.2).
/// Needs a complete resolution and generators in non-negative degrees.
export function resolutionHilbertSeries(C: Resolution): HilbertSeries {
  if (!C.complete) throw runtimeError("resolutionHilbertSeries", "the resolution was cut short by a bound");
  if (C.betti.entries.some(([, j]) => j < 0)) {
    throw runtimeError("resolutionHilbertSeries", "the module has generators in negative degrees; shift it first");
  }
  return hilbertSeriesFromNumerator(bettiAlternatingSum(C.betti), C.ring.degrees);
}
