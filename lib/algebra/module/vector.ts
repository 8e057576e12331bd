import { monoMul, type Mono } from "../monomial/monomial";
import { asTyped, type Poly } from "../poly/poly";
import { polyFromTerms } from "../poly/arith";
import type { RingCtx } from "../poly/ring";
import { compareKeys, type ModuleOrder } from "./order";

/// An element Σ coef_k·mono_k·e_{comp_k} of a free module, terms sorted decreasingly in a
/// module order O, each with its comparison monomial tot_k = mono_k·T_{comp_k}.
export interface Vec<C> {
  readonly mono: readonly Mono[];
  readonly comp: readonly number[];
  readonly coef: readonly C[];
  readonly tot: readonly Mono[];
}

/// The vector with coordinates `entries` (one polynomial per basis element), sorted in O.
export function vecFromPolys<C>(R: RingCtx<C>, O: ModuleOrder, entries: readonly Poly[]): Vec<C> {
  const terms: { mono: Mono; comp: number; coef: C; tot: Mono }[] = [];
  entries.forEach((f, a) => {
    const F = asTyped<C>(f);
    for (let k = 0; k < F.m.length; k++) terms.push({ mono: F.m[k], comp: a, coef: F.c[k], tot: monoMul(F.m[k], O.T[a]) });
  });
  terms.sort((x, y) => compareKeys(R.cmp, O, y.tot, y.comp, x.tot, x.comp));
  return {
    mono: terms.map((t) => t.mono),
    comp: terms.map((t) => t.comp),
    coef: terms.map((t) => t.coef),
    tot: terms.map((t) => t.tot),
  };
}

/// The coordinates of v as r polynomials.
export function vecToPolys<C>(R: RingCtx<C>, v: Vec<C>, r: number): Poly[] {
  const ms: Mono[][] = Array.from({ length: r }, () => []);
  const cs: C[][] = Array.from({ length: r }, () => []);
  for (let k = 0; k < v.mono.length; k++) {
    ms[v.comp[k]].push(v.mono[k]);
    cs[v.comp[k]].push(v.coef[k]);
  }
  return ms.map((m, a) => polyFromTerms(R, m, cs[a]));
}

/// v scaled so that its leading coefficient is 1.
export function vecMonic<C>(R: RingCtx<C>, v: Vec<C>): Vec<C> {
  if (v.coef.length === 0 || R.K.isOne(v.coef[0])) return v;
  const s = R.K.inv(v.coef[0]);
  return { ...v, coef: v.coef.map((c) => R.K.mul(s, c)) };
}
