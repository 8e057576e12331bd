import type { Coeffs } from "../field/coeffs";
import type { GradedQuotient } from "../graded/piece";

/// A graded free module ⊕_g A(−a_g) over the graded pieces of a ring A; an element of
/// degree j is a dense vector over the concatenated bases of A_{j − a_g}.
export class GradedFree<C> {
  /// For every generator, its image under the differential (a vector of the target in
  /// the generator's degree); empty for the last module built.
  readonly boundary: C[][] = [];
  readonly degrees: number[] = [];

  constructor(readonly A: GradedQuotient<C>) {}

  get K(): Coeffs<C> {
    return this.A.K;
  }

  addGenerator(degree: number, boundary: C[]): void {
    this.degrees.push(degree);
    this.boundary.push(boundary);
  }

  get rank(): number {
    return this.degrees.length;
  }

  offsets(j: number): number[] {
    const out: number[] = [];
    let s = 0;
    for (const a of this.degrees) {
      out.push(s);
      s += this.A.dim(j - a);
    }
    out.push(s);
    return out;
  }

  dim(j: number): number {
    let s = 0;
    for (const a of this.degrees) s += this.A.dim(j - a);
    return s;
  }

  /// x_v · w for w of degree j.
  mulVar(v: number, j: number, w: readonly C[]): C[] {
    const t = j + this.A.weights[v];
    const from = this.offsets(j);
    const to = this.offsets(t);
    const out = new Array<C>(to[to.length - 1]).fill(this.K.zero);
    this.degrees.forEach((a, g) => {
      if (j - a < 0 || from[g + 1] === from[g]) return;
      this.A.mulVarInto(v, j - a, w, from[g], out, to[g]);
    });
    return out;
  }
}
