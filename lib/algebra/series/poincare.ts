import { guessRational, type RationalGuess } from "./guess";
import { truncatedSeries, type TruncatedSeries } from "./power";

/// The Poincaré series Σ β_i t^i of a module from its Betti totals (the exact ones), with a
/// rational function that fits every term or null when too few terms are known.
export interface PoincareSeries {
  series: TruncatedSeries;
  rational: RationalGuess | null;
}

export function poincareSeries(bettiTotals: readonly number[]): PoincareSeries {
  const series = truncatedSeries(bettiTotals);
  return { series, rational: guessRational(series) };
}
