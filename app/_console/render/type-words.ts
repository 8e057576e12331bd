/// The type tag beside a value, in words a reader says ("Hilbert series", not
/// "HilbertSeries"); a type this list does not know is split at its capitals.
const WORDS: Readonly<Record<string, string>> = {
  Int: "integer",
  Rat: "rational number",
  Bool: "truth value",
  Str: "text",
  Field: "field",
  Ring: "ring",
  Poly: "polynomial",
  Ideal: "ideal",
  Matrix: "matrix",
  Module: "module",
  // every Complex the notation makes is a complex of free modules; resolve's are resolutions
  Complex: "free resolution",
  BettiTable: "Betti table",
  HilbertSeries: "Hilbert series",
  Series: "power series",
  List: "list",
  Record: "record",
  Table: "table",
  Function: "function",
  Family: "family",
  Experiment: "experiment",
  None: "nothing",
  Error: "error",
};

export function typeWords(type: string): string {
  return WORDS[type] ?? type.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
}
