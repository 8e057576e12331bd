// Moving polynomials between rings over the same field, and the auxiliary rings the
// elimination methods need. Coefficients are shared as they are: both rings have the
// same field, hence the same coefficient representation.
import { HEAD, monoFromExps } from "../monomial/monomial";
import { polyFromTerms } from "../poly/arith";
import type { Poly } from "../poly/poly";
import { type PolyRing, polyRing, ringCtx } from "../poly/ring";
import { runtimeError } from "../errors";

/// f ∈ A rewritten in B, variable i of A becoming variable target[i] of B.
export function mapPoly(A: PolyRing, B: PolyRing, f: Poly, target: readonly number[]): Poly {
  const nA = A.vars.length;
  const nB = B.vars.length;
  const L = ringCtx(B).layout;
  const monos = f.m.map((m) => {
    const e = new Array<number>(nB).fill(0);
    for (let i = 0; i < nA; i++) e[target[i]] = m[HEAD + i];
    return monoFromExps(L, e);
  });
  return polyFromTerms(ringCtx(B), monos, [...f.c]);
}

/// Whether f involves none of the variables `vars` (indices into its ring).
export function avoidsVariables(f: Poly, vars: readonly number[]): boolean {
  return f.m.every((m) => vars.every((i) => m[HEAD + i] === 0));
}

/// f ∈ B involving only variables source[0], source[1], … of B, rewritten in A with
/// source[i] becoming variable i of A.
export function pullbackPoly(B: PolyRing, A: PolyRing, f: Poly, source: readonly number[]): Poly {
  const nA = A.vars.length;
  const used = new Set(source);
  const L = ringCtx(A).layout;
  const monos = f.m.map((m) => {
    for (let j = 0; j < B.vars.length; j++) {
      if (!used.has(j) && m[HEAD + j] !== 0) throw runtimeError("pullbackPoly", `the polynomial involves ${B.vars[j]}`);
    }
    const e = new Array<number>(nA);
    for (let i = 0; i < nA; i++) e[i] = m[HEAD + source[i]];
    return monoFromExps(L, e);
  });
  return polyFromTerms(ringCtx(A), monos, [...f.c]);
}

/// `count` new variable names not among `taken`.
export function freshNames(taken: readonly string[], count: number): string[] {
  const used = new Set(taken);
  const out: string[] = [];
  for (let k = 0; out.length < count; k++) {
    const name = `tag${k}`;
    if (!used.has(name)) out.push(name);
  }
  return out;
}

/// R with `count` new variables of degree 1 in front, ordered by weights (1 on the new
/// variables, 0 on the old; ties by degree, then reverse lexicographic): an elimination
/// order for the new variables. Variable i of R is variable count + i of the result.
export function taggedRing(R: PolyRing, count: number): PolyRing {
  const n = R.vars.length;
  return polyRing(R.field, [...freshNames(R.vars, count), ...R.vars], {
    degrees: [...new Array<number>(count).fill(1), ...R.degrees],
    order: { kind: "weights", weights: [...new Array<number>(count).fill(1), ...new Array<number>(n).fill(0)] },
  });
}

/// R with its order replaced by an elimination order for the variables `vars`.
export function eliminationRing(R: PolyRing, vars: readonly number[]): PolyRing {
  const weights = R.vars.map((_, i) => (vars.includes(i) ? 1 : 0));
  return polyRing(R.field, R.vars, { degrees: [...R.degrees], order: { kind: "weights", weights } });
}

/// R with the grevlex order (same field, variables and grading).
export function grevlexRing(R: PolyRing): PolyRing {
  return polyRing(R.field, R.vars, { degrees: [...R.degrees], order: { kind: "grevlex" } });
}

export function identityMap(n: number, offset = 0): number[] {
  return Array.from({ length: n }, (_, i) => i + offset);
}
