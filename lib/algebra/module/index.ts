export { type FreeModule, freeModule, freeRank } from "./free";
export { type ModuleOrder, termOverPosition, positionOverTerm, schreyerOrder } from "./order";
export { moduleGroebnerBasis, moduleSyzygies, type ModuleOrderKind } from "./api";
export { moduleHilbertSeries } from "./hilbert";
export { moduleKernel } from "./kernel";
