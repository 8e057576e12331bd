import type { Mono } from "../monomial/monomial";
import type { Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { ComputeOptions, Ticker } from "../options";

/// An element of the basis under construction: monic, with its sugar degree
/// (A. Giovini, T. Mora, G. Niesi, L. Robbiano, C. Traverso, "One sugar cube, please",
/// ISSAC 1991).
export interface BasisElt {
  readonly poly: Poly;
  readonly lm: Mono;
  readonly sugar: number;
}

/// A critical pair (i, j) of basis indices, or an input polynomial still to be reduced
/// (j = -1, i indexing the inputs).
export interface Pair {
  readonly i: number;
  readonly j: number;
  readonly lcm: Mono;
  readonly sugar: number;
}

/// The reducers currently available: indices into `elts` of the elements kept by the
/// Gebauer–Möller update.
export interface Basis {
  readonly elts: BasisElt[];
  readonly active: number[];
}

/// One reduction step: the remainders of a batch of pairs modulo the current basis.
/// `reducePairwise` handles one pair at a time; a matrix (F4) step may take many.
export type ReductionStep = <C>(
  R: RingCtx<C>,
  batch: Pair[],
  inputs: readonly Poly[],
  basis: Basis,
  opts: ComputeOptions | undefined,
  ticker: Ticker,
) => Reduced<C>[];

/// A remainder with its sugar.
export interface Reduced<C> {
  m: Mono[];
  c: C[];
  sugar: number;
}

/// How the main loop picks the next batch of pairs and reduces it.
export interface Strategy {
  /// Queue pairs by sugar (else by lcm alone).
  bySugar: boolean;
  /// Removes the next batch from the front of the sorted pair list.
  select(pairs: Pair[]): Pair[];
  reduce: ReductionStep;
  /// The reduced basis from the basis found (over GF(p) only when set; else element by
  /// element with geobuckets).
  finish?: (R: RingCtx<number>, G: readonly Poly[], opts: ComputeOptions | undefined) => Poly[];
}
