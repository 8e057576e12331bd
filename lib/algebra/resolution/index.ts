/// Minimal free resolutions: the dispatcher (dispatch.ts) and the three methods it chooses
/// among, each in a folder named by how it works.
export {
  minimalResolution,
  resolutionMethod,
  type DispatchedResolution,
  type FinishedColumn,
  type ResolutionInput,
  type ResolutionMethod,
  type ResolutionRequest,
  type ResolvedModule,
} from "./dispatch";
export * from "./schreyer/index";
// graded-quotient/'s BettiColumn is its own shape (per-degree data over S/J); it stays there.
export {
  resolveDegreewise,
  residueFieldResolution,
  cyclicResolution,
  bettiTotalsOf,
  residueSplitsFromSyzygy,
  moduleSocle,
  type ModulePresentation,
  GradedFree,
  type DegreeData,
  type LocalResolveOptions,
  type QuotientResolution,
  type ResolveRequest,
} from "./graded-quotient/index";
export { resolveLocalArtinian, type LocalResolution } from "./artinian/resolve";
