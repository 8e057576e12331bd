import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { constant, isZero, mul, sub, terms, zero } from "../poly/checked";
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
  const Z: Columns =
    out === null ? Array.from({ length: r }, (_, k) => unit(k)) : [...kernelOf(S, out, relTarget, opts).map((v) => v.slice(0, r)), ...relC];
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
export function bassNumbers(
  S: PolyRing,
  F: LocalFreeResolution,
  J: readonly Poly[],
  p: number,
  U: Columns,
  length: number,
  opts?: ComputeOptions,
): bigint[] {
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
    const src = F.ranks[i - 1] ?? 0,
      tgt = F.ranks[i] ?? 0;
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

/// A module given by generators (vectors of some free module, each with a degree) and the
/// relations among them: coker of `relations` (columns of length = number of generators).
export interface PresentedModule {
  readonly generators: number;
  readonly relations: Columns;
  readonly degrees: number[];
}

/// The degree of a homogeneous vector whose coordinate k sits in degree `coordDegrees[k]`.
function vectorDegree(S: PolyRing, v: readonly Poly[], coordDegrees: readonly number[]): number {
  for (let k = 0; k < v.length; k++) {
    const ts = terms(S, v[k]);
    if (ts.length > 0) return ts[0].exps.reduce((a, e, i) => a + e * S.degrees[i], 0) + coordDegrees[k];
  }
  return 0;
}

/// Tor_i^R(M, N) or Ext^i_R(M, N) as a presented module, R = S/J, from a minimal free resolution
/// F of M (maps with entries in R_m; homogeneous when M is graded, and then so is everything
/// below) and N = coker(U) with q generators in degrees `nDegrees`:
///   Tor_i = H_i(F ⊗ N), with F_i ⊗ N = N^{β_i} and the maps d_i ⊗ 1;
///   Ext^i = H^i(Hom(F, N)), with Hom(F_i, N) = N^{β_i} and the maps d_{i+1}^T ⊗ 1
/// (D. Eisenbud, Commutative Algebra, §A3.11–A3.12; the computation is common practice).
/// Generators: the kernel of the outgoing map modulo the relations; relations: the syzygies
/// that land in the image of the incoming map plus the relations. `fDegrees[i]` are the degrees
/// of the basis of F_i. F must be resolved to i + 1.
export function homologyModule(
  S: PolyRing,
  J: readonly Poly[],
  F: LocalFreeResolution,
  fDegrees: readonly (readonly number[])[],
  q: number,
  U: Columns,
  nDegrees: readonly number[],
  i: number,
  kind: "tor" | "ext",
  opts?: ComputeOptions,
): PresentedModule {
  const beta = (k: number) => (k < 0 ? 0 : (F.ranks[k] ?? 0));
  const rank = (k: number) => beta(k) * q;
  const r = rank(i);
  if (r === 0) return { generators: 0, relations: [], degrees: [] };
  const coordDegrees = (k: number) =>
    Array.from({ length: rank(k) }, (_, idx) =>
      kind === "tor" ? fDegrees[k][Math.floor(idx / q)] + nDegrees[idx % q] : nDegrees[idx % q] - fDegrees[k][Math.floor(idx / q)],
    );
  const rel = (k: number): Columns => {
    const b = beta(k);
    const cols: Columns = [];
    for (let a = 0; a < b; a++)
      for (const u of U) cols.push(Array.from({ length: b * q }, (_, idx) => (Math.floor(idx / q) === a ? u[idx % q] : zero(S))));
    return [...cols, ...scalarBlocks(S, b * q, J)];
  };
  // d_k ⊗ 1 : F_k ⊗ N → F_{k−1} ⊗ N (columns indexed (a, r), a ∈ F_k)
  const straight = (k: number): Columns => {
    const d = F.maps[k - 1];
    const cols: Columns = [];
    for (let a = 0; a < beta(k); a++) {
      for (let t = 0; t < q; t++)
        cols.push(Array.from({ length: rank(k - 1) }, (_, idx) => (idx % q === t ? d[Math.floor(idx / q)][a] : zero(S))));
    }
    return cols;
  };
  // d_k^T ⊗ 1 : Hom(F_{k−1}, N) → Hom(F_k, N) (columns indexed (c, r), c ∈ F_{k−1})
  const dual = (k: number): Columns => {
    const d = F.maps[k - 1];
    const cols: Columns = [];
    for (let c = 0; c < beta(k - 1); c++) {
      for (let t = 0; t < q; t++)
        cols.push(Array.from({ length: rank(k) }, (_, idx) => (idx % q === t ? d[c][Math.floor(idx / q)] : zero(S))));
    }
    return cols;
  };
  let out: { rows: number; cols: Columns; target: number } | null;
  let incoming: Columns;
  if (kind === "tor") {
    out = i > 0 && rank(i - 1) > 0 ? { rows: rank(i - 1), cols: straight(i), target: i - 1 } : null;
    incoming = rank(i + 1) > 0 ? straight(i + 1) : [];
  } else {
    out = rank(i + 1) > 0 ? { rows: rank(i + 1), cols: dual(i + 1), target: i + 1 } : null;
    incoming = i > 0 && rank(i - 1) > 0 ? dual(i) : [];
  }
  const unit = (k: number) => Array.from({ length: r }, (_, j) => (j === k ? constant(S, 1n) : zero(S)));
  const gens: Columns = out === null ? Array.from({ length: r }, (_, k) => unit(k)) : kernelOf(S, out, rel(out.target), opts);
  const within = [...incoming, ...rel(i)];
  const syz = kernelColumns(S, r, [...gens, ...within], [], opts)
    .map((v) => v.slice(0, gens.length))
    .filter((v) => v.some((f) => !isZero(f)));
  const cd = coordDegrees(i);
  return prune(S, { generators: gens.length, relations: syz, degrees: gens.map((g) => vectorDegree(S, g, cd)) });
}

/// Removes generators that a relation with a nonzero constant coefficient expresses through
/// the others: with v_j = c, e_j = −(1/c)·Σ_{k≠j} v_k e_k, every other relation w becomes
/// w − (w_j/c)·v without coordinate j, and v is dropped (a presentation of the same module).
export function prune(S: PolyRing, P: PresentedModule): PresentedModule {
  let relations = P.relations.map((v) => [...v]);
  let degrees = [...P.degrees];
  for (;;) {
    let found: { v: number; j: number; c: { num: bigint; den: bigint } } | null = null;
    for (let v = 0; v < relations.length && !found; v++) {
      for (let j = 0; j < relations[v].length; j++) {
        const ts = terms(S, relations[v][j]);
        if (ts.length === 1 && ts[0].exps.every((e) => e === 0)) {
          found = { v, j, c: { num: ts[0].num, den: ts[0].den } };
          break;
        }
      }
    }
    if (!found) break;
    const { v, j, c } = found;
    const pivot = relations[v];
    relations = relations
      .filter((_, k) => k !== v)
      .map((w) => {
        const f = w[j];
        const out = isZero(f) ? w : w.map((g, k) => sub(S, g, mul(S, mul(S, f, constant(S, c.den, c.num)), pivot[k])));
        return out.filter((_, k) => k !== j);
      })
      .filter((w) => w.some((g) => !isZero(g)));
    degrees = degrees.filter((_, k) => k !== j);
  }
  return { generators: degrees.length, relations, degrees };
}
