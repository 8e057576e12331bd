// The part of the engine's public interface (lib/algebra/index.ts) that standard bases use:
// one place to repoint when the public polynomial functions move.
export {
  Poly,
  type PolyRing,
  add,
  constant,
  groebnerBasis,
  isZero,
  monomial,
  mul,
  polyRing,
  pow,
  terms,
  variable,
  zero,
} from "../index";
