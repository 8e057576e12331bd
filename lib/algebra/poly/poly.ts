import type { Mono } from "../monomial/monomial";

/// A polynomial: terms sorted by decreasing monomial, no zero coefficients.
/// Immutable: no function changes the arrays of a Poly it was given or returned.
/// `c` holds numbers in [0, p) over GF(p) and Rat values over Q.
export class Poly {
  constructor(
    readonly m: readonly Mono[],
    readonly c: readonly unknown[],
  ) {}
}

/// Internal view with the coefficient type fixed by the ring.
export interface PolyOf<C> {
  readonly m: readonly Mono[];
  readonly c: readonly C[];
}

export function makePoly<C>(m: Mono[], c: C[]): Poly {
  return new Poly(m, c);
}

export const asTyped = <C>(f: Poly): PolyOf<C> => f as unknown as PolyOf<C>;
