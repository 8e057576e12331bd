import { AlgebraError } from "../../errors";
import { Echelon } from "../../graded/echelon";
import { SparseEchelon } from "../../graded/sparse-echelon";
import { sparseKernelBasis } from "../../graded/sparse-kernel";
import { gradedQuotient, type GradedQuotient } from "../../graded/piece";
import { type Ideal, idealGroebnerBasis } from "../../ideal/ideal";
import { idealSum } from "../../ideal/arith";
import { checkLimit, checkpoint, type ComputeOptions, type ProgressInfo } from "../../options";
import { add, degree, monomial, terms, zero } from "../../poly/checked";
import { type Poly } from "../../poly/poly";
import { type PolyRing } from "../../poly/ring";
import { compact, densify, GradedFree, type Layout, type Sparse } from "./free";
import { freeModule } from "../../module/free";
import { moduleHilbertSeries } from "../../module/hilbert";
import { hilbertFunctionValues } from "../../hilbert/series";
import { lowerKey, multidegreeOf, PerDegreeBlock, type BlockKey } from "./multidegree";

/// β_{i,j} for one homological degree i.
export interface BettiColumn {
  index: number;
  /// Nonzero β_{i,j} by increasing internal degree j.
  entries: { degree: number; count: number }[];
  total: number;
  /// False when a degree bound may have cut generators of this column: then the
  /// entries are exact up to `exactThroughDegree` and the total is a lower bound.
  complete: boolean;
}

export interface QuotientResolution {
  columns: BettiColumn[];
  /// Every β_{i,j} with j ≤ this degree is exact (Infinity: no degree was cut).
  exactThroughDegree: number;
  complete: boolean;
  /// How completeness of each column was decided.
  reason: string;
  /// With `keepMaps`: the matrices of d_i : F_i → F_{i−1} (i = 1…), entries in S
  /// (representatives of elements of R = S/J), rank_{i−1} rows × rank_i columns.
  maps?: Poly[][][];
}

export interface LocalResolveOptions extends ComputeOptions {
  /// Called once per finished Betti column, in order.
  partial?: (column: BettiColumn) => void;
}

/// Data of one degree of a pass, for callers that inspect the syzygy module itself.
export interface DegreeData<C> {
  /// The homological degree i of the kernel K_i = ker(F_i → F_{i−1}).
  i: number;
  j: number;
  F: GradedFree<C>;
  /// The global coordinates of F_j of the group (one multidegree, or all of F_j) that the
  /// vectors below live in, densely.
  block: readonly number[];
  /// A basis of (K_i)_j and of (m·K_i)_j inside that group.
  kernel: Echelon<C>;
  decomposable: Echelon<C>;
}

export interface ResolveRequest<C> {
  /// R = S/J, J homogeneous.
  ring: Ideal;
  /// The module R/I (I an ideal of S; the residue field when I is the ideal of the variables).
  module?: Ideal;
  /// Or a module given by a presentation: coker of a matrix over R (entries in S, read
  /// modulo J, homogeneous), its rows the generators in the given degrees (≥ 0).
  presentation?: ModulePresentation;
  length: number;
  degree?: number;
  opts?: LocalResolveOptions;
  inspect?: (d: DegreeData<C>) => void;
  /// Keep the differentials as matrices while Σ rank_{i−1}·rank_i stays within this many
  /// entries; past it no map is kept (`maps` absent).
  keepMaps?: number;
}

export interface ModulePresentation {
  rows: readonly (readonly Poly[])[];
  /// The degree of each generator (row).
  degrees: readonly number[];
}

/// Whether every element of a Gröbner basis is a monomial (then the ideal is monomial and
/// everything below is Z^n-graded).
function isMonomialIdeal(I: Ideal): boolean {
  return idealGroebnerBasis(I).every((g) => terms(I.ring, g).length === 1);
}

