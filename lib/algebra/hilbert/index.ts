export type { Exponents } from "./monomials";
export { minimalMonomialGenerators, monomialDivides, monomialLcm, monomialColon } from "./monomials";

export type { HilbertSeries } from "./series";
export {
  hilbertSeriesOfMonomials,
  hilbertSeriesFromNumerator,
  hilbertFunctionAt,
  hilbertFunctionValues,
  isStandardGrading,
} from "./series";
export { hilbertPolynomial, evaluateHilbertPolynomial } from "./polynomial";
export { formatUnivariate, formatHilbertDenominator } from "./format";
