import { monoIsOne, type Mono } from "../../monomial/monomial";
import { checkpoint, type ComputeOptions } from "../../options";
import { addScaled, mulPoly, mulTerm, polyFromTerms } from "../../poly/arith";
import { asTyped, type Poly } from "../../poly/poly";
import type { RingCtx } from "../../poly/ring";
import type { Vec } from "../../module/vector";
import { scalarRank } from "./scalar";
import type { SchreyerResolution } from "./frame";

/// The scalar part of d_k between basis elements of the same degree j: its rank is the
/// number of generators of degree j cancelled between F_k and F_{k−1} by minimising, since
/// β_{k,j} = dim H_k(F ⊗ k)_j and F ⊗ k has the scalar parts as differentials.
export function scalarRanks<C>(R: RingCtx<C>, S: SchreyerResolution<C>, k: number, opts?: ComputeOptions): Map<number, number> {
  const rowsByDegree = new Map<number, Map<number, Map<number, C>>>();
  const cols = S.cols[k] ?? [];
  cols.forEach((v, p) => {
    for (let t = 0; t < v.mono.length; t++) {
      if (!monoIsOne(v.mono[t])) continue;
      const d = S.degrees[k][p];
      let rows = rowsByDegree.get(d);
      if (!rows) rowsByDegree.set(d, (rows = new Map()));
      let row = rows.get(v.comp[t]);
      if (!row) rows.set(v.comp[t], (row = new Map()));
      row.set(p, v.coef[t]);
    }
  });
  const out = new Map<number, number>();
  for (const [d, rows] of rowsByDegree) out.set(d, scalarRank(R.K, [...rows.values()], opts));
  return out;
}

/// A differential as sparse columns (row → nonzero entry), with the row index kept in sync.
interface SparseMap {
  cols: Map<number, Map<number, Poly>>;
  rows: Map<number, Set<number>>;
}

function sparseFromVecs<C>(R: RingCtx<C>, cols: readonly Vec<C>[]): SparseMap {
  const M: SparseMap = { cols: new Map(), rows: new Map() };
  cols.forEach((v, p) => {
    const ms = new Map<number, Mono[]>(),
      cs = new Map<number, C[]>();
    for (let t = 0; t < v.mono.length; t++) {
      const a = v.comp[t];
      if (!ms.has(a)) {
        ms.set(a, []);
        cs.set(a, []);
      }
      (ms.get(a) as Mono[]).push(v.mono[t]);
      (cs.get(a) as C[]).push(v.coef[t]);
    }
    const col = new Map<number, Poly>();
    for (const [a, m] of ms) {
      const f = polyFromTerms(R, m, cs.get(a) as C[]);
      if (f.m.length > 0) col.set(a, f);
    }
    M.cols.set(p, col);
    for (const a of col.keys()) rowSet(M, a).add(p);
  });
  return M;
}

function rowSet(M: SparseMap, a: number): Set<number> {
  let s = M.rows.get(a);
  if (!s) M.rows.set(a, (s = new Set()));
  return s;
}

function setEntry(M: SparseMap, a: number, q: number, f: Poly): void {
  const col = M.cols.get(q) as Map<number, Poly>;
  if (f.m.length === 0) {
    col.delete(a);
    M.rows.get(a)?.delete(q);
  } else {
    col.set(a, f);
    rowSet(M, a).add(q);
  }
}

function deleteColumn(M: SparseMap, b: number): void {
  const col = M.cols.get(b);
  if (!col) return;
  for (const a of col.keys()) M.rows.get(a)?.delete(b);
  M.cols.delete(b);
}

function deleteRow(M: SparseMap, a: number): void {
  const row = M.rows.get(a);
  if (!row) return;
  for (const q of row) M.cols.get(q)?.delete(a);
  M.rows.delete(a);
}

function isUnit(f: Poly): boolean {
  return f.m.length === 1 && monoIsOne(f.m[0]);
}

