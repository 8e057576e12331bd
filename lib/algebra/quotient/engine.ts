// The part of the engine's public interface (lib/algebra/index.ts) that quotient rings use.
export { type Poly, type PolyRing, add, isZero, mul, normalForm, one, sameRing, sub } from "../index";
