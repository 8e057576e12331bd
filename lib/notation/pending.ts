/// The runtime Error for a name the checker accepts but whose engine part has not landed.
import type { Span } from "../../grammar/ast";
import type { EnginePart } from "../../grammar/signatures";
import { EvalError } from "./errors";

const PART_CONTENTS: Record<EnginePart, string> = {
  0: "the evaluator",
  1: "fields, polynomials, Gröbner bases, ideals and Hilbert series",
  2: "modules, resolutions over polynomial rings, Tor/Ext, depth, pd and regularity",
  3: "quotient-ring and Artinian invariants, Burch ideals, Poincaré series and families",
};

export function pendingError(what: string, part: EnginePart, span: Span): EvalError {
  return new EvalError("runtime", `${what} is provided by engine part ${part} (${PART_CONTENTS[part]}), which is not available yet`, span);
}
