export {
  resolveDegreewise,
  type BettiColumn,
  type DegreeData,
  type LocalResolveOptions,
  type QuotientResolution,
  type ResolveRequest,
  type ModulePresentation,
} from "./resolve";
export { GradedFree } from "./free";
export { residueFieldResolution, cyclicResolution, bettiTotalsOf, variablesOf } from "./residue";
export { residueSplitsFromSyzygy, moduleSocle } from "./summand";
