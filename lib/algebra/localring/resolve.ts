import { AlgebraError } from "../errors";
import { checkpoint, type ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { isZero, mul, sub, terms } from "../poly/checked";
import { kernelColumns, reduceVector, type Columns } from "./modules";

/// A minimal free resolution over the local ring R_m, R = S/J (J = 0: S itself), at the origin.
export interface LocalFreeResolution {
  /// β_0, β_1, … (ranks of F_0, F_1, …), each final
  readonly ranks: number[];
  /// d_i : F_i → F_{i−1}, i = 1 … ranks.length − 1, by rows (polynomials read in R_m; a map is
  /// determined up to units of R_m, which is all a minimal resolution is determined up to)
  readonly maps: Poly[][][];
  /// true when the resolution ended (F_{length+1} = 0)
  readonly complete: boolean;
}

/// Whether f is a unit of the local ring at the origin: f(0) ≠ 0 (J ⊆ m).
export function isLocalUnit(S: PolyRing, f: Poly): boolean {
  return terms(S, f).some((t) => t.exps.every((e) => e === 0));
}

/// One cancellation of a unit entry u = D[r][c] of d_{i+1} (D = d_{i+1} by columns): the
/// complex is isomorphic to one without e_c of F_{i+1} and e_r of F_i, where column k of the
/// new d_{i+1} is u·col_k − D[r][k]·col_c without row r (a change of basis of F_{i+1} by the
/// unit u, then the split-off trivial summand S → S), and d_i loses column r. Scaling a whole
/// map by a unit gives an isomorphic complex, so no inverse is ever needed (common practice).
function cancel(S: PolyRing, D: Columns, r: number, c: number, J: readonly Poly[], opts?: ComputeOptions): Columns {
  const u = D[c][r];
  const out: Columns = [];
  D.forEach((col, k) => {
    if (k === c) return;
    const a = col[r];
    const v = col.map((f, row) => (isZero(a) ? mul(S, u, f) : sub(S, mul(S, u, f), mul(S, a, D[c][row]))));
    v.splice(r, 1);
    out.push(J.length > 0 ? reduceVector(S, v, J, opts) : v);
  });
  return out;
}

function findUnit(S: PolyRing, D: Columns): [number, number] | null {
  // prefer a constant entry (the cancellation then does not grow the entries)
  let found: [number, number] | null = null;
  for (let c = 0; c < D.length; c++) {
    for (let r = 0; r < D[c].length; r++) {
      const f = D[c][r];
      if (!isLocalUnit(S, f)) continue;
      if (terms(S, f).length === 1) return [r, c];
      found ??= [r, c];
    }
  }
  return found;
}

/// The minimal free resolution over R_m of the module presented by `presentation` (a matrix
/// with `rows` rows, by columns; the module is coker of it), R = S/J, everything already
/// moved to the origin. Each step: the kernel of the last (already minimal) map over S/J,
/// computed globally (kernels commute with localisation), then units of R_m cancelled, which
/// also removes the redundant generators of the previous kernel (they show up as unit
/// syzygies; Nakayama). β_i is final once d_{i+1} is minimal, so length + 1 kernels give
/// β_0 … β_length.
export function localResolution(
  S: PolyRing,
  rows: number,
  presentation: Columns,
  J: readonly Poly[],
  length: number,
  opts?: ComputeOptions,
): LocalFreeResolution {
  if (!Number.isInteger(length) || length < 0) throw new AlgebraError("runtime", "resolution: the length must be a non-negative integer");
  // d_1, minimised: a unit entry means a generator is redundant
  let d: Columns = presentation.map((v) => (J.length > 0 ? reduceVector(S, v, J, opts) : [...v])).filter((v) => v.some((f) => !isZero(f)));
  let r0 = rows;
  for (;;) {
    const at = findUnit(S, d);
    if (!at) break;
    d = cancel(S, d, at[0], at[1], J, opts).filter((v) => v.some((f) => !isZero(f)));
    r0--;
  }
  const maps: Columns[] = [d];
  const ranks = [r0];
  let prevRows = r0;
  for (let i = 1; i <= length; i++) {
    checkpoint(opts, { stage: "resolution over a local ring", detail: `homological degree ${i}`, fraction: i / (length + 1) });
    let next = kernelColumns(S, prevRows, maps[i - 1], J, opts);
    // cancel units of d_{i+1}: each removes a column of d_i
    for (;;) {
      const at = findUnit(S, next);
      if (!at) break;
      const [r] = at;
      next = cancel(S, next, at[0], at[1], J, opts).filter((v) => v.some((f) => !isZero(f)));
      maps[i - 1] = maps[i - 1].filter((_, k) => k !== r);
    }
    ranks.push(maps[i - 1].length);
    if (maps[i - 1].length === 0) {
      ranks.pop();
      while (ranks.length <= length) ranks.push(0);
      return { ranks, maps: toRows(maps.slice(0, i - 1), ranks), complete: true };
    }
    prevRows = maps[i - 1].length;
    maps.push(next);
  }
  const complete = maps[length].length === 0;
  return { ranks, maps: toRows(maps.slice(0, length), ranks), complete };
}

/// Columns → rows, with the ranks giving the shape of empty maps.
function toRows(maps: Columns[], ranks: number[]): Poly[][][] {
  return maps.map((cols, i) => Array.from({ length: ranks[i] }, (_, r) => cols.map((v) => v[r])));
}
