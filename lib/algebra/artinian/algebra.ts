import { runtimeError } from "../errors";
import { coeffsOf, type Coeffs } from "../field/coeffs";
import { Echelon, kernelBasis } from "../graded/echelon";
import { type Ideal, idealGroebnerBasis } from "../ideal/ideal";
import { leadExponents, monomial, terms } from "../poly/checked";
import { normalForm } from "../groebner/checked";
import { type Poly } from "../poly/poly";
import { type PolyRing } from "../poly/ring";
import { checkLimit, checkpoint, type ComputeOptions } from "../options";

/// A finite-dimensional algebra A = S/Q for an ideal Q of finite colength: the standard
/// monomials of a Gröbner basis of Q (any order) are a k-basis (Macaulay), and
/// multiplication by a variable is a matrix computed from normal forms.
export class FiniteAlgebra<C = unknown> {
  readonly K: Coeffs<C>;
  readonly basis: number[][] = [];
  private readonly index = new Map<string, number>();
  private readonly G: readonly Poly[];
  private readonly mults = new Map<number, C[][]>();

  constructor(
    readonly S: PolyRing,
    readonly Q: Ideal,
    opts?: ComputeOptions,
  ) {
    this.K = coeffsOf(S.field) as Coeffs<C>;
    this.G = idealGroebnerBasis(Q, opts);
    const leads = this.G.map((g) => leadExponents(S, g));
    const n = S.vars.length;
    const standard = (e: number[]) => !leads.some((l) => l.every((a, i) => a <= e[i]));
    if (!standard(new Array<number>(n).fill(0))) throw runtimeError("artinian", "the ring is zero");
    // Standard monomials form an order ideal: grow it one total degree at a time.
    let layer = [new Array<number>(n).fill(0)];
    while (layer.length > 0) {
      checkpoint(opts, { stage: "basis of a finite-dimensional algebra", detail: `${this.basis.length} monomials` });
      for (const e of layer) {
        this.index.set(e.join(","), this.basis.length);
        this.basis.push(e);
      }
      checkLimit(opts, "maxBasisSize", this.basis.length, "the dimension of the algebra");
      const next: number[][] = [];
      for (const u of layer) {
        let last = 0;
        for (let i = 0; i < n; i++) if (u[i] > 0) last = i;
        for (let v = last; v < n; v++) {
          const e = u.slice();
          e[v]++;
          if (standard(e)) next.push(e);
        }
      }
      if (next.length > 0 && next[0].reduce((s, x) => s + x, 0) > (opts?.limits?.maxDegree ?? 1 << 20)) {
        throw runtimeError("artinian", "the ideal does not have finite colength");
      }
      layer = next;
    }
  }

  get dim(): number {
    return this.basis.length;
  }

  /// The coordinates of a polynomial of S read in A.
  coordinates(f: Poly): C[] {
    const out = new Array<C>(this.dim).fill(this.K.zero);
    for (const t of terms(this.S, normalForm(this.S, f, this.G))) {
      const k = this.index.get(t.exps.join(","))!;
      out[k] = this.K.add(out[k], this.K.fromRational(t.num, t.den));
    }
    return out;
  }

  /// Multiplication by x_v: column k is x_v times the k-th basis monomial.
  mulVar(v: number): C[][] {
    let M = this.mults.get(v);
    if (!M) {
      M = this.basis.map((u) => {
        const e = u.slice();
        e[v]++;
        return this.coordinates(monomial(this.S, e));
      });
      this.mults.set(v, M);
    }
    return M;
  }

  /// x_v · a for a coordinate vector a.
  mulVector(v: number, a: readonly C[]): C[] {
    const K = this.K,
      M = this.mulVar(v);
    const out = new Array<C>(this.dim).fill(K.zero);
    a.forEach((c, k) => {
      if (K.isZero(c)) return;
      M[k].forEach((x, r) => {
        if (!K.isZero(x)) out[r] = K.add(out[r], K.mul(c, x));
      });
    });
    return out;
  }

  /// A basis of the socle (0 : m) of A when A is local at the origin: the elements killed
  /// by every variable.
  socle(): C[][] {
    const n = this.S.vars.length;
    const images = this.basis.map((_, k) => {
      const unit = new Array<C>(this.dim).fill(this.K.zero);
      unit[k] = this.K.one;
      return Array.from({ length: n }, (_, v) => this.mulVector(v, unit)).flat();
    });
    return kernelBasis(this.K, n * this.dim, images);
  }

  /// dim_k of the span of some vectors of A.
  rank(vectors: readonly (readonly C[])[]): number {
    const E = new Echelon(this.K, this.dim);
    for (const v of vectors) E.insert(v);
    return E.rank;
  }
}
