/// Monomials of a given (weighted) degree, in one documented order: exponent vectors in
/// decreasing lexicographic order (x1^d first, the last variable's power last).
import { checkpoint, type ComputeOptions } from "../options";
import { runtimeError } from "../errors";

/// Every exponent vector e ≥ 0 with Σ degrees[i]·e[i] = d, decreasing lexicographically;
/// refuses beyond `max` vectors (a clear error rather than a long wait).
export function monomialsOfDegree(degrees: readonly number[], d: number, max: number, opts?: ComputeOptions): number[][] {
  if (!Number.isInteger(d) || d < 0) throw runtimeError("monomials", `the degree must be a non-negative integer, got ${d}`);
  const n = degrees.length;
  const out: number[][] = [];
  const e = new Array<number>(n).fill(0);
  const walk = (i: number, left: number): void => {
    if (i === n - 1) {
      if (left % degrees[i] !== 0) return;
      e[i] = left / degrees[i];
      if (out.length >= max) throw runtimeError("monomials", `more than ${max} monomials of degree ${d}`);
      out.push([...e]);
      return;
    }
    for (let k = Math.floor(left / degrees[i]); k >= 0; k--) {
      checkpoint(opts);
      e[i] = k;
      walk(i + 1, left - k * degrees[i]);
    }
    e[i] = 0;
  };
  if (n > 0) walk(0, d);
  return out;
}

export const divides = (a: readonly number[], b: readonly number[]): boolean => a.every((x, i) => x <= b[i]);
