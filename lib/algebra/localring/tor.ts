import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { constant, zero } from "../poly/checked";
import { kernelColumns, localQuotientLength, type Columns } from "./modules";
import type { LocalFreeResolution } from "./resolve";

/// ℓ(Tor_i^{R_m}(M, R/K)) for i = 0 … length, R = S/J at the origin, from a minimal free
/// resolution F of M over R_m: Tor_i = H_i(F ⊗ R/K), with K' = J + K,
/// Z_i = ker(d_i ⊗ R/K) + K'·F_i and B_i = im(d_{i+1}) + K'·F_i, and ℓ(Z_i/B_i) from the
/// tangent cones of F_i/B_i and F_i/Z_i (localQuotientLength). Each Tor must have finite
/// length (M ⊗ R/K of finite length is enough; J.-P. Serre, Algèbre locale, multiplicités, 1965).
export function localTorLengths(
  S: PolyRing,
  F: LocalFreeResolution,
  J: readonly Poly[],
  K: readonly Poly[],
  length: number,
  opts?: ComputeOptions,
): bigint[] {
  const KJ = [...J, ...K];
  const out: bigint[] = [];
  const cols = (rows: Poly[][]): Columns => (rows.length === 0 ? [] : rows[0].map((_, k) => rows.map((row) => row[k])));
  for (let i = 0; i <= length; i++) {
    const b = F.ranks[i] ?? 0;
    if (b === 0) {
      out.push(0n);
      continue;
    }
    const blocks: Columns = [];
    for (const g of KJ) for (let r = 0; r < b; r++) blocks.push(Array.from({ length: b }, (_, k) => (k === r ? g : zero(S))));
    const Z: Columns =
      i === 0
        ? Array.from({ length: b }, (_, r) => Array.from({ length: b }, (_, k) => (k === r ? unit(S) : zero(S))))
        : [...kernelColumns(S, F.ranks[i - 1], cols(F.maps[i - 1]), KJ, opts), ...blocks];
    const next = F.maps[i];
    const B: Columns = [...(next ? cols(next) : []), ...blocks];
    out.push(localQuotientLength(S, b, Z, B, opts));
  }
  return out;
}

const unit = (S: PolyRing): Poly => constant(S, 1n);
