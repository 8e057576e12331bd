import { limitError } from "../errors";

/// The "maxTerms" limit error for a division that grew too many terms.
export function internalLimit(value: number, bound: number) {
  return limitError("maxTerms", `a module division reached ${value} terms, above the limit maxTerms = ${bound}`);
}
