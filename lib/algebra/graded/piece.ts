import { runtimeError } from "../errors";
import { coeffsOf, type Coeffs } from "../field/coeffs";
import { type Ideal, idealGroebnerBasis } from "../ideal/ideal";
import { leadExponents, monomial, terms } from "../poly/checked";
import { normalForm } from "../groebner/checked";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";

/// A sparse column: the image of one basis element as (index, coefficient) pairs.
export type SparseColumn<C> = { idx: number[]; val: C[] };

/// The graded pieces R_d of R = S/J for a homogeneous ideal J of S (positive weights):
/// R_d has the basis of standard monomials of degree d (monomials outside the initial
/// ideal of J — Macaulay's theorem), and multiplication by a variable is a sparse matrix
/// computed from normal forms modulo the Gröbner basis of J.
export class GradedQuotient<C = unknown> {
  readonly K: Coeffs<C>;
  readonly n: number;
  readonly weights: readonly number[];
  private readonly G: readonly Poly[];
  private readonly leads: number[][];
  private readonly bases = new Map<number, number[][]>();
  private readonly indices = new Map<number, Map<string, number>>();
  private readonly mults: SparseColumn<C>[][][] = [];

  constructor(
    readonly S: PolyRing,
    readonly J: Ideal,
  ) {
    if (S.degrees.some((w) => w <= 0)) throw runtimeError("graded", "the grading must give every variable a positive degree");
    this.K = coeffsOf(S.field) as Coeffs<C>;
    this.n = S.vars.length;
    this.weights = S.degrees;
    this.G = idealGroebnerBasis(J);
    for (const g of this.G) {
      const ds = terms(S, g).map((t) => t.exps.reduce((s, e, i) => s + e * S.degrees[i], 0));
      if (ds.some((d) => d !== ds[0])) throw runtimeError("graded", "the defining ideal must be homogeneous");
    }
    this.leads = this.G.map((g) => leadExponents(S, g));
    if (this.leads.some((l) => l.every((e) => e === 0))) throw runtimeError("graded", "the quotient ring is zero");
  }

  /// The largest degree of a minimal generator of the initial ideal (0 when J = 0).
  get initialDegree(): number {
    return Math.max(0, ...this.leads.map((l) => l.reduce((s, e, i) => s + e * this.weights[i], 0)));
  }

  /// Whether R has finite length: some power of every variable is a leading monomial.
  get isArtinian(): boolean {
    for (let v = 0; v < this.n; v++) {
      if (!this.leads.some((l) => l.every((e, i) => (i === v ? e > 0 : e === 0)))) return false;
    }
    return true;
  }

  /// For Artinian R, the largest d with R_d ≠ 0; null otherwise.
  topDegree(): number | null {
    if (!this.isArtinian) return null;
    const wmax = Math.max(...this.weights);
    let top = 0;
    for (let d = 1; ; d++) {
      if (this.dim(d) > 0) top = d;
      else if (d - top > wmax) return top;
    }
  }

  isStandard(e: readonly number[]): boolean {
    return !this.leads.some((l) => l.every((a, i) => a <= e[i]));
  }

  /// The standard monomials of degree d (exponent vectors), in a fixed order.
  basis(d: number): number[][] {
    let B = this.bases.get(d);
    if (B) return B;
    B = [];
    if (d === 0) B.push(new Array<number>(this.n).fill(0));
    else if (d > 0) {
      for (let v = 0; v < this.n; v++) {
        if (this.weights[v] > d) continue;
        for (const u of this.basis(d - this.weights[v])) {
          // Append variables in nondecreasing order so each monomial arises once.
          let last = -1;
          for (let i = 0; i < this.n; i++) if (u[i] > 0) last = i;
          if (last > v) continue;
          const e = u.slice();
          e[v]++;
          if (this.isStandard(e)) B.push(e);
        }
      }
    }
    this.bases.set(d, B);
    return B;
  }

  dim(d: number): number {
    return d < 0 ? 0 : this.basis(d).length;
  }

  /// The position of a standard monomial of degree d in basis(d).
  indexOf(d: number, e: readonly number[]): number {
    let M = this.indices.get(d);
    if (!M) {
      M = new Map();
      this.basis(d).forEach((b, k) => M!.set(b.join(","), k));
      this.indices.set(d, M);
    }
    const k = M.get(e.join(","));
    if (k === undefined) throw runtimeError("graded", "not a standard monomial");
    return k;
  }

  /// The normal form of the monomial x^e (of degree d) as a sparse vector of R_d.
  reduceMonomial(d: number, e: readonly number[]): SparseColumn<C> {
    if (this.isStandard(e)) return { idx: [this.indexOf(d, e)], val: [this.K.one] };
    const nf = normalForm(this.S, monomial(this.S, e), this.G);
    const col: SparseColumn<C> = { idx: [], val: [] };
    for (const t of terms(this.S, nf)) {
      col.idx.push(this.indexOf(d, t.exps));
      col.val.push(this.K.fromRational(t.num, t.den));
    }
    return col;
  }

  /// Multiplication by the variable x_v from R_d to R_{d + w_v}: one sparse column per
  /// basis element of R_d.
  mulVar(v: number, d: number): SparseColumn<C>[] {
    // cached by [v][d], not by a string key: resolutions call this once per coordinate
    const byDegree = (this.mults[v] ??= []);
    let M = byDegree[d];
    if (M) return M;
    const t = d + this.weights[v];
    M = this.basis(d).map((u) => {
      const e = u.slice();
      e[v]++;
      return this.reduceMonomial(t, e);
    });
    byDegree[d] = M;
    return M;
  }

  /// x_v · a for a dense vector a of R_d, added into out (a dense vector of R_{d + w_v})
  /// at offset `at`.
  mulVarInto(v: number, d: number, a: readonly C[], from: number, out: C[], at: number): void {
    const K = this.K;
    const M = this.mulVar(v, d);
    for (let k = 0; k < M.length; k++) {
      const c = a[from + k];
      if (K.isZero(c)) continue;
      const col = M[k];
      for (let r = 0; r < col.idx.length; r++) out[at + col.idx[r]] = K.add(out[at + col.idx[r]], K.mul(c, col.val[r]));
    }
  }
}

const cache = new WeakMap<Ideal, GradedQuotient>();

/// The graded pieces of S/J (cached per ideal object).
export function gradedQuotient(J: Ideal): GradedQuotient {
  let Q = cache.get(J);
  if (!Q) {
    Q = new GradedQuotient(J.ring, J);
    cache.set(J, Q);
  }
  return Q;
}
