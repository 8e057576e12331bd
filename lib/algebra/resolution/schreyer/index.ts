export { type BettiTable, type BettiColumn, bettiNumber, bettiTotals, bettiRegularity, bettiAlternatingSum } from "./betti";
export { type Resolution, type ResolveOptions, resolveQuotient, resolveCoker } from "./resolve";
export { projectiveDimension, depthByAuslanderBuchsbaum, regularity } from "./invariants";
export { type Presentation, syzygyPresentation } from "./syzygy";
export { resolutionHilbertSeries } from "./hilbert";
export { type QuotientProperties, quotientProperties } from "./quotient";
export { columnDegrees, minimalPresentation, subquotientPresentation } from "./presentation";
