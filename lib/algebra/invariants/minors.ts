import { runtimeError } from "../errors";
import { monoOne } from "../monomial/monomial";
import { checkpoint, type ComputeOptions } from "../options";
import { addScaled, mulPoly } from "../poly/arith";
import { makePoly, type Poly } from "../poly/poly";
import { ringCtx, type PolyRing, type RingCtx } from "../poly/ring";

function subsets(n: number, k: number): number[][] {
  const out: number[][] = [];
  const cur: number[] = [];
  const rec = (start: number) => {
    if (cur.length === k) {
      out.push([...cur]);
      return;
    }
    for (let i = start; i <= n - (k - cur.length); i++) {
      cur.push(i);
      rec(i + 1);
      cur.pop();
    }
  };
  rec(0);
  return out;
}

/// Determinants of all k×k submatrices on the first k rows of `rows`, keyed by column set,
/// by Laplace expansion along the last row with the (k−1)-minors reused (common practice).
function minorsOfRows<C>(
  R: RingCtx<C>,
  A: readonly (readonly Poly[])[],
  rowIdx: readonly number[],
  ncols: number,
  opts?: ComputeOptions,
): Map<string, Poly> {
  let prev = new Map<string, Poly>([["", makePoly([], [])]]);
  const one = R.K.one;
  for (let t = 0; t < rowIdx.length; t++) {
    checkpoint(opts, { stage: "minors", detail: `size ${t + 1}` });
    const next = new Map<string, Poly>();
    const row = A[rowIdx[t]];
    for (const cols of subsets(ncols, t + 1)) {
      let det = makePoly([], []);
      for (let s = 0; s < cols.length; s++) {
        const entry = row[cols[s]];
        if (entry.m.length === 0) continue;
        const rest = cols.filter((_, x) => x !== s);
        const sub = t === 0 ? null : prev.get(rest.join(","));
        const term = sub === null ? entry : mulPoly(R, entry, sub as Poly, opts);
        // sign of expanding along the last row at position s of t+1 columns
        const sign = (t + s) % 2 === 0 ? one : R.K.neg(one);
        det = addScaled(R, det, term, sign);
      }
      next.set(cols.join(","), det);
    }
    prev = next;
  }
  return prev;
}

function checkMatrix(where: string, A: readonly (readonly Poly[])[]): number {
  const c = A.length === 0 ? 0 : A[0].length;
  if (A.some((r) => r.length !== c)) throw runtimeError(where, "the rows have different lengths");
  return c;
}

/// All nonzero k×k minors of A (rows × columns), rows and columns in increasing order.
export function minors(R: PolyRing, A: readonly (readonly Poly[])[], k: number, opts?: ComputeOptions): Poly[] {
  const C = ringCtx(R);
  const ncols = checkMatrix("minors", A);
  if (!Number.isInteger(k) || k < 0) throw runtimeError("minors", `the size must be a non-negative integer, got ${k}`);
  if (k === 0) return [makePoly([monoOne(C.layout)], [C.K.one])];
  if (k > A.length || k > ncols) return [];
  const out: Poly[] = [];
  for (const rs of subsets(A.length, k)) {
    const M = minorsOfRows(C, A, rs, ncols, opts);
    for (const cs of subsets(ncols, k)) {
      const f = M.get(cs.join(",")) as Poly;
      if (f.m.length > 0) out.push(f);
    }
  }
  return out;
}

/// The determinant of a square matrix.
export function det(R: PolyRing, A: readonly (readonly Poly[])[], opts?: ComputeOptions): Poly {
  const n = checkMatrix("det", A);
  if (n !== A.length) throw runtimeError("det", `the matrix is ${A.length}×${n}, not square`);
  if (n === 0) return minors(R, A, 0)[0];
  const C = ringCtx(R);
  return minorsOfRows(
    C,
    A,
    A.map((_, i) => i),
    n,
    opts,
  ).get(A.map((_, i) => i).join(",")) as Poly;
}