/// The minimal graded free resolution of R/I over R = S/J up to homological degree
/// `length`, computed degree by degree by linear algebra on the graded pieces R_d: in
/// degree j the syzygies K_{i,j} of the last module are known; those of the form
/// x_v·K_{i,j−w_v} span the decomposable part and a complement of it in K_{i,j} gives the
/// new generators of F_{i+1} (graded Nakayama). dim K_{i,j} follows from exactness, so
/// the kernel is computed by elimination only in degrees where new generators appear.
/// When J and I are monomial ideals every module and map is Z^n-graded, and each degree
/// splits into independent blocks, one per multidegree (common practice).
export function resolveDegreewise<C>(req: ResolveRequest<C>): QuotientResolution {
  const setup = prepare<C>(req);
  const { R, plan, opts } = setup;
  const n = req.length;
  let { target, F } = firstModules(setup);
  let prevKernelDims = new PerDegreeBlock();
  const columns: BettiColumn[] = [];
  const push = (c: BettiColumn) => {
    columns.push(c);
    opts?.partial?.(c);
  };
  push({ index: 0, entries: countDegrees(F.degrees), total: F.rank, complete: true });
  let prevComplete = true;
  let maps: Poly[][][] | null | undefined;
  let mapEntries = 0;

  for (let i = 0; i < n; i++) {
    if (F.rank === 0) {
      // M = 0 (a free module of rank 0): every column is zero.
      for (let k = i + 1; k <= n; k++) push({ index: k, entries: [], total: 0, complete: true });
      break;
    }
    const natural = R.isArtinian ? Math.max(...F.degrees) + R.topDegree()! : Infinity;
    const { next, kernelDims } = nextModule(setup, i, F, target, prevKernelDims, Math.min(plan.D, natural));
    if (req.keepMaps !== undefined && maps !== null) {
      mapEntries += F.rank * next.rank;
      maps = mapEntries <= req.keepMaps ? [...(maps ?? []), matrixOf(setup.S, F, next)] : null;
    }
    const complete: boolean = plan.bound(i + 1) <= plan.D || (prevComplete && natural <= plan.D);
    push({ index: i + 1, entries: countDegrees(next.degrees), total: next.rank, complete });
    prevComplete = complete;
    target = F;
    F = next;
    prevKernelDims = kernelDims;
    if (F.rank === 0) {
      // The resolution ended: the remaining columns are zero, exactly so when complete.
      for (let k = i + 2; k <= n; k++) push({ index: k, entries: [], total: 0, complete });
      break;
    }
  }
  return {
    columns,
    exactThroughDegree: plan.D,
    complete: columns.every((c) => c.complete),
    reason: plan.reason,
    ...(maps ? { maps } : {}),
  };
}

/// Everything one resolution shares: the rings, the relations of a presented module, the
/// degree plan and whether everything is multigraded.
interface Setup<C> {
  req: ResolveRequest<C>;
  opts?: LocalResolveOptions;
  S: PolyRing;
  /// R = S/J, and S/(J + I) for a cyclic module R/I
  R: GradedQuotient<C>;
  Q: GradedQuotient<C> | null;
  K: GradedQuotient<C>["K"];
  pres: { columns: { degree: number; vector: Sparse<C> }[] } | null;
  plan: DegreePlan;
  multi: boolean;
  maxW: number;
}

/// Step 1: check the request, build the graded rings and decide how far degrees must go.
function prepare<C>(req: ResolveRequest<C>): Setup<C> {
  const { opts } = req;
  const S = req.ring.ring;
  const R = gradedQuotient(req.ring) as GradedQuotient<C>;
  const n = req.length;
  if (!Number.isInteger(n) || n < 0) throw new AlgebraError("runtime", "resolution: the length must be a non-negative integer");
  if ((req.module === undefined) === (req.presentation === undefined))
    throw new AlgebraError("runtime", "resolution: give either an ideal or a presentation");
  const pres = req.presentation ? presentationVectors(S, R, req.presentation) : null;
  const Q = req.module ? (gradedQuotient(idealSum(req.ring, req.module)) as GradedQuotient<C>) : null;
  const top = Q ? Q.topDegree() : topDegreeOf(S, req.ring, req.presentation!, opts);
  const gensDeg = Q
    ? Math.max(1, ...idealGroebnerBasis(req.module!).map((f: Poly) => degree(S, f)))
    : Math.max(1, ...pres!.columns.map((c) => c.degree));
  const plan = degreePlan(S, R, top, gensDeg, pres ? Math.max(0, ...req.presentation!.degrees) : 0, n, req.degree);
  checkLimit(opts, "maxDegree", plan.D === Infinity ? 0 : plan.D, "the internal degree of the resolution");
  const multi = !pres && isMonomialIdeal(req.ring) && isMonomialIdeal(req.module!);
  return { req, opts, S, R, Q, K: R.K, pres, plan, multi, maxW: Math.max(...R.weights) };
}

