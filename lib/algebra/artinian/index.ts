export { FiniteAlgebra } from "./algebra";
export { componentAtOrigin, localAlgebraAtOrigin, originIdeal } from "./origin";
export { minimalGeneratorCount, minimalGeneratorPositions } from "./generators";
