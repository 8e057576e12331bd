import { runtimeError } from "../../errors";
import { moduleKernel } from "../../module/kernel";
import type { ComputeOptions } from "../../options";
import type { Poly } from "../../poly/poly";
import type { PolyRing } from "../../poly/ring";
import { resolveCoker } from "./resolve";
import type { Presentation } from "./syzygy";

/// The degree of each column of a homogeneous matrix (by rows) with rows in the given degrees;
/// `fallback` for a zero column.
export function columnDegrees(rows: readonly (readonly Poly[])[], rowDegrees: readonly number[], fallback = 0): number[] {
  const ncols = rows[0]?.length ?? 0;
  const out: number[] = [];
  for (let q = 0; q < ncols; q++) {
    let d: number | null = null;
    rows.forEach((row, a) => {
      const f = row[q];
      for (const m of f.m) {
        const e = m[1] + rowDegrees[a];
        if (d === null) d = e;
        else if (d !== e) throw runtimeError("columnDegrees", `column ${q + 1} is not homogeneous`);
      }
    });
    out.push(d ?? fallback);
  }
  return out;
}

/// A minimal presentation of coker(A) (A homogeneous, rows in degrees rowDegrees): the first
/// differential of its minimal graded free resolution and the degrees of its target.
export function minimalPresentation(
  R: PolyRing,
  rows: readonly (readonly Poly[])[],
  rowDegrees: readonly number[],
  opts?: ComputeOptions,
): Presentation {
  // the frame works with basis elements in non-negative degrees: shift and shift back
  const shift = -Math.min(0, ...rowDegrees);
  const C = resolveCoker(
    R,
    rows,
    rowDegrees.map((d) => d + shift),
    { ...opts, length: 1 },
  );
  const degs = (C.degrees[0] ?? []).map((d) => d - shift);
  return { rows: C.length >= 1 ? C.map(1) : degs.map(() => []), rowDegrees: degs };
}

/// A presentation of the subquotient (Z + B) / B of a free module F = ⊕ R(−f_a), for Z and B
/// given by columns (matrices with rank F rows): generators the columns z_q of Z, relations the
/// Z-parts of the syzygies of [Z | B] (common practice), then minimised.
export function subquotientPresentation(
  R: PolyRing,
  Z: readonly (readonly Poly[])[],
  B: readonly (readonly Poly[])[],
  freeDegrees: readonly number[],
  opts?: ComputeOptions,
): Presentation {
  // zero columns of Z generate nothing
  const keep = Array.from({ length: Z[0]?.length ?? 0 }, (_, q) => q).filter((q) => Z.some((row) => row[q].m.length > 0));
  if (keep.length === 0) return { rows: [], rowDegrees: [] };
  const Zk = Z.map((row) => keep.map((q) => row[q]));
  const zDeg = columnDegrees(Zk, freeDegrees);
  const bDeg = columnDegrees(B, freeDegrees);
  const joined = freeDegrees.map((_, a) => [...Zk[a], ...(B[a] ?? [])]);
  const K = moduleKernel(R, joined, [...zDeg, ...bDeg], freeDegrees, opts);
  const rel = zDeg.map((_, q) => K.map((v) => v[q]));
  return minimalPresentation(R, rel, zDeg, opts);
}
