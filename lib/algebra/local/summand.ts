import { kernelBasis } from "../graded/echelon";
import type { Ideal } from "../ideal";
import type { ComputeOptions } from "../options";
import { variablesOf } from "./residue";
import { sparsify } from "./free";
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
    inspect: ({ i, j, F, block, kernel, decomposable }) => {
      if (i !== p - 1 || splits || kernel.rank === 0) return;
      const K = F.K;
      // The socle of K_j: combinations of the kernel rows killed by every variable. The
      // images x_v·b are sparse; their coordinates are numbered compactly.
      const position = new Map<string, number>();
      const sparse = kernel.rows.map((b) => {
        const w = sparsify(K, b, block);
        const out: { at: number; c: unknown }[] = [];
        for (let v = 0; v < F.A.n; v++) {
          const img = F.mulVarSparse(v, j, w);
          img.idx.forEach((x, k) => {
            const key = `${v}:${x}`;
            if (!position.has(key)) position.set(key, position.size);
            out.push({ at: position.get(key)!, c: img.val[k] });
          });
        }
        return out;
      });
      const images = sparse.map((entries) => {
        const d = new Array(position.size).fill(K.zero);
        for (const { at, c } of entries) d[at] = c;
        return d;
      });
      for (const c of kernelBasis(K, position.size, images)) {
        const s = new Array(block.length).fill(K.zero);
        c.forEach((x, r) => {
          if (K.isZero(x)) return;
          kernel.rows[r].forEach((y, k) => (s[k] = K.add(s[k], K.mul(x, y))));
        });
        if (decomposable.reduce(s).some((x) => !K.isZero(x))) splits = true;
      }
    },
  });
  return splits;
}
