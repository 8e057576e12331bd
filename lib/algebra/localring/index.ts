export { translate, derivative, type Point } from "./translate";
export {
  localAnalysis,
  localDimension,
  localMultiplicity,
  samuelValues,
  localEmbeddingDimension,
  localLength,
  tangentConeIdeal,
  milnorNumber,
  tjurinaNumber,
  type LocalAnalysis,
} from "./local";
export { localResolution, isLocalUnit, type LocalFreeResolution } from "./resolve";
export { localTorLengths } from "./tor";
export { kernelColumns, localModuleNumerator, localQuotientLength, type Columns } from "./modules";
export { subquotientLength, scalarBlocks, bassNumbers, homologyModule, type PresentedModule } from "./homology";
