import { runtimeError } from "../errors";
import { monoOne } from "../monomial/monomial";
import { checkpoint, type ComputeOptions } from "../options";
import { addScaled, mulPoly } from "../poly/arith";
import { makePoly, type Poly } from "../poly/poly";
import { ringCtx, type PolyRing, type RingCtx } from "../poly/ring";

/// Pf of the principal submatrix on `idx` by expansion along its first index:
/// Pf(A) = Σ_{j ≥ 2} (−1)^j a_{1j} Pf(A without rows/columns 1, j) (common practice).
function pfaffian<C>(R: RingCtx<C>, A: readonly (readonly Poly[])[], idx: number[], memo: Map<string, Poly>, opts?: ComputeOptions): Poly {
  if (idx.length === 0) return makePoly([monoOne(R.layout)], [R.K.one]);
  const key = idx.join(",");
  const hit = memo.get(key);
  if (hit) return hit;
  checkpoint(opts, { stage: "pfaffians" });
  let out = makePoly([], []);
  const i = idx[0];
  for (let s = 1; s < idx.length; s++) {
    const a = A[i][idx[s]];
    if (a.m.length === 0) continue;
    const rest = idx.filter((_, x) => x !== 0 && x !== s);
    const term = mulPoly(R, a, pfaffian(R, A, rest, memo, opts), opts);
    out = addScaled(R, out, term, s % 2 === 1 ? R.K.one : R.K.neg(R.K.one));
  }
  memo.set(key, out);
  return out;
}

/// The nonzero Pfaffians of the principal 2k×2k submatrices of an alternating matrix A (k = size/2).
export function pfaffians(R: PolyRing, A: readonly (readonly Poly[])[], size: number, opts?: ComputeOptions): Poly[] {
  const n = A.length;
  if (A.some((r) => r.length !== n)) throw runtimeError("pfaffians", "the matrix is not square");
  if (!Number.isInteger(size) || size < 0 || size % 2 !== 0)
    throw runtimeError("pfaffians", `the size must be an even non-negative integer, got ${size}`);
  const C = ringCtx(R);
  for (let i = 0; i < n; i++) {
    if (A[i][i].m.length > 0) throw runtimeError("pfaffians", "the matrix is not alternating (nonzero diagonal)");
    for (let j = 0; j < i; j++) {
      if (addScaled(C, A[i][j], A[j][i], C.K.one).m.length > 0)
        throw runtimeError("pfaffians", "the matrix is not alternating (A + Aᵀ ≠ 0)");
    }
  }
  const memo = new Map<string, Poly>();
  const out: Poly[] = [];
  const cur: number[] = [];
  const rec = (start: number) => {
    if (cur.length === size) {
      const f = pfaffian(C, A, [...cur], memo, opts);
      if (f.m.length > 0) out.push(f);
      return;
    }
    for (let i = start; i <= n - (size - cur.length); i++) {
      cur.push(i);
      rec(i + 1);
      cur.pop();
    }
  };
  rec(0);
  return out;
}
