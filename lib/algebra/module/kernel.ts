import { runtimeError } from "../errors";
import type { ComputeOptions } from "../options";
import { constPoly } from "../poly/arith";
import { makePoly, type Poly } from "../poly/poly";
import { ringCtx, type PolyRing } from "../poly/ring";
import { moduleGroebner } from "./groebner";
import { positionOverTerm } from "./order";
import { vecFromPolys, vecToPolys } from "./vector";

/// Generators of ker(A: ⊕ R(−s_q) → ⊕ R(−t_a)) for a homogeneous matrix A given by its rows
/// (column q of degree s_q, row a of degree t_a), as vectors of length rank(source): a
/// Gröbner basis of the graph {(A·v, v)} in a position-over-term order with the target's
/// positions first; the elements with no target part span the kernel (elimination of the
/// target; D. Eisenbud, Commutative Algebra, §15.10.8, from memory). Not minimal.
export function moduleKernel(
  R: PolyRing,
  rows: readonly (readonly Poly[])[],
  sourceDegrees: readonly number[],
  targetDegrees: readonly number[],
  opts?: ComputeOptions,
): Poly[][] {
  const r = targetDegrees.length,
    s = sourceDegrees.length;
  if (rows.length !== r) throw runtimeError("moduleKernel", `expected ${r} rows, got ${rows.length}`);
  if (rows.some((row) => row.length !== s)) throw runtimeError("moduleKernel", `every row needs ${s} entries`);
  if (s === 0) return [];
  const C = ringCtx(R);
  // shift so that every basis element sits in degree ≥ 0 (the order does not care)
  const shift = -Math.min(0, ...sourceDegrees, ...targetDegrees);
  const degrees = [...targetDegrees, ...sourceDegrees].map((d) => d + shift);
  const O = positionOverTerm(C.layout, r + s);
  const zero = makePoly([], []);
  const one = constPoly(C, C.K.one);
  const gens = Array.from({ length: s }, (_, q) => {
    const entries: Poly[] = rows.map((row) => row[q]);
    for (let b = 0; b < s; b++) entries.push(b === q ? one : zero);
    return vecFromPolys(C, O, entries);
  });
  const G = moduleGroebner(C, O, degrees, gens, opts);
  return G.filter((g) => g.comp[0] >= r).map((g) => vecToPolys(C, g, r + s).slice(r));
}