/// Step 2: F_0 and its target. F_{−1} = the module R/I itself, as one generator over the
/// pieces of S/(J + I); for a presented module there is no target: K_0 is the span of the
/// relations.
function firstModules<C>({ req, R, Q, K, pres, multi }: Setup<C>): { target: GradedFree<C>; F: GradedFree<C> } {
  const origin = new Array<number>(R.n).fill(0);
  const target = new GradedFree<C>(Q ?? R, multi);
  const F = new GradedFree<C>(R, multi);
  if (pres) {
    req.presentation!.degrees.forEach((d) => F.addGenerator(d, { idx: [], val: [] }));
  } else {
    target.addGenerator(0, { idx: [], val: [] }, origin);
    F.addGenerator(0, { idx: [0], val: [K.one] }, origin);
  }
  return { target, F };
}

/// Step 3: F_{i+1}, whose generators map onto minimal generators of K_i = ker(F_i → F_{i−1}),
/// degree by degree up to jmax, group by group.
function nextModule<C>(
  setup: Setup<C>,
  i: number,
  F: GradedFree<C>,
  target: GradedFree<C>,
  prevKernelDims: PerDegreeBlock,
  jmax: number,
): { next: GradedFree<C>; kernelDims: PerDegreeBlock } {
  const { req, opts, R, multi, maxW } = setup;
  const n = req.length;
  const next = new GradedFree<C>(R, multi);
  /// Kernel bases by degree, then by group.
  const kernels = new Map<number, Map<BlockKey, KernelBasis<C>>>();
  const kernelDims = new PerDegreeBlock();
  const images = new ImageCache(F, target);
  const pass: Pass<C> = { setup, i, F, next, kernels, prevKernelDims, images };
  for (let j = Math.min(...F.degrees); j <= jmax; j++) {
    const info = () => ({
      stage: "resolution over a quotient ring",
      detail: `homological degree ${i + 1}, internal degree ${j}`,
      fraction: n > 0 ? i / n : 1,
    });
    checkpoint(opts, info);
    checkLimit(opts, "maxBasisSize", F.dim(j), "a graded piece of the resolution");
    const L = F.layout(j);
    const TL = target.layout(j);
    const here = new Map<BlockKey, KernelBasis<C>>();
    kernels.set(j, here);
    for (const [key, block] of L.blocks) {
      const { kernel, decomposable } = syzygiesOfBlock(pass, j, key, block, L, TL, info);
      here.set(key, kernel);
      kernelDims.set(j, key, kernel.rank);
      // With `inspect` the bases are dense Echelons (syzygiesOfBlock keeps them so).
      if (req.inspect) req.inspect({ i, j, F, block, kernel: kernel as Echelon<C>, decomposable: decomposable as Echelon<C> });
    }
    kernels.delete(j - maxW);
  }
  return { next, kernelDims };
}

/// What one pass (homological degree i) shares across degrees and groups.
interface Pass<C> {
  setup: Setup<C>;
  i: number;
  F: GradedFree<C>;
  next: GradedFree<C>;
  kernels: Map<number, Map<BlockKey, KernelBasis<C>>>;
  prevKernelDims: PerDegreeBlock;
  images: ImageCache<C>;
}

