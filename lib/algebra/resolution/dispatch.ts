/// The one entry for minimal free resolutions: chooses the method for a module over
/// R = S/J and runs it. Callers (the evaluator) describe what to resolve and render the
/// tagged result; they do not choose.
import { AlgebraError } from "../errors";
import { componentAtOrigin } from "../artinian/origin";
import { ideal, type Ideal } from "../ideal/ideal";
import { idealSum } from "../ideal/arith";
import { idealEquals } from "../ideal/compare";
import { idealIsHomogeneous } from "../ideal/invariants";
import type { ComputeOptions } from "../options";
import { resolveLocalArtinian, type LocalResolution } from "./artinian/resolve";
import { resolveDegreewise, type ModulePresentation, type QuotientResolution } from "./graded-quotient/resolve";
import { resolveCoker, resolveQuotient, type Resolution } from "./schreyer/resolve";

/// The methods, named by how they work.
export type ResolutionMethod = "schreyer" | "graded-quotient" | "artinian";

/// The module to resolve: R/I for an ideal I of S (containing J or not: it is read modulo
/// J), or the cokernel of a presentation over R (entries in S, generators in degrees ≥ 0).
export type ResolvedModule = { ideal: Ideal } | { presentation: ModulePresentation };

export interface ResolutionInput {
  /// J, the defining ideal of R = S/J; given by no generators when R is S itself.
  ring: Ideal;
  module: ResolvedModule;
}

/// One finished Betti column in a shape common to all methods: pairs [j, β_{i,j}].
export interface FinishedColumn {
  readonly index: number;
  readonly entries: readonly (readonly [number, number])[];
}

export interface ResolutionRequest extends ResolutionInput {
  /// F_0 … F_length only; required over a quotient ring (its resolutions are usually infinite).
  length?: number;
  /// internal degrees ≤ degree only; graded methods only.
  degree?: number;
  /// graded-quotient: keep the differentials while they have at most this many entries.
  keepMaps?: number;
  /// The caller reads only Betti numbers and ranks: no differential is kept (Schreyer:
  /// the frame's levels are released as it goes and the result's `map` is refused;
  /// graded-quotient: no `keepMaps`, so no matrix is built; artinian: small dense maps kept).
  bettiOnly?: boolean;
  /// each Betti column as soon as it is final (graded methods).
  partial?: (column: FinishedColumn) => void;
  opts?: ComputeOptions;
}

export type DispatchedResolution =
  | { method: "schreyer"; resolution: Resolution }
  | { method: "graded-quotient"; resolution: QuotientResolution }
  /// `overGivenRing`: the local ring at the origin is R itself, so the maps are maps over R.
  | { method: "artinian"; resolution: LocalResolution; overGivenRing: boolean };

/// The rule.
/// * J given by no generators (R = S): Schreyer's method over S (La Scala–Stillman frame,
///   then minimised) — the resolution is finite (Hilbert's syzygy theorem), so it is the
///   cheapest complete answer; it needs a graded module and says so otherwise.
/// * J homogeneous and the module graded (an ideal: homogeneous; a presentation carries its
///   generator degrees): degree by degree over the graded quotient — exact in every degree
///   it reaches, with a proven degree bound where one is known.
/// * Otherwise (J or the module not homogeneous): at the origin, ungraded — the local ring
///   S_m/J·S_m is Artinian when the origin is an isolated point of V(J), and a cyclic module
///   is resolved by linear algebra on that finite-dimensional ring.
export function resolutionMethod(input: ResolutionInput, opts?: ComputeOptions): ResolutionMethod {
  if (input.ring.gens.length === 0) return "schreyer";
  if (!idealIsHomogeneous(input.ring, opts)) return "artinian";
  if ("ideal" in input.module && !idealIsHomogeneous(input.module.ideal, opts)) return "artinian";
  return "graded-quotient";
}

/// Resolves by the method `resolutionMethod` chooses.
export function minimalResolution(req: ResolutionRequest): DispatchedResolution {
  const method = resolutionMethod(req, req.opts);
  if (method === "schreyer") return { method, resolution: bySchreyer(req) };
  if (req.length === undefined) {
    throw new AlgebraError("runtime", "resolve: over a quotient ring a resolution is usually infinite; give a length bound");
  }
  if (method === "graded-quotient") return { method, resolution: byGradedQuotient(req, req.length) };
  return { method, ...atOrigin(req, req.length) };
}

function bySchreyer(req: ResolutionRequest): Resolution {
  const partial = req.partial;
  const opts = {
    ...req.opts,
    ...(req.length !== undefined ? { length: req.length } : {}),
    ...(req.degree !== undefined ? { degree: req.degree } : {}),
    ...(req.bettiOnly ? { bettiOnly: true } : {}),
    partial: partial
      ? (col: { i: number; entries: readonly (readonly [number, number])[] }) => partial({ index: col.i, entries: col.entries })
      : undefined,
  };
  const M = req.module;
  return "ideal" in M ? resolveQuotient(M.ideal, opts) : resolveCoker(req.ring.ring, M.presentation.rows, M.presentation.degrees, opts);
}

function byGradedQuotient(req: ResolutionRequest, length: number): QuotientResolution {
  const partial = req.partial;
  // One generator in degree 0: coker [g1 … gk] is R/(g1, …, gk), the same graded module; in
  // the cyclic form every degree splits by multidegree when both ideals are monomial (the
  // residue field R.residue over a monomial ring: k over k[x,y,z]/m^3 to length 8 went from
  // out of memory at a 4 GB heap to 0.8 GB).
  const M = req.module;
  const cyclic = "presentation" in M && M.presentation.rows.length === 1 && M.presentation.degrees[0] === 0;
  const module = "ideal" in M ? M.ideal : cyclic ? ideal(req.ring.ring, [...M.presentation.rows[0]]) : null;
  return resolveDegreewise({
    ring: req.ring,
    ...(module ? { module } : { presentation: (M as { presentation: ModulePresentation }).presentation }),
    length,
    degree: req.degree,
    keepMaps: req.bettiOnly ? undefined : req.keepMaps,
    opts: {
      ...req.opts,
      partial: partial ? (col) => partial({ index: col.index, entries: col.entries.map((e) => [e.degree, e.count] as const) }) : undefined,
    },
  });
}

/// The cyclic module R/I as an ideal of S: a presentation counts when it has one generator
/// (coker of a row [g1, …, gk] over R is R/(g1, …, gk)).
function cyclicIdeal(req: ResolutionRequest): Ideal {
  const M = req.module;
  if ("ideal" in M) return M.ideal;
  const rows = M.presentation.rows;
  if (rows.length !== 1) {
    throw new AlgebraError(
      "runtime",
      `resolve: over a ring given by a non-homogeneous ideal only cyclic modules are resolved (at the origin); this module has ${rows.length} generators`,
    );
  }
  return ideal(req.ring.ring, [...rows[0], ...req.ring.gens]);
}

function atOrigin(req: ResolutionRequest, length: number): { resolution: LocalResolution; overGivenRing: boolean } {
  if (req.degree !== undefined)
    throw new AlgebraError("runtime", "resolve: degree bounds need a graded ring; this one is read at the origin, ungraded");
  const I = cyclicIdeal(req);
  const Q = componentAtOrigin(req.ring, req.opts).ideal;
  return { resolution: resolveLocalArtinian(Q, idealSum(Q, I), length, req.opts), overGivenRing: idealEquals(Q, req.ring, req.opts) };
}
