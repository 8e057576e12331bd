// The part of the engine's public interface that the graded pieces use.
export {
  Poly,
  type PolyRing,
  isZero,
  leadExponents,
  monomial,
  normalForm,
  terms,
  add,
  mul,
  variable,
} from "../index";
export { type Ideal, ideal, idealGroebnerBasis, idealSum } from "../ideal";
export { coeffsOf, type Coeffs } from "../field/coeffs";
