import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { constant, zero } from "../poly/checked";
import { kernelColumns, localQuotientLength, type Columns } from "./modules";
import type { LocalFreeResolution } from "./resolve";

/// ℓ(Z/B) at the origin for the subquotient of C = S^r with
///   Z = {v : out(v) ∈ ⟨relTarget⟩} + ⟨relC⟩ (all of C when `out` is null),
///   B = ⟨inCols⟩ + ⟨relC⟩,
/// out given by its columns (vectors of length outRows). This is the homology at C of
/// C_in → C → C_out with every module a quotient of a free one by the relation columns.
export function subquotientLength(
  S: PolyRing,
  r: number,
  out: { rows: number; cols: Columns } | null,
  relTarget: Columns,
  inCols: Columns,
  relC: Columns,
  opts?: ComputeOptions,
): bigint {
  const unit = (k: number) => Array.from({ length: r }, (_, j) => (j === k ? one(S) : zero(S)));
  const Z: Columns = out === null ? Array.from({ length: r }, (_, k) => unit(k)) : [...kernelOf(S, out, relTarget, opts).map((v) => v.slice(0, r)), ...relC];
  return localQuotientLength(S, r, Z, [...inCols, ...relC], opts);
}

function kernelOf(S: PolyRing, out: { rows: number; cols: Columns }, relTarget: Columns, opts?: ComputeOptions): Columns {
  // ker [out | relTarget], cut to the first r coordinates
  const ker = kernelColumns(S, out.rows, [...out.cols, ...relTarget], [], opts);
  return ker.map((v) => v.slice(0, out.cols.length));
}

const one = (S: PolyRing): Poly => constant(S, 1n);

/// The relation columns J·e_k of a free module of rank r.
export function scalarBlocks(S: PolyRing, r: number, J: readonly Poly[]): Columns {
  const out: Columns = [];
  for (const g of J) for (let k = 0; k < r; k++) out.push(Array.from({ length: r }, (_, j) => (j === k ? g : zero(S))));
  return out;
}

/// The Bass numbers μ_i(M) = dim_k Ext^i_R(k, M) for i = 0 … length, R = S/J at the origin,
/// M = coker(U) with U a p-row matrix by columns, from a minimal free resolution F of k
/// over R_m (length + 1 steps): Hom(F_i, M) = M^{β_i} with the maps d_{i+1}^T ⊗ M, and
/// H^i is killed by m, so its length is its dimension (H. Bass, "On the ubiquity of
/// Gorenstein rings", Math. Z. 82, 1963, for the numbers; the computation is common practice).
export function bassNumbers(S: PolyRing, F: LocalFreeResolution, J: readonly Poly[], p: number, U: Columns, length: number, opts?: ComputeOptions): bigint[] {
  const rank = (i: number) => (F.ranks[i] ?? 0) * p;
  // relations of M^{β_i}: U in every block, and J on every coordinate
  const rel = (i: number): Columns => {
    const b = F.ranks[i] ?? 0;
    const cols: Columns = [];
    for (let a = 0; a < b; a++) {
      for (const u of U) cols.push(Array.from({ length: b * p }, (_, k) => (Math.floor(k / p) === a ? u[k % p] : zero(S))));
    }
    return [...cols, ...scalarBlocks(S, b * p, J)];
  };
  // d^T ⊗ id_M for d = d_i : F_i → F_{i−1} (rows β_{i−1}), as columns of M^{β_{i−1}} → M^{β_i}
  const dualColumns = (i: number): Columns => {
    const d = F.maps[i - 1];
    const src = F.ranks[i - 1] ?? 0, tgt = F.ranks[i] ?? 0;
    const cols: Columns = [];
    for (let c = 0; c < src; c++) {
      for (let r = 0; r < p; r++) cols.push(Array.from({ length: tgt * p }, (_, k) => (k % p === r ? d[c][Math.floor(k / p)] : zero(S))));
    }
    return cols;
  };
  const out: bigint[] = [];
  for (let i = 0; i <= length; i++) {
    const r = rank(i);
    if (r === 0) {
      out.push(0n);
      continue;
    }
    const next = F.maps[i] && rank(i + 1) > 0 ? { rows: rank(i + 1), cols: dualColumns(i + 1) } : null;
    const incoming = i > 0 ? dualColumns(i) : [];
    out.push(subquotientLength(S, r, next, next ? rel(i + 1) : [], incoming, rel(i), opts));
  }
  return out;
}
