import type { GFCoeffs } from "../field/coeffs";
import { monoDiv, monoOne, type Mono } from "../monomial/monomial";
import { checkLimit, checkpoint } from "../options";
import { asTyped, type Poly } from "../poly/poly";
import type { Reduced, ReductionStep } from "./basis";
import { reduceF4Matrix, type SparseRow } from "./f4-linalg";
import { MonoTable } from "./monotable";
import { findReducer } from "./reduce";

/// F4 reduction over GF(p) (J.-C. Faugère, "A new efficient algorithm for computing Gröbner
/// bases (F4)", J. Pure Appl. Algebra 139, 1999): all S-polynomials of one sugar degree are
/// reduced at once as the rows of one sparse matrix. Symbolic preprocessing collects the
/// monomials of the step in one hash table (each monomial is hashed once per step; a product
/// t·m is found from the hashes of t and m without building it) and a reducer row for every
/// monomial some leading monomial divides; the matrix is then split into pivot and
/// non-pivot columns and reduced as in f4-linalg.ts (Faugère–Lachartre, PASCO 2010).

/// Term hashes of a polynomial, computed once per polynomial (the hash is the same for all
/// tables of the same number of variables).
const termHashes = new WeakMap<Poly, Int32Array>();
/// Coefficients as a Float64Array, so the inner loop reads one kind of array only.
const coeffArrays = new WeakMap<Poly, Float64Array>();

function coeffsOf(f: Poly): Float64Array {
  let c = coeffArrays.get(f);
  if (!c) {
    c = Float64Array.from(f.c as number[]);
    coeffArrays.set(f, c);
  }
  return c;
}

function hashesOf(table: MonoTable, f: Poly): Int32Array {
  let h = termHashes.get(f);
  if (!h) {
    h = Int32Array.from(f.m, (m) => table.hash(m));
    termHashes.set(f, h);
  }
  return h;
}

/// F4 handles every prime field the engine has (p < 2^31): the accumulators of f4-linalg.ts
/// stay exact for all of them.
export const F4_PRIME_BOUND = 2 ** 31;

export const reduceF4: ReductionStep = <C>(...[R, batch, inputs, basis, opts, ticker]: Parameters<ReductionStep>): Reduced<C>[] => {
  const p = (R.K as unknown as GFCoeffs).p;
  const { elts, active } = basis;
  const table = new MonoTable(R.n);
  const one = monoOne(R.layout);
  /// Rows hold monomial ids while they are built.
  const pivotOf: (SparseRow | undefined)[] = [];
  const toReduce: SparseRow[] = [];
  const used = new Set<number>();

  const product = (f: Poly, t: Mono): SparseRow => {
    const F = asTyped<number>(f);
    const hs = hashesOf(table, f);
    const ht = table.hash(t);
    const ids = new Int32Array(F.m.length);
    for (let k = 0; k < F.m.length; k++) ids[k] = table.productId(t, ht, F.m[k], hs[k]);
    return { cols: ids, vals: coeffsOf(f) };
  };
  const addPairRow = (k: number, lcm: Mono) => {
    const e = elts[k];
    const row = product(e.poly, monoDiv(lcm, e.lm));
    // The same multiple of the same element is needed once.
    const key = row.cols[0] * elts.length + k;
    if (used.has(key)) return;
    used.add(key);
    if (pivotOf[row.cols[0]] === undefined) pivotOf[row.cols[0]] = row;
    else toReduce.push(row);
  };

  for (const pr of batch) {
    if (pr.j < 0) toReduce.push(product(inputs[pr.i], one));
    else {
      addPairRow(pr.i, pr.lcm);
      addPairRow(pr.j, pr.lcm);
    }
  }

  // Symbolic preprocessing: every monomial that some leading monomial divides gets a reducer
  // row (the shortest such element); the table grows while it is walked.
  for (let id = 0; id < table.monos.length; id++) {
    ticker.tick();
    if (pivotOf[id] !== undefined) continue;
    const m = table.monos[id];
    const r = findReducer(elts, active, m);
    if (r >= 0) pivotOf[id] = product(elts[r].poly, monoDiv(m, elts[r].lm));
  }

  // Columns: pivot columns (block A) first, then the others (block B), each in decreasing
  // monomial order, so every row's A part and B part stay sorted.
  const nmonos = table.monos.length;
  const aIds: number[] = [], bIds: number[] = [];
  for (let id = 0; id < nmonos; id++) (pivotOf[id] !== undefined ? aIds : bIds).push(id);
  const desc = (a: number, b: number) => R.cmp(table.monos[b], table.monos[a]);
  aIds.sort(desc);
  bIds.sort(desc);
  const nA = aIds.length;
  const colOf = new Int32Array(nmonos);
  aIds.forEach((id, c) => (colOf[id] = c));
  bIds.forEach((id, c) => (colOf[id] = nA + c));
  const pivots: (SparseRow | undefined)[] = new Array(nA);
  for (let c = 0; c < nA; c++) pivots[c] = toColumns(pivotOf[aIds[c]]!, colOf, nA);
  const rows = toReduce.map((r) => toColumns(r, colOf, nA));
  rows.sort((a, b) => a.cols[0] - b.cols[0] || a.cols.length - b.cols.length);
  checkpoint(opts, { stage: "groebner", detail: `matrix ${rows.length + nA}×${nmonos} (${nA} pivots)` });

  const sugar = batch[0].sugar;
  const out: Reduced<C>[] = [];
  for (const r of reduceF4Matrix(p, { pivots, rows, nA, ncols: nmonos }, ticker)) {
    checkLimit(opts, "maxTerms", r.cols.length, "a polynomial's number of terms");
    out.push({ m: Array.from(r.cols, (c) => table.monos[bIds[c]]), c: Array.from(r.vals) as unknown as C[], sugar });
  }
  return out;
};

/// A row of monomial ids (decreasing monomials) in column numbering: its A entries, then its
/// B entries, each already increasing.
function toColumns(row: SparseRow, colOf: Int32Array, nA: number): SparseRow {
  const ids = row.cols, len = ids.length;
  const cols = new Int32Array(len), vals = new Float64Array(len);
  let a = 0;
  for (let k = 0; k < len; k++) if (colOf[ids[k]] < nA) a++;
  let ia = 0, ib = a;
  for (let k = 0; k < len; k++) {
    const c = colOf[ids[k]];
    if (c < nA) {
      cols[ia] = c;
      vals[ia++] = row.vals[k];
    } else {
      cols[ib] = c;
      vals[ib++] = row.vals[k];
    }
  }
  return { cols, vals };
}
