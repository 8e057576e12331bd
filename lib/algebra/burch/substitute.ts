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
  const T = polyRing(
    S.field,
    keep.map((i) => S.vars[i]),
    { order: S.order, degrees: keep.map((i) => S.degrees[i]) },
  );
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

/// Reading S/(I + (g)) as S'/I' when g = a·x_c + h with h free of x_c (a ≠ 0 a constant):
/// S' drops x_c and x_c ↦ −h/a. Returns null when g is not of that form for any c.
export function eliminateByElement(I: Ideal, g: Poly): { ideal: Ideal; ring: PolyRing } | null {
  const S = I.ring;
  const ts = terms(S, g);
  const c = S.vars.findIndex((_, v) => {
    const with_ = ts.filter((t) => t.exps[v] > 0);
    return with_.length === 1 && with_[0].exps[v] === 1 && with_[0].exps.every((e, i) => i === v || e === 0);
  });
  if (c < 0) return null;
  const keep = S.vars.map((_, i) => i).filter((i) => i !== c);
  const T = polyRing(
    S.field,
    keep.map((i) => S.vars[i]),
    { order: S.order, degrees: keep.map((i) => S.degrees[i]) },
  );
  const lead = ts.find((t) => t.exps[c] === 1)!;
  const toT = (exps: readonly number[], num: bigint, den: bigint): Poly => {
    let m = constant(T, num, den);
    keep.forEach((i, k) => {
      if (exps[i] > 0) m = mul(T, m, pow(T, variable(T, k), exps[i]));
    });
    return m;
  };
  // x_c ↦ −h/a
  let image = zero(T);
  for (const t of ts) {
    if (t === lead) continue;
    const q = ratNeg(ratMul(rat(t.num, t.den), rat(lead.den, lead.num)));
    image = add(T, image, toT(t.exps, q.n, q.d));
  }
  const phi = (f: Poly): Poly => {
    let out = zero(T);
    for (const t of terms(S, f)) {
      let m = toT(t.exps, t.num, t.den);
      if (t.exps[c] > 0) m = mul(T, m, pow(T, image, t.exps[c]));
      out = add(T, out, m);
    }
    return out;
  };
  return { ideal: ideal(T, I.gens.map(phi)), ring: T };
}
