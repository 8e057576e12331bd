import { runtimeError } from "../errors";
import type { Ideal } from "../ideal/ideal";
import { freeModule } from "../module/free";
import { moduleHilbertSeries } from "../module/hilbert";
import type { ComputeOptions } from "../options";
import { makePoly, type Poly } from "../poly/poly";
import { ringCtx, sameRing, type PolyRing } from "../poly/ring";
import { regularity } from "../resolution/schreyer/invariants";
import { resolveCoker } from "../resolution/schreyer/resolve";
import { type Presentation } from "../resolution/schreyer/syzygy";
import { gradedModule, gradedPiece, gradedRank } from "./graded";

/// The presentation of S/I: the 1×m matrix of I's generators.
export function quotientPresentation(I: Ideal): Presentation {
  return { rows: [[...I.gens]], rowDegrees: [0] };
}

/// M ⊗ N presented by [A ⊗ 1 | 1 ⊗ B] on the rows (a, c) (common practice).
function tensorPresentation(M: Presentation, N: Presentation): Presentation {
  const zero = makePoly([], []);
  const m0 = M.rowDegrees.length,
    n0 = N.rowDegrees.length;
  const rowDegrees: number[] = [];
  for (let a = 0; a < m0; a++) for (let c = 0; c < n0; c++) rowDegrees.push(M.rowDegrees[a] + N.rowDegrees[c]);
  const cols: Poly[][] = [];
  const mc = M.rows[0]?.length ?? 0,
    nc = N.rows[0]?.length ?? 0;
  for (let q = 0; q < mc; q++) {
    for (let c = 0; c < n0; c++) {
      const col = new Array<Poly>(m0 * n0).fill(zero);
      for (let a = 0; a < m0; a++) col[a * n0 + c] = M.rows[a][q];
      cols.push(col);
    }
  }
  for (let a = 0; a < m0; a++) {
    for (let r = 0; r < nc; r++) {
      const col = new Array<Poly>(m0 * n0).fill(zero);
      for (let c = 0; c < n0; c++) col[a * n0 + c] = N.rows[c][r];
      cols.push(col);
    }
  }
  return { rows: rowDegrees.map((_, k) => cols.map((col) => col[k])), rowDegrees };
}

/// ℓ(Tor_i(M, N)) for i = 0…pd M, for graded modules given by homogeneous presentations with
/// M ⊗ N of finite length: the homology of F ⊗ N for the minimal resolution F of M, degree by
/// degree by linear algebra over k. Tor_i is then of finite length and vanishes above degree
/// reg M + reg N + i (D. Eisenbud, C. Huneke, B. Ulrich, "The regularity of Tor and graded
/// Betti numbers", Amer. J. Math. 128, 2006, Cor. 3.1 — cited from memory).
export function torLengthsOf(R: PolyRing, M: Presentation, N: Presentation, opts?: ComputeOptions): number[] {
  const T = tensorPresentation(M, N);
  const cols = T.rows[0]?.length ?? 0;
  const hs = moduleHilbertSeries(
    freeModule(R, T.rowDegrees),
    Array.from({ length: cols }, (_, q) => T.rows.map((row) => row[q])),
    opts,
  );
  if (hs.dimension > 0) {
    throw runtimeError(
      "torLengths",
      `M ⊗ N is not of finite length (it has dimension ${hs.dimension}); Tor lengths need a finite-length tensor product`,
    );
  }
  const F = resolveCoker(R, M.rows, M.rowDegrees, opts);
  if (hs.dimension < 0) return F.ranks.map(() => 0);
  const G = resolveCoker(R, N.rows, N.rowDegrees, opts);
  const bound = regularity(F) + regularity(G);
  const Nm = gradedModule(ringCtx(R), N.rows, N.rowDegrees, opts);
  const low = Math.min(0, ...N.rowDegrees) + Math.min(0, ...F.degrees.flat());
  const out: number[] = [];
  for (let i = 0; i <= F.length; i++) {
    let len = 0;
    for (let d = low; d <= bound + i; d++) {
      const here = gradedPiece(Nm, F.degrees[i], d);
      if (here.basis.length === 0) continue;
      const down = i > 0 ? gradedRank(Nm, F.map(i), here, gradedPiece(Nm, F.degrees[i - 1], d), opts) : 0;
      const up = i < F.length ? gradedRank(Nm, F.map(i + 1), gradedPiece(Nm, F.degrees[i + 1], d), here, opts) : 0;
      len += here.basis.length - down - up;
    }
    out.push(len);
  }
  return out;
}

/// ℓ(Tor_i(S/I, S/J)).
export function torLengths(I: Ideal, J: Ideal, opts?: ComputeOptions): number[] {
  if (!sameRing(I.ring, J.ring)) throw runtimeError("torLengths", "the ideals live in different rings");
  return torLengthsOf(I.ring, quotientPresentation(I), quotientPresentation(J), opts);
}

/// Serre's intersection multiplicity χ(M, N) = Σ_i (−1)^i ℓ(Tor_i(M, N))
/// (J.-P. Serre, Algèbre locale, multiplicités, 1965).
export function serreMultiplicityOf(R: PolyRing, M: Presentation, N: Presentation, opts?: ComputeOptions): number {
  return torLengthsOf(R, M, N, opts).reduce((s, l, i) => s + (i % 2 === 0 ? l : -l), 0);
}

/// χ(S/I, S/J).
export function serreMultiplicity(I: Ideal, J: Ideal, opts?: ComputeOptions): number {
  return serreMultiplicityOf(I.ring, quotientPresentation(I), quotientPresentation(J), opts);
}
