import { runtimeError } from "../errors";
import {
  idealDimension,
  idealGroebnerBasis,
  idealSum,
  leadExponents,
  sameRing,
  type Ideal,
} from "../index";
import type { ComputeOptions } from "../options";
import { regularity, resolveQuotient } from "../resolution";
import { gradedPiece, gradedRank } from "./graded";

/// ℓ(Tor_i(S/I, S/J)) for i = 0…pd(S/I), for homogeneous I, J with S/(I + J) of finite length:
/// the homology of F ⊗ S/J for the minimal resolution F of S/I, degree by degree by linear
/// algebra over k. Tor_i is then of finite length and lives in degrees ≤ reg S/I + reg S/J + i
/// (D. Eisenbud, C. Huneke, B. Ulrich, "The regularity of Tor and graded Betti numbers",
/// Amer. J. Math. 128, 2006, Cor. 3.1 — cited from memory).
export function torLengths(I: Ideal, J: Ideal, opts?: ComputeOptions): number[] {
  if (!sameRing(I.ring, J.ring)) throw runtimeError("torLengths", "the ideals live in different rings");
  const R = I.ring;
  const dim = idealDimension(idealSum(I, J), opts);
  if (dim > 0) throw runtimeError("torLengths", `M ⊗ N is not of finite length (it has dimension ${dim}); Tor lengths need a finite-length tensor product`);
  const F = resolveQuotient(I, opts);
  if (dim < 0) return F.ranks.map(() => 0);
  const bound = regularity(F) + regularity(resolveQuotient(J, opts));
  const G = idealGroebnerBasis(J, opts);
  const lead = G.map((g) => leadExponents(R, g));
  const w = R.degrees;
  const out: number[] = [];
  for (let i = 0; i <= F.length; i++) {
    let len = 0;
    for (let d = 0; d <= bound + i; d++) {
      const here = gradedPiece(w, lead, F.degrees[i], d);
      if (here.dim === 0) continue;
      const down = i > 0 ? gradedRank(R, F.map(i), here, gradedPiece(w, lead, F.degrees[i - 1], d), G, opts) : 0;
      const up = i < F.length ? gradedRank(R, F.map(i + 1), gradedPiece(w, lead, F.degrees[i + 1], d), here, G, opts) : 0;
      len += here.dim - down - up;
    }
    out.push(len);
  }
  return out;
}

/// Serre's intersection multiplicity χ(S/I, S/J) = Σ_i (−1)^i ℓ(Tor_i(S/I, S/J))
/// (J.-P. Serre, Algèbre locale, multiplicités, 1965).
export function serreMultiplicity(I: Ideal, J: Ideal, opts?: ComputeOptions): number {
  return torLengths(I, J, opts).reduce((s, l, i) => s + (i % 2 === 0 ? l : -l), 0);
}

