import { LIMIT_TABLE } from "../limits";

/// Bounds that keep one evaluation from exhausting the machine; exceeding one is an
/// Error of kind "limit" at the expression that asked for too much.
export interface EvalLimits {
  /// largest exponent in f^k for a polynomial f (and in I^k for an ideal, see maxIdealPower)
  readonly maxPolyExponent: number;
  readonly maxIdealPower: number;
  /// largest bit length of an integer result of ^
  readonly maxIntegerBits: number;
  /// longest List a range or comprehension may build
  readonly maxListLength: number;
  /// deepest nesting of function calls
  readonly maxCallDepth: number;
  /// largest d in H.at(d) and H.values(d)
  readonly maxHilbertDegree: number;
}

/// The values of lib/limits.ts, the one table of limits (README.md, "Limits").
export const DEFAULT_LIMITS: EvalLimits = {
  maxPolyExponent: LIMIT_TABLE.polyExponent.value,
  maxIdealPower: LIMIT_TABLE.idealPower.value,
  maxIntegerBits: LIMIT_TABLE.integerBits.value,
  maxListLength: LIMIT_TABLE.listLength.value,
  maxCallDepth: LIMIT_TABLE.callDepth.value,
  maxHilbertDegree: LIMIT_TABLE.hilbertDegree.value,
};
