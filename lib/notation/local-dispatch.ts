/// Which implementation answers for a local ring (issue 16): a value that lives over a ring
/// made by `localize` is read at its point by the implementations in local.ts and
/// local-homology.ts; names that have no local reading are refused there with the reason,
/// never answered by the graded code (which would silently read the ring globally).
import type { CallContext } from "./context";
import { runtime } from "./errors";
import { LOCAL_FUNCTIONS as LOCAL_FUNCTIONS_OF_RINGS, LOCAL_GENERAL_PROPERTIES, LOCAL_RING_PROPERTIES } from "./local";
import { LOCAL_HOMOLOGY_FUNCTIONS, LOCAL_HOMOLOGY_PROPERTIES } from "./local-homology";
import type { RingValue, Value } from "./values";

export { LOCAL_GENERAL_PROPERTIES };

/// Functions of local rings, and bass (which reads any ring at its point: the origin of a graded one).
export const LOCAL_FUNCTIONS: Record<string, FunctionImpl> = {
  ...LOCAL_FUNCTIONS_OF_RINGS,
  "bass(Module or Ring, Int)": LOCAL_HOMOLOGY_FUNCTIONS["bass(Module or Ring, Int)"],
};

type PropertyImpl = (obj: Value, args: readonly Value[], c: CallContext) => Value;
type FunctionImpl = (args: readonly Value[], c: CallContext) => Value;

/// Ring properties that mean the same locally and globally (they do not depend on the point).
const POINT_FREE = new Set([
  "Ring.field",
  "Ring.vars",
  "Ring.ngens",
  "Ring.ideal",
  "Ring.ambient",
  "Ring.multiplicity",
  "Ring.samuel",
  "Ring.tangent_cone",
]);

/// Module and complex properties computed by the evaluator from the value alone.
const VALUE_ONLY = new Set(["Complex.betti", "Complex.ranks", "Complex.length", "Complex.map", "Complex.complete", "Complex.minors"]);

const localRingOf = (v: Value): RingValue | null => {
  if (v.type === "Ring") return v.local ? v : null;
  if (v.type === "Module" || v.type === "Complex" || v.type === "Ideal" || v.type === "Matrix" || v.type === "Poly")
    return v.ring.local ? v.ring : null;
  return null;
};

const EXTRA_PROPERTIES: Record<string, PropertyImpl> = LOCAL_HOMOLOGY_PROPERTIES;
const EXTRA_FUNCTIONS: Record<string, FunctionImpl> = LOCAL_HOMOLOGY_FUNCTIONS;

export function localProperty(obj: Value, key: string): PropertyImpl | undefined {
  if (!localRingOf(obj)) return undefined;
  const impl = EXTRA_PROPERTIES[key] ?? LOCAL_RING_PROPERTIES[key];
  if (impl) return impl;
  if (POINT_FREE.has(key) || VALUE_ONLY.has(key) || obj.type === "Ideal" || obj.type === "Poly" || obj.type === "Matrix") return undefined;
  return (_v, _a, c) => {
    throw runtime(
      `${key.replace(/^\w+\./, "")} is not computed over a local ring yet (it would be read at the point, not globally)`,
      c.span,
    );
  };
}

/// Functions whose arguments include a local ring (or a module over one).
const LOCAL_AWARE = new Set(["localize(Ring)", "milnor(Poly)", "tjurina(Poly)", "bass(Module or Ring, Int)"]);

/// Over a graded quotient ring R = S/J these are read at the origin by the local code: the
/// lengths of finite-length graded modules are those of their localisations at the
/// irrelevant ideal (common practice).
const GRADED_QUOTIENT = new Set([
  "tor_lengths(Module or Ring, Module or Ring)",
  "serre(Module or Ring, Module or Ring)",
  "tor(Int, Module or Ring, Module or Ring)",
  "ext(Int, Module or Ring, Module or Ring)",
]);

const overQuotient = (v: Value): boolean =>
  (v.type === "Ring" && v.over !== undefined && v.over.ideal.length > 0) || (v.type === "Module" && v.ring.ideal.length > 0);

const weighted = (v: Value): boolean => {
  if (v.type === "Ring") return v.poly.degrees.some((d) => d !== 1);
  if (v.type === "Module") return v.ring.poly.degrees.some((d) => d !== 1);
  return false;
};

/// The local implementation of a function over a graded quotient ring, when it has one. The
/// Poincaré series over a quotient of a weighted polynomial ring also goes there: its total
/// Betti numbers are those of the localisation at the irrelevant ideal, exact without the
/// degree bound that only the standard grading has (Backelin's rate).
function gradedQuotientFunction(key: string, args: readonly Value[]): FunctionImpl | undefined {
  if (args.some((a) => localRingOf(a)) || !args.some(overQuotient)) return undefined;
  if (GRADED_QUOTIENT.has(key)) return EXTRA_FUNCTIONS[key];
  if (key === "poincare(Module or Ring)" && args.some(weighted)) return EXTRA_FUNCTIONS[key];
  return undefined;
}

/// Ideals, matrices and polynomials of a local ring are kept by global representatives, and
/// ideal operations (sums, products, colons, minors) commute with localisation, so only
/// functions of a local Ring or Module are redirected.
export function localFunction(key: string, args: readonly Value[]): FunctionImpl | undefined {
  const graded = gradedQuotientFunction(key, args);
  if (graded) return graded;
  if (LOCAL_AWARE.has(key)) return undefined;
  if (!args.some((a) => (a.type === "Ring" || a.type === "Module") && localRingOf(a))) return undefined;
  const impl = EXTRA_FUNCTIONS[key];
  if (impl) return impl;
  return (_a, c) => {
    throw runtime(
      `${key.replace(/\(.*$/, "")} is not computed over a local ring yet (it would be read at the point, not globally)`,
      c.span,
    );
  };
}