/// The minimal resolution: basis indices kept at each level and the differentials between
/// them (map k: F_k → F_{k−1}, sparse columns).
export interface MinimalComplex {
  readonly kept: number[][];
  readonly maps: SparseMap[];
}

/// Minimises a free resolution by cancelling unit entries one at a time: with d_k(e_b) having
/// unit coefficient c on e_a, the complex is the direct sum of 0 → R·e_b → R·e_a → 0 and the
/// complex with d_k' = d_k − (column b)·c^{−1}·(row a) restricted away from a and b,
/// d_{k+1} without row b and d_{k−1} without column a (Gaussian elimination on complexes;
/// La Scala–Stillman 1998). Pivots of short row × column are taken first.
export function minimizeResolution<C>(R: RingCtx<C>, S: SchreyerResolution<C>, opts?: ComputeOptions): MinimalComplex {
  const top = S.cols.length - 1;
  const maps: SparseMap[] = [{ cols: new Map(), rows: new Map() }];
  for (let k = 1; k <= top; k++) maps.push(sparseFromVecs(R, S.cols[k]));
  const alive = S.degrees.map((ds) => new Set(ds.map((_, p) => p)));
  for (let k = top; k >= 1; k--) {
    const A = maps[k];
    for (;;) {
      // One scan collects the unit entries, cheapest first; each is re-checked before use
      // since earlier eliminations change the matrix. Repeat until a scan finds none.
      const cands: [number, number, number][] = [];
      for (const [b, col] of A.cols) {
        for (const [a, f] of col) {
          if (S.degrees[k][b] === S.degrees[k - 1][a] && isUnit(f)) cands.push([col.size * (A.rows.get(a)?.size ?? 1), a, b]);
        }
      }
      if (cands.length === 0) break;
      cands.sort((x, y) => x[0] - y[0]);
      for (const [, a, b] of cands) {
        checkpoint(opts, () => ({ stage: "minimize", detail: `homological degree ${k}` }));
        const f = A.cols.get(b)?.get(a);
        if (!f || !isUnit(f)) continue;
        eliminate(R, maps, k, a, b);
        alive[k].delete(b);
        alive[k - 1].delete(a);
      }
    }
  }
  const kept = alive.map((s, k) => [...s].sort((x, y) => S.degrees[k][x] - S.degrees[k][y] || x - y));
  return { kept, maps };
}

/// Cancels the unit entry (a, b) of d_k.
function eliminate<C>(R: RingCtx<C>, maps: SparseMap[], k: number, a: number, b: number): void {
  const K = R.K;
  const A = maps[k];
  const colB = A.cols.get(b) as Map<number, Poly>;
  const pivot = colB.get(a) as Poly;
  const cInvNeg = K.neg(K.inv(asTyped<C>(pivot).c[0]));
  const one = pivot.m[0];
  for (const q of [...(A.rows.get(a) as Set<number>)]) {
    if (q === b) continue;
    const colQ = A.cols.get(q) as Map<number, Poly>;
    const alpha = mulTerm(R, colQ.get(a) as Poly, cInvNeg, one);
    for (const [r, beta] of colB) {
      if (r === a) continue;
      setEntry(A, r, q, addScaled(R, colQ.get(r) ?? polyFromTerms(R, [], []), mulPoly(R, beta, alpha), K.one));
    }
  }
  deleteColumn(A, b);
  deleteRow(A, a);
  if (k + 1 < maps.length) deleteRow(maps[k + 1], b);
  deleteColumn(maps[k - 1], a);
}

/// The matrix of map k of the minimal complex, rows and columns in the order of `kept`.
export function denseMap<C>(R: RingCtx<C>, M: MinimalComplex, k: number): Poly[][] {
  const rows = M.kept[k - 1],
    cols = M.kept[k];
  const zero = polyFromTerms(R, [], []);
  const A = M.maps[k];
  return rows.map((a) => cols.map((b) => A?.cols.get(b)?.get(a) ?? zero));
}