/// Step 4, one group of one degree j: a basis of K_{i,j} there, its decomposable part
/// spanned by x_v·K_{i,j−w_v}, and new generators of F_{i+1} for a complement (graded
/// Nakayama), found by elimination only when the products fall short of dim K_{i,j}.
function syzygiesOfBlock<C>(
  { setup, i, F, next, kernels, prevKernelDims, images }: Pass<C>,
  j: number,
  key: BlockKey,
  block: readonly number[],
  L: Layout,
  TL: Layout,
  info: () => ProgressInfo,
): { kernel: KernelBasis<C>; decomposable: KernelBasis<C> } {
  const { req, opts, R, K, pres } = setup;
  const dimF = block.length;
  const tBlock = TL.blocks.get(key) ?? [];
  // d_i maps F_i onto K_{i−1} (onto the module itself for i = 0).
  const relations = i === 0 && pres ? pres.columns.filter((c) => c.degree === j) : null;
  const expected = relations ? dimF : dimF - (i === 0 ? tBlock.length : (prevKernelDims.get(j, key) ?? 0));
  // Sparse rows unless a caller inspects the bases (it reads them densely): a kernel basis
  // is products of syzygies by variables, sparse, while dense rows cost rank × dim.
  const P: KernelBasis<C> = req.inspect ? new Echelon<C>(K, dimF) : new SparseEchelon<C>(K, dimF);
  // Products beyond rank `expected` add nothing: they all lie in K_{i,j}.
  products: for (let v = 0; v < R.n && expected > 0; v++) {
    const lk = lowerKey(key, v);
    const jl = j - R.weights[v];
    const low = lk === null ? undefined : kernels.get(jl)?.get(lk);
    if (!low) continue;
    const from = F.layout(jl).blocks.get(lk!)!;
    if (low instanceof SparseEchelon && P instanceof SparseEchelon) {
      for (let r = 0; r < low.rank; r++) {
        if (P.rank >= expected) break products;
        checkpoint(opts, info);
        F.mulVarSparseInto(v, jl, from, low.idx, low.val, low.start[r], low.start[r + 1], P);
        P.insertAccumulated();
      }
    } else {
      for (const b of (low as Echelon<C>).rows) {
        if (P.rank >= expected) break products;
        checkpoint(opts, info);
        insertDense(P, F.mulVarBlock(v, jl, from, b, dimF));
      }
    }
  }
  if (P.rank > expected) throw new AlgebraError("runtime", "resolution: internal inconsistency (syzygies exceed the kernel)");
  let decomposable: KernelBasis<C> = P;
  if (relations) {
    // K_{0,j} = m·K_0 in degree j plus the relations of degree j; those outside the
    // span so far are minimal relations (graded Nakayama).
    if (req.inspect) {
      decomposable = new Echelon<C>(K, dimF);
      for (const r of (P as Echelon<C>).rows) (decomposable as Echelon<C>).insert(r);
    }
    for (const rel of relations) {
      const z = densify(K, rel.vector, L, dimF);
      if (insertDense(P, z)) next.addGenerator(j, rel.vector);
    }
  } else if (P.rank < expected) {
    if (req.inspect) {
      decomposable = new Echelon<C>(K, dimF);
      for (const r of (P as Echelon<C>).rows) (decomposable as Echelon<C>).insert(r);
    }
    // K_{i,j} = P ⊕ (K_{i,j} ∩ C) for C spanned by the unit vectors off the pivots of P,
    // and d vanishes on P: the new syzygies are the kernel of d restricted to C.
    const pivots = new Set(P.pivots);
    const free: number[] = [];
    for (let k = 0; k < dimF; k++) if (!pivots.has(k)) free.push(k);
    // The images sparse over the target group, the kernel by sparse elimination: dense
    // combinations (free × rank) were most of the memory of the largest pieces.
    const cols = free.map((k) => {
      const w = images.of(j, block[k]);
      return { idx: w.idx.map((x) => TL.local[x]), val: w.val };
    });
    const ker = sparseKernelBasis(K, tBlock.length, free.length, cols, () => checkpoint(opts, info));
    if (ker.length !== expected - P.rank) throw new AlgebraError("runtime", "resolution: internal inconsistency (kernel dimension)");
    const md = multidegreeOf(key);
    for (const c of ker) {
      // sparse throughout: a dense vector of dimF per new generator was most of the time of
      // the largest pieces (free, c.idx and block all increase, so the indices stay sorted)
      const local = c.idx.map((k) => free[k]);
      if (P instanceof SparseEchelon) P.insert({ idx: local, val: c.val });
      else {
        const z = new Array<C>(dimF).fill(K.zero);
        local.forEach((k, t) => (z[k] = c.val[t]));
        P.insert(z);
      }
      next.addGenerator(j, { idx: local.map((k) => block[k]), val: c.val.slice() }, md);
    }
  }
  return { kernel: P, decomposable };
}

