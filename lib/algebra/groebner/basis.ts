import type { Mono } from "../monomial/monomial";
import type { Poly } from "../poly/poly";

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
