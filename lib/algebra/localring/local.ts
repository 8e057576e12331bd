import { runtimeError } from "../errors";
import type { ComputeOptions } from "../options";
import { type Poly } from "../poly/poly";
import { type PolyRing, polyRing } from "../poly/ring";
import { type HilbertSeries, hilbertFunctionValues, hilbertSeriesOfMonomials } from "../hilbert/series";
import { type StandardBasis, initialForm, standardBasis } from "../standard/basis";
import { monomial, add, zero } from "../poly/checked";
import { derivative, translate, type Point } from "./translate";

/// The local ring S_m/I·S_m of S/I at a rational point, read through a standard basis of the
/// translated ideal (lib/algebra/standard). Invariants of a local ring from its tangent cone
/// gr_m(R) = S/in(I), whose Hilbert function is that of S/L(I), L(I) the leading ideal of a
/// standard basis for a local degree order (G.-M. Greuel, G. Pfister, A Singular Introduction to
/// Commutative Algebra, §5.5, cited from memory): dim R = dim gr R, the Hilbert–Samuel function
/// d ↦ ℓ(R/m^(d+1)) = Σ_{i ≤ d} HF_gr(i), the multiplicity e(m, R) = deg gr R, the embedding
/// dimension HF_gr(1), and ℓ(R) = Σ HF_gr when dim R = 0.
export interface LocalAnalysis {
  readonly ring: PolyRing;
  /// the ideal with the point moved to the origin
  readonly ideal: readonly Poly[];
  readonly standard: StandardBasis;
  /// true when I·S_m = S_m (the point is not on V(I))
  readonly zero: boolean;
  /// Hilbert series of the tangent cone (standard grading)
  readonly tangentSeries: HilbertSeries;
}

export function localAnalysis(S: PolyRing, gens: readonly Poly[], at: Point | null, opts?: ComputeOptions): LocalAnalysis {
  const I = at ? gens.map((f) => translate(S, f, at)) : [...gens];
  const standard = standardBasis(S, I, opts);
  const zeroRing = standard.leads.some((e) => e.every((x) => x === 0));
  const tangentSeries = hilbertSeriesOfMonomials(
    standard.leadIdeal as number[][],
    S.vars.map(() => 1),
    opts,
  );
  return { ring: S, ideal: I, standard, zero: zeroRing, tangentSeries };
}

function requireNonzero(L: LocalAnalysis, what: string): void {
  if (L.zero) throw runtimeError(what, "the local ring is zero: the point does not lie on the zero set of the ideal");
}

/// Krull dimension of the local ring.
export function localDimension(L: LocalAnalysis): number {
  requireNonzero(L, "dim");
  return L.tangentSeries.dimension;
}

/// The Hilbert–Samuel multiplicity e(m, R) (the degree of the tangent cone).
export function localMultiplicity(L: LocalAnalysis): bigint {
  requireNonzero(L, "multiplicity");
  const d = L.tangentSeries.degree;
  if (d.d !== 1n) throw runtimeError("multiplicity", "internal: a fractional degree in the standard grading");
  return d.n;
}

/// ℓ(R/m^(d+1)) for d = 0 … top.
export function samuelValues(L: LocalAnalysis, top: number, opts?: ComputeOptions): bigint[] {
  if (L.zero) return new Array<bigint>(top + 1).fill(0n);
  const hf = hilbertFunctionValues(L.tangentSeries, top, opts);
  let acc = 0n;
  return hf.map((v) => (acc += v));
}

/// dim_k m/m² of the local ring.
export function localEmbeddingDimension(L: LocalAnalysis, opts?: ComputeOptions): number {
  requireNonzero(L, "embdim");
  return Number(hilbertFunctionValues(L.tangentSeries, 1, opts)[1]);
}

/// ℓ(R) when it is finite (dim R = 0), else null.
export function localLength(L: LocalAnalysis): bigint | null {
  if (L.zero) return 0n;
  if (L.tangentSeries.dimension > 0) return null;
  return L.tangentSeries.degree.n;
}

/// The tangent cone's ideal: the initial forms of the standard basis, which generate in(I)
/// (Greuel–Pfister §5.5, from memory), in the standard-graded grevlex ring on S's variables.
export function tangentConeIdeal(L: LocalAnalysis): { ring: PolyRing; gens: Poly[] } {
  const S = L.ring;
  const T = polyRing(S.field, S.vars);
  const gens = L.standard.basis.map((f) => initialForm(S, f).reduce((acc, t) => add(T, acc, monomial(T, t.exps, t.num, t.den)), zero(T)));
  return { ring: T, gens };
}

/// The Milnor number μ = dim_k S_m/(∂f/∂x_1, …, ∂f/∂x_n) and the Tjurina number
/// τ = dim_k S_m/(f, ∂f/∂x_i) at the point (J. Milnor, Singular Points of Complex
/// Hypersurfaces, 1968; G. N. Tjurina 1969); an error when it is infinite, i.e. when the
/// singularity is not isolated.
export function milnorNumber(S: PolyRing, f: Poly, at: Point | null, opts?: ComputeOptions): bigint {
  const g = at ? translate(S, f, at) : f;
  return finiteLength(
    localAnalysis(
      S,
      S.vars.map((_, i) => derivative(S, g, i)),
      null,
      opts,
    ),
    "milnor",
  );
}

export function tjurinaNumber(S: PolyRing, f: Poly, at: Point | null, opts?: ComputeOptions): bigint {
  const g = at ? translate(S, f, at) : f;
  return finiteLength(localAnalysis(S, [g, ...S.vars.map((_, i) => derivative(S, g, i))], null, opts), "tjurina");
}

function finiteLength(L: LocalAnalysis, what: string): bigint {
  const len = localLength(L);
  if (len === null) {
    throw runtimeError(
      what,
      `the singularity is not isolated: the ideal of partial derivatives defines a set of dimension ${L.tangentSeries.dimension} through the point, so the number is infinite`,
    );
  }
  return len;
}