/// A basis of K_{i,j} in one group: dense rows (for `inspect`) or sparse ones.
type KernelBasis<C> = Echelon<C> | SparseEchelon<C>;

function insertDense<C>(P: KernelBasis<C>, v: readonly C[]): boolean {
  return P instanceof SparseEchelon ? P.insertDense(v) : P.insert(v);
}

/// The matrix of F_{i+1} → F_i: column g holds the boundary of generator g of `next`,
/// read back from coordinates (a standard monomial u times a generator h of F) as Σ c·x^u.
function matrixOf<C>(S: PolyRing, F: GradedFree<C>, next: GradedFree<C>): Poly[][] {
  const K = F.K;
  const rows = Array.from({ length: F.rank }, () => Array.from({ length: next.rank }, () => zero(S)));
  next.boundary.forEach((b, g) => {
    const j = next.degrees[g];
    const L = F.layout(j);
    for (let k = 0; k < b.idx.length; k++) {
      const h = L.generator[b.idx[k]];
      const u = F.A.basis(j - F.degrees[h])[b.idx[k] - L.offsets[h]];
      const q = K.toRational(b.val[k]);
      rows[h][g] = add(S, rows[h][g], monomial(S, u, q.num, q.den));
    }
  });
  return rows;
}

function countDegrees(degs: readonly number[]): { degree: number; count: number }[] {
  const m = new Map<number, number>();
  for (const d of degs) m.set(d, (m.get(d) ?? 0) + 1);
  return [...m.entries()].sort((a, b) => a[0] - b[0]).map(([degree, count]) => ({ degree, count }));
}

/// Images under the differential of the basis elements u·g of F (u a standard monomial),
/// sparse vectors of the target, built from lower degrees one variable at a time.
class ImageCache<C> {
  private readonly memo = new Map<string, Sparse<C>[]>();

  constructor(
    private readonly F: GradedFree<C>,
    private readonly T: GradedFree<C>,
  ) {}

  private ofGenerator(g: number, e: number): Sparse<C>[] {
    const key = `${g}:${e}`;
    let out = this.memo.get(key);
    if (out) return out;
    const A = this.F.A;
    const a = this.F.degrees[g];
    if (e === 0) out = [this.F.boundary[g]];
    else {
      out = A.basis(e).map((u) => {
        let v = A.n - 1;
        while (u[v] === 0) v--;
        const w = u.slice();
        w[v]--;
        const below = this.ofGenerator(g, e - A.weights[v]);
        return this.T.mulVarSparse(v, a + e - A.weights[v], below[A.indexOf(e - A.weights[v], w)]);
      });
    }
    this.memo.set(key, out);
    return out;
  }

  /// d of the global coordinate idx of F_j.
  of(j: number, idx: number): Sparse<C> {
    const L = this.F.layout(j);
    const g = L.generator[idx];
    return this.ofGenerator(g, j - this.F.degrees[g])[idx - L.offsets[g]];
  }
}

interface DegreePlan {
  D: number;
  /// A proven upper bound for the degrees of generators of F_i (Infinity when unknown).
  bound: (i: number) => number;
  reason: string;
}

/// Which internal degrees to compute. Facts used:
/// * Artinian R: F_{i,j} = 0 for j > (top generator degree of F_i) + (top degree of R),
///   so the computation stops by itself and nothing is cut.
/// * Standard grading, M = k: t_i(k) ≤ 1 + (i − 1)(g − 1) for i ≥ 1, g the largest degree of
///   a generator of the initial ideal of J (rate(R) ≤ g − 1: J. Backelin, "On the rates of
///   growth of the homologies of Veronese subrings", Lecture Notes in Math. 1183, 1986;
///   stated in A. Conca, E. De Negri, M. E. Rossi, "Koszul algebras and regularity", 2013 —
///   cited from memory).
/// * M of finite length with top degree s: Tor_i(M, k) is a subquotient of M ⊗ F_i(k), so
///   t_i(M) ≤ t_i(k) + s.
function degreePlan<C>(
  S: PolyRing,
  R: GradedQuotient<C>,
  s: number | null,
  gensDeg: number,
  top0: number,
  n: number,
  degreeBound?: number,
): DegreePlan {
  const standard = S.degrees.every((w) => w === 1);
  const g = Math.max(2, R.initialDegree);
  let bound: (i: number) => number = () => Infinity;
  let reason = "no degree bound is known for this module: columns beyond the computed degrees are lower bounds";
  if (standard && s !== null) {
    bound = (i) => (i === 0 ? top0 : 1 + (i - 1) * (g - 1) + s);
    reason = "degrees bounded by the rate of R (Backelin) plus the top degree of the module";
  }
  if (R.isArtinian) reason = "R is Artinian: every graded piece beyond the computed ones is zero";
  if (degreeBound !== undefined) {
    if (!Number.isInteger(degreeBound) || degreeBound < 0)
      throw new AlgebraError("runtime", "resolution: the degree bound must be a non-negative integer");
    return { D: degreeBound, bound, reason };
  }
  if (R.isArtinian) return { D: Infinity, bound, reason };
  if (bound(n) < Infinity) return { D: bound(n), bound, reason };
  // No proven bound: a generous guess, and the columns say they may be incomplete.
  return { D: 1 + n * Math.max(g, gensDeg), bound, reason };
}

