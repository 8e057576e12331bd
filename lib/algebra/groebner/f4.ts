import type { GFCoeffs } from "../field/coeffs";
import { invMod } from "../field/gfp";
import { monoDiv, monoOne, type Mono } from "../monomial/monomial";
import { checkLimit, checkpoint } from "../options";
import { asTyped, type Poly } from "../poly/poly";
import type { Reduced, ReductionStep } from "./basis";
import { MonoTable } from "./monotable";
import { findReducer } from "./reduce";

/// F4 reduction over GF(p): all S-polynomials of a batch are reduced at once as the rows of
/// one sparse matrix built by symbolic preprocessing, then brought to echelon form with a
/// dense accumulator per row (J.-C. Faugère, "A new efficient algorithm for computing
/// Gröbner bases (F4)", J. Pure Appl. Algebra 139, 1999).

interface Row {
  /// Monomial ids (table order) while building, then column indices (increasing).
  cols: Int32Array;
  vals: Float64Array;
}

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

/// The largest p for which the dense accumulator may add products without reducing each
/// time is chosen per matrix; above 2^26 even one product is not exact, so F4 is not used.
export const F4_PRIME_BOUND = 2 ** 26;

export const reduceF4: ReductionStep = <C>(...[R, batch, inputs, basis, opts, ticker]: Parameters<ReductionStep>): Reduced<C>[] => {
  const p = (R.K as unknown as GFCoeffs).p;
  const { elts, active } = basis;
  const table = new MonoTable(R.n);
  const one = monoOne(R.layout);
  const pivotOf: (Row | undefined)[] = [];
  const toReduce: Row[] = [];
  const used = new Set<string>();

  const product = (f: Poly, t: Mono): Row => {
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
    const key = `${k}:${row.cols[0]}`;
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

  // Symbolic preprocessing: every monomial that some leading monomial divides gets a reducer row.
  for (let id = 0; id < table.monos.length; id++) {
    ticker.tick();
    if (pivotOf[id] !== undefined) continue;
    const m = table.monos[id];
    const r = findReducer(elts, active, m);
    if (r >= 0) pivotOf[id] = product(elts[r].poly, monoDiv(m, elts[r].lm));
  }

  // Columns in decreasing monomial order.
  const ncols = table.monos.length;
  const byOrder = Array.from({ length: ncols }, (_, i) => i).sort((a, b) => R.cmp(table.monos[b], table.monos[a]));
  const colOf = new Int32Array(ncols);
  byOrder.forEach((id, c) => (colOf[id] = c));
  const toCols = (row: Row) => {
    for (let k = 0; k < row.cols.length; k++) row.cols[k] = colOf[row.cols[k]];
  };
  const pivotByCol: (Row | undefined)[] = new Array(ncols);
  for (let id = 0; id < ncols; id++) {
    const row = pivotOf[id];
    if (row) {
      toCols(row);
      pivotByCol[colOf[id]] = row;
    }
  }
  toReduce.forEach(toCols);
  toReduce.sort((a, b) => a.cols[0] - b.cols[0] || a.cols.length - b.cols.length);
  checkpoint(opts, { stage: "groebner", detail: `matrix ${toReduce.length + pivotOf.filter(Boolean).length}×${ncols}` });

  // Row reduction with a dense accumulator. Products are added without reduction while the
  // sum provably stays below 2^53 (at most one addition per pivot row and column).
  const lazy = ncols * (p - 1) * (p - 1) + p < 2 ** 53;
  const dense = new Float64Array(ncols);
  const out: Reduced<C>[] = [];
  const sugar = batch[0].sugar;
  for (const row of toReduce) {
    ticker.tick();
    const rc = row.cols, rv = row.vals;
    for (let k = 0; k < rc.length; k++) dense[rc[k]] = rv[k];
    let lead = -1, nonzero = 0;
    for (let c = rc[0]; c < ncols; c++) {
      let v = dense[c];
      if (v === 0) continue;
      v %= p;
      if (v === 0) {
        dense[c] = 0;
        continue;
      }
      const piv = pivotByCol[c];
      if (piv === undefined) {
        dense[c] = v;
        if (lead < 0) lead = c;
        nonzero++;
        continue;
      }
      dense[c] = 0;
      const mult = p - v;
      const pc = piv.cols, pv = piv.vals;
      if (lazy) for (let k = 1; k < pc.length; k++) dense[pc[k]] += mult * pv[k];
      else for (let k = 1; k < pc.length; k++) dense[pc[k]] = (dense[pc[k]] + mult * pv[k]) % p;
    }
    if (lead < 0) continue;
    checkLimit(opts, "maxTerms", nonzero, "a polynomial's number of terms");
    const cols = new Int32Array(nonzero), vals = new Float64Array(nonzero);
    const inv = invMod(dense[lead], p);
    let k = 0;
    for (let c = lead; c < ncols; c++) {
      const v = dense[c];
      if (v === 0) continue;
      cols[k] = c;
      vals[k++] = (v * inv) % p;
      dense[c] = 0;
    }
    pivotByCol[lead] = { cols, vals };
    out.push({ m: Array.from(cols, (c) => table.monos[byOrder[c]]), c: Array.from(vals) as unknown as C[], sugar });
  }
  return out;
};
