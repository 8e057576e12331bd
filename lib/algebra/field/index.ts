export { gf, QQ, fieldName, type Field, type PrimeField } from "./field";
export { isPrime, previousPrime } from "./prime";
export { type Coeffs, type GFCoeffs, gfCoeffs, qCoeffs, coeffsOf, formatCoeff } from "./coeffs";
export { type Rat } from "./rational";
