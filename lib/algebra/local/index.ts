export {
  resolveDegreewise,
  type BettiColumn,
  type DegreeData,
  type LocalResolveOptions,
  type QuotientResolution,
  type ResolveRequest,
} from "./resolve";
export { GradedFree } from "./free";
export { residueFieldResolution, cyclicResolution, bettiTotalsOf, variablesOf } from "./residue";
export { residueSplitsFromSyzygy } from "./summand";
