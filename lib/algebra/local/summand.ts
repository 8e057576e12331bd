import { kernelBasis } from "../graded/echelon";
import type { Ideal } from "../ideal";
import type { ComputeOptions } from "../options";
import { variablesOf } from "./residue";
import { resolveDegreewise } from "./resolve";

/// Whether the residue field k is a direct summand of the p-th syzygy Ω^p(R/I) over
/// R = S/J (p ≥ 1; I = m for Ω^p k). A finitely generated graded module N has k as a direct
/// summand exactly when its socle (0 :_N m) is not inside m·N (common practice: a socle
/// element outside mN is a minimal generator spanning a copy of k that splits off).
/// Ω^p = K_{p−1} ⊆ F_{p−1} is read degree by degree from the resolution.
export function residueSplitsFromSyzygy(J: Ideal, p: number, I?: Ideal, opts?: ComputeOptions & { degree?: number }): boolean {
  let splits = false;
  resolveDegreewise({
    ring: J,
    module: I ?? variablesOf(J),
    length: p,
    degree: opts?.degree,
    opts,
    inspect: ({ i, j, F, kernel, decomposable }) => {
      if (i !== p - 1 || splits || kernel.rank === 0) return;
      const A = F.A;
      const images = kernel.rows.map((b) => {
        const parts: unknown[] = [];
        for (let v = 0; v < A.n; v++) parts.push(...F.mulVar(v, j, b));
        return parts;
      });
      const total = images.length > 0 ? images[0].length : 0;
      for (const c of kernelBasis(A.K, total, images)) {
        const s = new Array(F.dim(j)).fill(A.K.zero);
        c.forEach((x, r) => {
          if (A.K.isZero(x)) return;
          kernel.rows[r].forEach((y, k) => (s[k] = A.K.add(s[k], A.K.mul(x, y))));
        });
        if (decomposable.reduce(s).some((x) => !A.K.isZero(x))) splits = true;
      }
    },
  });
  return splits;
}
