/// What resolve(…) and poincare(…) hand the engine's resolution dispatcher
/// (lib/algebra/resolution/dispatch.ts), and the method it will choose — which the evaluator
/// only reads, to check its options and render the result.
import { ideal as engineIdeal, resolutionMethod, type ResolutionInput, type ResolutionMethod } from "../algebra/index";
import type { CallContext } from "./context";
import { runtime } from "./errors";
import type { ModuleValue, RingValue } from "./values";

export interface ResolutionTarget {
  input: ResolutionInput;
  method: ResolutionMethod;
  /// the ring the resolution's modules and maps live over
  base: RingValue;
  /// how far the generators were moved up into degrees ≥ 0 (Betti numbers are moved back)
  shift: number;
}

/// A quotient ring m = A / I is the cyclic A-module A/I (notation.md §5): J is the defining
/// ideal of A, I that of m, both in the ambient polynomial ring S. A module is given by its
/// presentation over its ring.
export function resolutionTarget(m: RingValue | ModuleValue, c: CallContext): ResolutionTarget {
  const compute = c.interp.session.compute;
  if (m.type === "Ring") {
    const base = m.over ?? c.interp.session.rings.ambient(m);
    const input: ResolutionInput = { ring: engineIdeal(base.poly, base.ideal), module: { ideal: engineIdeal(m.poly, m.ideal) } };
    return { input, method: resolutionMethod(input, compute), base, shift: 0 };
  }
  const shift = -Math.min(0, ...m.degrees);
  const input: ResolutionInput = {
    ring: engineIdeal(m.ring.poly, m.ring.ideal),
    module: { presentation: { rows: m.presentation.rows, degrees: m.degrees.map((d) => d + shift) } },
  };
  return { input, method: resolutionMethod(input, compute), base: m.ring, shift };
}

/// At the origin only cyclic modules are resolved: said at the argument, before any work.
export function requireCyclicAtOrigin(t: ResolutionTarget, what: string, c: CallContext): void {
  if (t.method !== "artinian" || "ideal" in t.input.module) return;
  const n = t.input.module.presentation.rows.length;
  if (n !== 1) {
    throw runtime(
      `${what} over a ring given by a non-homogeneous ideal is computed at the origin for cyclic modules only (one generator, such as R.residue or R / I); this module has ${n} generators`,
      c.argSpans[0] ?? c.span,
    );
  }
}
