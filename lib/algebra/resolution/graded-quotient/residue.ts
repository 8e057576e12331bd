import { ideal, type Ideal } from "../../ideal/ideal";
import { variable } from "../../poly/checked";
import { type LocalResolveOptions, type QuotientResolution, resolveDegreewise } from "./resolve";

/// The ideal m of the variables of the ring of J.
export function variablesOf(J: Ideal): Ideal {
  const S = J.ring;
  return ideal(
    S,
    S.vars.map((_, i) => variable(S, i)),
  );
}

/// Betti numbers of the residue field k = R/m over R = S/J, J homogeneous.
export function residueFieldResolution(J: Ideal, length: number, opts?: LocalResolveOptions & { degree?: number }): QuotientResolution {
  return resolveDegreewise({ ring: J, module: variablesOf(J), length, degree: opts?.degree, opts });
}

/// Betti numbers of R/I over R = S/J, I and J homogeneous ideals of S.
export function cyclicResolution(J: Ideal, I: Ideal, length: number, opts?: LocalResolveOptions & { degree?: number }): QuotientResolution {
  return resolveDegreewise({ ring: J, module: I, length, degree: opts?.degree, opts });
}

/// The totals β_i of a resolution.
export function bettiTotalsOf(C: QuotientResolution): number[] {
  return C.columns.map((c) => c.total);
}