/// The columns of a presentation as sparse vectors of F_0 = ⊕ R(−a_p), each in its degree
/// (the entries reduced to normal form modulo J).
function presentationVectors<C>(
  S: PolyRing,
  R: GradedQuotient<C>,
  P: ModulePresentation,
): { columns: { degree: number; vector: Sparse<C> }[] } {
  const degs = P.degrees;
  if (degs.some((d) => !Number.isInteger(d) || d < 0))
    throw new AlgebraError("runtime", "resolution: generator degrees must be integers ≥ 0");
  if (P.rows.length !== degs.length) throw new AlgebraError("runtime", "resolution: one degree per row of the presentation is needed");
  const cols = P.rows[0]?.length ?? 0;
  const K = R.K;
  const out: { degree: number; vector: Sparse<C> }[] = [];
  for (let q = 0; q < cols; q++) {
    let d: number | null = null;
    for (let p = 0; p < degs.length; p++) {
      for (const t of terms(S, P.rows[p][q])) {
        const e = degs[p] + t.exps.reduce((a, x, v) => a + x * S.degrees[v], 0);
        if (d !== null && d !== e) throw new AlgebraError("runtime", `resolution: column ${q + 1} of the presentation is not homogeneous`);
        d = e;
      }
    }
    if (d === null) continue; // a zero column
    const acc = new Map<number, C>();
    let offset = 0;
    for (let p = 0; p < degs.length; p++) {
      for (const t of terms(S, P.rows[p][q])) {
        const nf = R.reduceMonomial(d - degs[p], t.exps);
        const c = K.fromRational(t.num, t.den);
        nf.idx.forEach((k, r) => acc.set(offset + k, K.add(acc.get(offset + k) ?? K.zero, K.mul(c, nf.val[r]))));
      }
      offset += R.dim(d - degs[p]);
    }
    const vector = compact(K, acc);
    if (vector.idx.length > 0) out.push({ degree: d, vector });
  }
  return { columns: out };
}

/// The top degree of a presented module M over S/J when M has finite length (null
/// otherwise), from its Hilbert series as an S-module presented by [A | J·1].
function topDegreeOf(S: PolyRing, J: Ideal, P: ModulePresentation, opts?: ComputeOptions): number | null {
  const r = P.degrees.length;
  const gens: Poly[][] = [];
  const cols = P.rows[0]?.length ?? 0;
  for (let q = 0; q < cols; q++) gens.push(P.rows.map((row) => row[q]));
  for (const g of idealGroebnerBasis(J)) for (let p = 0; p < r; p++) gens.push(P.degrees.map((_, k) => (k === p ? g : zero(S))));
  const hs = moduleHilbertSeries(freeModule(S, P.degrees), gens, opts);
  // finite length exactly when the Hilbert series has no pole at t = 1 (any positive grading;
  // the Hilbert polynomial exists only for the standard one)
  if (hs.dimension > 0) return null;
  let top = -1;
  const N = hs.numerator.length + 1;
  hilbertFunctionValues(hs, N, opts).forEach((v, d) => {
    if (v !== 0n) top = d;
  });
  return top < 0 ? null : top;
}
