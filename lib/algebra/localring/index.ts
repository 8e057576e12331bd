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
