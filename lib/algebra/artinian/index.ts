export { FiniteAlgebra } from "./algebra";
export { componentAtOrigin, localAlgebraAtOrigin, originIdeal } from "./origin";
export { minimalGeneratorCount, minimalGeneratorPositions } from "./generators";
export { resolveLocalArtinian, type LocalResolution } from "./resolve";
