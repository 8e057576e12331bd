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
  groebnerBasis,
  normalForm,
} from "../index";
export { moduleKernel, moduleGroebnerBasis, freeModule } from "../module";
export { hilbertSeriesOfMonomials, hilbertFunctionValues, type HilbertSeries } from "../hilbert";
export { standardBasis, initialForm, type StandardBasis, homogenisation, homogenise, dehomogenise, totalDegree } from "../standard";
