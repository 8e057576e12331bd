import { add, constant, mul, pow, terms, variable, zero } from "../poly/checked";
import { polyRing, type PolyRing } from "../poly/ring";
import { type Poly } from "../poly/poly";
import { ideal, type Ideal } from "../ideal/ideal";
import { rat, ratMul, ratNeg, type Rat } from "../field/rational";

/// Reading S/(I + (ℓ)) as S'/I' for a linear form ℓ = Σ a_i x_i with a_c ≠ 0: S' drops x_c
/// and x_c ↦ −(Σ_{i≠c} a_i x_i)/a_c.
export function cutByLinearForm(I: Ideal, a: readonly bigint[]): { ideal: Ideal; ring: PolyRing } {
  const S = I.ring;
  let c = a.length - 1;
  while (c >= 0 && a[c] === 0n) c--;
  const keep = S.vars.map((_, i) => i).filter((i) => i !== c);
  const T = polyRing(S.field, keep.map((i) => S.vars[i]), { order: S.order, degrees: keep.map((i) => S.degrees[i]) });
  const image = keep.map((_, k) => variable(T, k));
  let sub = zero(T);
  keep.forEach((i, k) => {
    if (a[i] === 0n) return;
    const q: Rat = ratNeg(ratMul(rat(a[i]), rat(1n, a[c])));
    sub = add(T, sub, mul(T, constant(T, q.n, q.d), image[k]));
  });
  const phi = (f: Poly): Poly => {
    let out = zero(T);
    for (const t of terms(S, f)) {
      let m = constant(T, t.num, t.den);
      keep.forEach((i, k) => {
        if (t.exps[i] > 0) m = mul(T, m, pow(T, image[k], t.exps[i]));
      });
      if (t.exps[c] > 0) m = mul(T, m, pow(T, sub, t.exps[c]));
      out = add(T, out, m);
    }
    return out;
  };
  return { ideal: ideal(T, I.gens.map(phi)), ring: T };
}
