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

export const DEFAULT_LIMITS: EvalLimits = {
  maxPolyExponent: 10_000,
  maxIdealPower: 200,
  maxIntegerBits: 1_000_000,
  maxListLength: 1_000_000,
  maxCallDepth: 200,
  maxHilbertDegree: 100_000,
};
