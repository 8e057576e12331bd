// The part of the engine's public interface (lib/algebra/index.ts) that local rings use.
export {
  Poly,
  type PolyRing,
  add,
  constant,
  isZero,
  monomial,
  mul,
  polyRing,
  pow,
  sub,
  terms,
  variable,
  zero,
  formatPoly,
} from "../index";
export { hilbertSeriesOfMonomials, hilbertFunctionValues, type HilbertSeries } from "../hilbert";
export { standardBasis, initialForm, type StandardBasis } from "../standard";
