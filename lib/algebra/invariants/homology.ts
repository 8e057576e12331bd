import { runtimeError } from "../errors";
import { moduleKernel } from "../module/kernel";
import { checkpoint, type ComputeOptions } from "../options";
import { constPoly } from "../poly/arith";
import { makePoly, type Poly } from "../poly/poly";
import { ringCtx, type PolyRing } from "../poly/ring";
import { columnDegrees, subquotientPresentation } from "../resolution/schreyer/presentation";
import { resolveCoker, type Resolution } from "../resolution/schreyer/resolve";
import type { Presentation } from "../resolution/schreyer/syzygy";

type Matrix = Poly[][];

const ZERO = makePoly([], []);

function zeros(r: number, c: number): Matrix {
  return Array.from({ length: r }, () => new Array<Poly>(c).fill(ZERO));
}

/// A ⊗ 1 on F ⊗ G for A: F' ← F and G of rank g: rows (p, c) ↦ p·g + c.
function kronLeft(A: readonly (readonly Poly[])[], cols: number, g: number): Matrix {
  const out = zeros(A.length * g, cols * g);
  A.forEach((row, p) =>
    row.forEach((f, q) => {
      if (f.m.length === 0) return;
      for (let c = 0; c < g; c++) out[p * g + c][q * g + c] = f;
    }),
  );
  return out;
}

/// 1_F ⊗ B on F ⊗ G for B: G ← G' (rank F = f).
function kronRight(f: number, B: readonly (readonly Poly[])[], g: number): Matrix {
  const bc = B[0]?.length ?? 0;
  const out = zeros(f * g, f * bc);
  for (let p = 0; p < f; p++) B.forEach((row, c) => row.forEach((e, r) => (out[p * g + c][p * bc + r] = e)));
  return out;
}

const hcat = (A: Matrix, B: Matrix): Matrix => A.map((row, a) => [...row, ...B[a]]);
const transpose = (A: readonly (readonly Poly[])[], cols: number): Matrix => Array.from({ length: cols }, (_, q) => A.map((row) => row[q]));

function identity(R: PolyRing, n: number): Matrix {
  const one = constPoly(ringCtx(R), ringCtx(R).K.one);
  return Array.from({ length: n }, (_, a) => Array.from({ length: n }, (_, b) => (a === b ? one : ZERO)));
}

/// The cycles of a complex of cokernels at one spot: the elements z of the free module F (degrees
/// `src`) with φ(z) ∈ image(rel) in F' (degrees `tgt`), as columns (first coordinates of ker [φ | rel]).
function cycles(R: PolyRing, phi: Matrix, rel: Matrix, src: readonly number[], tgt: readonly number[], opts?: ComputeOptions): Matrix {
  const joined = hcat(phi, rel);
  const K = moduleKernel(R, joined, [...src, ...columnDegrees(rel, tgt)], tgt, opts);
  return Array.from({ length: src.length }, (_, a) => K.map((v) => v[a]));
}

/// A graded module shifted so that its generators sit in degrees ≥ 0 (resolutions want it).
function nonNegative(M: Presentation): { M: Presentation; shift: number } {
  const shift = -Math.min(0, ...M.rowDegrees);
  return { M: { rows: M.rows, rowDegrees: M.rowDegrees.map((d) => d + shift) }, shift };
}

function resolveUpTo(R: PolyRing, M: Presentation, length: number, opts?: ComputeOptions): Resolution {
  return resolveCoker(R, M.rows, M.rowDegrees, { ...opts, length });
}

const shifted = (P: Presentation, s: number): Presentation => ({ rows: P.rows, rowDegrees: P.rowDegrees.map((d) => d + s) });

function checkIndex(i: number, where: string): void {
  if (!Number.isInteger(i) || i < 0) throw runtimeError(where, `the index must be a non-negative integer, got ${i}`);
}

/// Tor_i(M, N) = H_i(F ⊗ N) for the minimal free resolution F of M, presented minimally as a
/// subquotient of F_i ⊗ G_0 (N = coker(G_0 ← G_1)); common practice, e.g. D. Eisenbud,
/// Commutative Algebra, §6.2 and A3.
export function torModule(R: PolyRing, i: number, Min: Presentation, N: Presentation, opts?: ComputeOptions): Presentation {
  checkIndex(i, "torModule");
  const { M, shift } = nonNegative(Min);
  const F = resolveUpTo(R, M, i + 1, opts);
  if (i > F.length) return { rows: [], rowDegrees: [] };
  checkpoint(opts, { stage: "Tor", detail: `homology in homological degree ${i}` });
  const g = N.rowDegrees.length;
  const deg = (k: number) => F.degrees[k].flatMap((a) => N.rowDegrees.map((c) => a + c));
  const rel = (k: number) => kronRight(F.ranks[k], N.rows, g);
  const here = deg(i);
  const Z = i === 0 ? identity(R, here.length) : cycles(R, kronLeft(F.map(i), F.ranks[i], g), rel(i - 1), here, deg(i - 1), opts);
  const B = i < F.length ? hcat(kronLeft(F.map(i + 1), F.ranks[i + 1], g), rel(i)) : rel(i);
  return shifted(subquotientPresentation(R, Z, B, here, opts), -shift);
}

/// Ext^i(M, N) = H^i(Hom(F, N)) with Hom(F_k, N) = F_k^* ⊗ N, F_k^* = ⊕ S(a) for F_k = ⊕ S(−a),
/// and the maps d_{k+1}^T ⊗ 1, presented minimally as a subquotient (common practice, e.g.
/// D. Eisenbud, Commutative Algebra, A3.11).
export function extModule(R: PolyRing, i: number, Min: Presentation, N: Presentation, opts?: ComputeOptions): Presentation {
  checkIndex(i, "extModule");
  const { M, shift } = nonNegative(Min);
  const F = resolveUpTo(R, M, i + 1, opts);
  if (i > F.length) return { rows: [], rowDegrees: [] };
  checkpoint(opts, { stage: "Ext", detail: `cohomology in homological degree ${i}` });
  const g = N.rowDegrees.length;
  const deg = (k: number) => F.degrees[k].flatMap((a) => N.rowDegrees.map((c) => c - a));
  const rel = (k: number) => kronRight(F.ranks[k], N.rows, g);
  // ψ_k: Hom(F_k, N) → Hom(F_{k+1}, N)
  const psi = (k: number) => kronLeft(transpose(F.map(k + 1), F.ranks[k + 1]), F.ranks[k], g);
  const here = deg(i);
  const Z = i === F.length ? identity(R, here.length) : cycles(R, psi(i), rel(i + 1), here, deg(i + 1), opts);
  const B = i > 0 ? hcat(psi(i - 1), rel(i)) : rel(i);
  // Hom(M(−s), N) = Hom(M, N)(s): undo the shift of M
  return shifted(subquotientPresentation(R, Z, B, here, opts), shift);
}
