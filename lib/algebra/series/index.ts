export {
  type TruncatedSeries,
  truncatedSeries,
  seriesAt,
  expandRational,
  expandRationalQ,
  polyMulZ,
  polyPowZ,
  sameRationalFunction,
} from "./power";
export { guessRational, type RationalGuess } from "./guess";
export { eventualPeriod } from "./period";
export { poincareSeries, type PoincareSeries } from "./poincare";
