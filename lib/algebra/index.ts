/// The public interface of the algebra engine. Callers outside lib/algebra import only from
/// here; this file only re-exports (files inside the engine import their neighbours directly).
export { AlgebraError, type AlgebraErrorKind } from "./errors";
export { gf, QQ, fieldName, type Field, type PrimeField } from "./field/field";
export { isPrime } from "./field/prime";
export { type Rat, ratOf, ratAdd, ratSub, ratMul, ratDiv, ratNeg, ratCompare, ratToString, parseRat } from "./field/rational";
export type { OrderSpec } from "./order/order";
export { orderName } from "./order/order";
export { polyRing, sameRing, type PolyRing } from "./poly/ring";
export { Poly } from "./poly/poly";
export { checkpoint, checkLimit, Ticker, type ComputeOptions, type ProgressInfo } from "./options";
export {
  zero,
  one,
  constant,
  variable,
  monomial,
  add,
  sub,
  neg,
  mul,
  pow,
  scale,
  isZero,
  equals,
  termCount,
  terms,
  leadExponents,
  leadCoefficient,
  degree,
  isHomogeneous,
  formatPoly,
  parsePoly,
} from "./poly/checked";
export { groebnerBasis, normalForm } from "./groebner/checked";

export * from "./hilbert";
export * from "./ideal";
export * from "./quotient";
export * from "./module";
export * from "./resolution/index";
export * from "./invariants";
export * from "./graded";
export * from "./artinian";
export * from "./series";
export * from "./burch";
export * from "./standard";
export * from "./localring";
// families of examples for experiments (notation.md §11)
export * from "./families";
