import type { GFCoeffs } from "../field/coeffs";
import { HEAD, monoDiv, monoDivides, monoOne, type Mono } from "../monomial/monomial";
import { checkLimit, checkpoint, Ticker, type ComputeOptions } from "../options";
import { asTyped, makePoly, type Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import type { BasisElt, Reduced, ReductionStep, Strategy } from "./basis";
import { reduceF4Matrix, reduceTails } from "./f4-linalg";
import type { F4Matrix, SparseRow } from "./f4-linalg-types";
import { MonoTable } from "./monotable";
import { makeMonic } from "./reduce";

/// F4 reduction over GF(p) (J.-C. Faugère, "A new efficient algorithm for computing Gröbner
/// bases (F4)", J. Pure Appl. Algebra 139, 1999): all S-polynomials of one sugar degree are
/// reduced at once as the rows of one sparse matrix. Symbolic preprocessing collects the
/// monomials of the step in one hash table (each monomial is hashed once per step; a product
/// t·m is found from the hashes of t and m without being built) and a reducer row for every
/// monomial some leading monomial divides; the matrix is then split into pivot and
/// non-pivot columns and reduced as in f4-linalg.ts (Faugère–Lachartre, PASCO 2010).

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;

/// Term hashes of a polynomial, computed once per polynomial (the hash is the same for all
/// tables of the same number of variables), and its monomials packed in one array (read in
/// sequence when a multiple of it is built).
const termHashes = new WeakMap<Poly, Int32Array>();
const packedMonos = new WeakMap<Poly, Int32Array>();
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

/// F4 handles every prime field the engine has (p < 2^31): the accumulators of f4-linalg.ts
/// stay exact for all of them.
export const F4_PRIME_BOUND = 2 ** 31;

/// Builds the matrix of one step: rows are multiples t·f of polynomials, stored as monomial
/// ids in one shared pool until the columns are known.
class MatrixBuilder {
  readonly table: MonoTable;
  private pool = new Int32Array(1 << 16);
  private used = 0;
  /// The reducer row of each monomial id that has one.
  readonly pivotOf: (SparseRow | undefined)[] = [];
  readonly rows: SparseRow[] = [];
  private readonly scratch: Int32Array;
  /// The monomial 1 (all entries 0), as the factor t of a look-up of m itself.
  private readonly unit: Int32Array;

  constructor(private readonly R: RingCtx<unknown>) {
    this.table = new MonoTable(R.n);
    this.scratch = new Int32Array(H + R.n);
    this.unit = new Int32Array(H + R.n);
  }

  private hashesOf(f: Poly): Int32Array {
    let h = termHashes.get(f);
    if (!h) {
      // A plain loop: Int32Array.from with a mapping function is several times slower.
      const fm = f.m,
        table = this.table;
      h = new Int32Array(fm.length);
      for (let k = 0; k < fm.length; k++) h[k] = table.hash(fm[k]);
      termHashes.set(f, h);
    }
    return h;
  }

  private packedOf(f: Poly): Int32Array {
    let P = packedMonos.get(f);
    if (!P) {
      const S = this.table.stride;
      const fm = f.m;
      P = new Int32Array(fm.length * S);
      for (let k = 0; k < fm.length; k++) P.set(fm[k], k * S);
      packedMonos.set(f, P);
    }
    return P;
  }

  /// The id of monomial m (inserted when new).
  idOf(m: Mono): number {
    return this.table.productId(this.unit, 0, m, 0, this.table.hash(m));
  }

  /// When set, where every row comes from (for a trace; see F4StepTrace).
  sources: Map<SparseRow, RowSource> | null = null;

  /// The row of t·f (monomial ids); `src` names f for a trace (a basis index, or −1 − i
  /// for input i).
  product(f: Poly, t: Mono, src = 0): SparseRow {
    const fm = f.m,
      len = fm.length;
    const hs = this.hashesOf(f),
      P = this.packedOf(f),
      S = this.table.stride;
    const ht = this.table.hash(t);
    if (this.used + len > this.pool.length) {
      const bigger = new Int32Array(Math.max(this.pool.length * 2, this.used + len));
      bigger.set(this.pool.subarray(0, this.used));
      this.pool = bigger;
    }
    const off = this.used;
    this.used += len;
    const pool = this.pool,
      table = this.table;
    for (let k = 0; k < len; k++) pool[off + k] = table.productId(t, ht, P, k * S, hs[k]);
    // The pool may be replaced later; `cols` is set to the final pool in `finish`.
    const row = { cols: pool, off, len, vals: coeffsOf(f) };
    if (this.sources) this.sources.set(row, { src, t: t.slice() });
    return row;
  }

  /// Symbolic preprocessing: every monomial that a leading monomial of `elts[active]`
  /// divides gets a reducer row (the shortest such element); the table grows while it is
  /// walked.
  preprocess(elts: readonly BasisElt[], active: readonly number[], ticker: Ticker): void {
    const table = this.table,
      S = table.stride,
      t = this.scratch;
    // Candidates by increasing length (stable, so ties keep the order of `active`): the
    // first divisor met is the shortest, and the scan stops there.
    const byLen = active.slice().sort((a, b) => elts[a].poly.m.length - elts[b].poly.m.length);
    const lms = byLen.map((k) => elts[k].lm);
    for (let id = 0; id < table.size; id++) {
      ticker.tick();
      if (this.pivotOf[id] !== undefined) continue;
      const E = table.exps,
        o = id * S;
      const mask = E[o + 2],
        deg = E[o + 1];
      let best = -1;
      outer: for (let k = 0; k < lms.length; k++) {
        const lm = lms[k];
        if ((lm[2] & ~mask) !== 0 || lm[1] > deg) continue;
        for (let i = H; i < S; i++) if (lm[i] > E[o + i]) continue outer;
        best = byLen[k];
        break;
      }
      if (best < 0) continue;
      const lm = elts[best].lm;
      let tmask = 0;
      t[0] = E[o] - lm[0];
      t[1] = deg - lm[1];
      for (let i = H; i < S; i++) {
        const x = E[o + i] - lm[i];
        t[i] = x;
        if (x !== 0) tmask |= 1 << ((i - H) & 31);
      }
      t[2] = tmask;
      this.pivotOf[id] = this.product(elts[best].poly, t, best);
    }
  }

  /// The monomial of each B column, built once and shared by every polynomial of the step
  /// that has it (monomials are never changed in place), which keeps the number of small
  /// arrays, and so the garbage collector's work, proportional to the columns.
  bMonos(bIds: Int32Array): (c: number) => Mono {
    const cache: (Mono | undefined)[] = new Array(bIds.length);
    return (c) => (cache[c] ??= this.table.mono(bIds[c]));
  }

  /// Numbers the columns (pivot columns first, then the others, each in decreasing monomial
  /// order), rewrites every row's ids as columns, and returns the matrix with the monomial
  /// id of each B column.
  finish(): { M: F4Matrix; bIds: Int32Array } {
    const table = this.table,
      n = table.size;
    const aIds: number[] = [],
      bIds: number[] = [];
    for (let id = 0; id < n; id++) (this.pivotOf[id] !== undefined ? aIds : bIds).push(id);
    const cmp = table.comparator(this.R.ring.order);
    const desc = (a: number, b: number) => cmp(b, a);
    aIds.sort(desc);
    bIds.sort(desc);
    const nA = aIds.length;
    const colOf = new Int32Array(n);
    for (let c = 0; c < nA; c++) colOf[aIds[c]] = c;
    for (let c = 0; c < bIds.length; c++) colOf[bIds[c]] = nA + c;
    const pool = this.pool;
    for (let k = 0; k < this.used; k++) pool[k] = colOf[pool[k]];
    const pivots: SparseRow[] = new Array(nA);
    for (let c = 0; c < nA; c++) {
      const r = this.pivotOf[aIds[c]]!;
      r.cols = pool;
      pivots[c] = r;
    }
    for (const r of this.rows) r.cols = pool;
    return { M: { pivots, rows: this.rows, nA, ncols: n }, bIds: Int32Array.from(bIds) };
  }
}

export const reduceF4: ReductionStep = (R, batch, inputs, basis, opts, ticker) => f4Step(R, batch, inputs, basis, opts, ticker, null);

/// One F4 step; with `trace`, what it did is appended to it.
function f4Step<C>(...[R, batch, inputs, basis, opts, ticker, trace]: [...Parameters<ReductionStep>, F4StepTrace[] | null]): Reduced<C>[] {
  const p = (R.K as unknown as GFCoeffs).p;
  const { elts, active } = basis;
  const B = new MatrixBuilder(R);
  if (trace) B.sources = new Map();
  const one = monoOne(R.layout);
  const seen = new Set<number>();
  const addPairRow = (k: number, lcm: Mono) => {
    const e = elts[k];
    // The same multiple of the same element is needed once: looked up before it is built.
    const lead = B.idOf(lcm);
    const key = lead * elts.length + k;
    if (seen.has(key)) return;
    seen.add(key);
    const row = B.product(e.poly, monoDiv(lcm, e.lm), k);
    if (B.pivotOf[lead] === undefined) B.pivotOf[lead] = row;
    else B.rows.push(row);
  };
  for (const pr of batch) {
    if (pr.j < 0) B.rows.push(B.product(inputs[pr.i], one, -1 - pr.i));
    else {
      addPairRow(pr.i, pr.lcm);
      addPairRow(pr.j, pr.lcm);
    }
  }
  B.preprocess(elts, active, ticker);
  const { M, bIds } = B.finish();
  // Shorter rows first (the order only affects speed).
  M.rows.sort((a, b) => a.len - b.len);
  checkpoint(opts, { stage: "groebner", detail: `matrix ${M.rows.length + M.nA}×${M.ncols} (${M.nA} pivots)` });

  const sugar = batch[0].sugar;
  const out: Reduced<C>[] = [];
  const found = reduceF4Matrix(p, M, ticker);
  const monoOf = B.bMonos(bIds);
  for (const r of found.rows) {
    checkLimit(opts, "maxTerms", r.len, "a polynomial's number of terms");
    const m: Mono[] = new Array(r.len);
    for (let k = 0; k < r.len; k++) m[k] = monoOf(r.cols[k]);
    out.push({ m, c: Array.from(r.vals) as unknown as C[], sugar });
  }
  if (trace && B.sources) {
    const src = B.sources;
    trace.push({
      pivots: M.pivots.map((r) => src.get(r)!),
      rows: found.from.map((i) => src.get(M.rows[i])!),
      leads: out.map((r) => r.m[0]),
    });
  }
  return out;
}

/// Where a row comes from: the multiple t·f of basis element `src` (or of input −1 − src).
export interface RowSource {
  src: number;
  t: Mono;
}

/// What one F4 step did, enough to redo it over another prime without pair handling or the
/// search for reducers (the idea of C. Traverso, "Gröbner trace algorithms", ISSAC 1988):
/// its reducer rows, the rows to reduce that gave new elements (the others reduced to 0),
/// and the leading monomials of the new elements, in order.
export interface F4StepTrace {
  pivots: RowSource[];
  rows: RowSource[];
  leads: Mono[];
}

/// The F4 strategy, recording each step into `trace`.
export function tracingF4(base: Strategy, trace: F4StepTrace[]): Strategy {
  return { ...base, reduce: (R, batch, inputs, basis, opts, ticker) => f4Step(R, batch, inputs, basis, opts, ticker, trace) };
}

/// Redoes a traced computation over GF(p) (the same ring but another prime) from the
/// inputs' images: every step builds only the traced rows and must give the traced leading
/// monomials. Returns the reduced basis, or null when a step differs (p, or the traced
/// prime, is unlucky for this ideal): the caller then computes from scratch.
export function replayF4(
  R: RingCtx<number>,
  trace: readonly F4StepTrace[],
  inputs: readonly Poly[],
  opts: ComputeOptions | undefined,
): Poly[] | null {
  const p = (R.K as GFCoeffs).p;
  const ticker = new Ticker(opts, () => ({ stage: "groebner", detail: "following the first prime's trace" }));
  const elts: Poly[] = [];
  const polyOf = (s: RowSource) => (s.src >= 0 ? elts[s.src] : inputs[-1 - s.src]);
  for (const step of trace) {
    checkpoint(opts, { stage: "groebner", detail: `following the first prime's trace (${elts.length} elements)` });
    const B = new MatrixBuilder(R);
    for (const s of step.pivots) {
      const f = polyOf(s);
      if (!f || f.m.length === 0) return null;
      const row = B.product(f, s.t);
      const lead = row.cols[row.off];
      if (B.pivotOf[lead] !== undefined) return null;
      B.pivotOf[lead] = row;
    }
    for (const s of step.rows) {
      const f = polyOf(s);
      if (!f || f.m.length === 0) return null;
      B.rows.push(B.product(f, s.t));
    }
    const { M, bIds } = B.finish();
    const found = reduceF4Matrix(p, M, ticker);
    if (found.rows.length !== step.leads.length) return null;
    // Same leading monomials, put in the traced order (later steps refer to the indices).
    const byLead = new Map<string, SparseRow>();
    const monoOf = B.bMonos(bIds);
    for (const r of found.rows) byLead.set(monoOf(r.cols[0]).join(","), r);
    for (const lead of step.leads) {
      const r = byLead.get(lead.join(","));
      if (!r) return null;
      const m: Mono[] = new Array(r.len);
      for (let k = 0; k < r.len; k++) m[k] = monoOf(r.cols[k]);
      elts.push(makePoly(m, Array.from(r.vals)));
    }
  }
  return interreduceF4(R, elts, opts);
}

/// The reduced Gröbner basis from a Gröbner basis over GF(p) (monic elements): the minimal
/// elements keep their leading terms and their tails are reduced all at once, as the rows of
/// one F4 matrix whose reducers are the multiples of the minimal elements. Sorted by
/// increasing leading monomial.
export function interreduceF4(R: RingCtx<number>, G: readonly Poly[], opts: ComputeOptions | undefined): Poly[] {
  const p = (R.K as GFCoeffs).p;
  const sorted = G.filter((g) => g.m.length > 0).sort((a, b) => R.cmp(a.m[0], b.m[0]));
  const minimal: Poly[] = [];
  for (const g of sorted) if (!minimal.some((h) => monoDivides(h.m[0], g.m[0]))) minimal.push(g);
  const elts: BasisElt[] = minimal.map((g) => {
    const poly = makeMonic(R, [...g.m], [...asTyped<number>(g).c]);
    return { poly, lm: poly.m[0], sugar: 0 };
  });
  const ticker = new Ticker(opts, () => ({ stage: "groebner", detail: "reducing the basis" }));
  checkpoint(opts, { stage: "groebner", detail: `reducing the basis (${elts.length} elements)` });
  const B = new MatrixBuilder(R);
  const one = monoOne(R.layout);
  for (const e of elts) {
    const row = B.product(e.poly, one);
    B.pivotOf[row.cols[row.off]] = row;
    B.rows.push(row);
  }
  B.preprocess(
    elts,
    elts.map((_, i) => i),
    ticker,
  );
  const { M, bIds } = B.finish();
  const tails = reduceTails(p, M, ticker);
  const monoOf = B.bMonos(bIds);
  return elts.map((e, i) => {
    const t = tails[i];
    const len = t ? t.len : 0;
    const m: Mono[] = new Array(len + 1),
      c: number[] = new Array(len + 1);
    m[0] = e.lm;
    c[0] = 1;
    for (let k = 0; k < len; k++) {
      m[k + 1] = monoOf(t!.cols[k]);
      c[k + 1] = t!.vals[k];
    }
    return makePoly(m, c);
  });
}
