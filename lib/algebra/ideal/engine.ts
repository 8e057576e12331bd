// The part of the engine's public interface (lib/algebra/index.ts) that ideal operations use.
export {
  Poly,
  type PolyRing,
  groebnerBasis,
  isHomogeneous,
  isZero,
  leadExponents,
  monomial,
  mul,
  normalForm,
  one,
  sameRing,
  sub,
  variable,
} from "../index";
