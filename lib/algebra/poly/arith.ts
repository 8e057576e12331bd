import { limitError, runtimeError } from "../errors";
import { HEAD, MAX_EXPONENT, monoMul, monoOne, type Mono } from "../monomial/monomial";
import { checkLimit, checkpoint, type ComputeOptions } from "../options";
import { asTyped, makePoly, Poly } from "./poly";
import type { RingCtx } from "./ring";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// f + s·g by one merge of the two sorted term lists.
export function addScaled<C>(R: RingCtx<C>, f: Poly, g: Poly, s: C): Poly {
  const F = asTyped<C>(f),
    G = asTyped<C>(g),
    K = R.K,
    cmp = R.cmp;
  const m: Mono[] = [],
    c: C[] = [];
  let i = 0,
    j = 0;
  const nf = F.m.length,
    ng = G.m.length;
  const sOne = K.isOne(s);
  while (i < nf && j < ng) {
    const d = cmp(F.m[i], G.m[j]);
    if (d > 0) {
      m.push(F.m[i]);
      c.push(F.c[i++]);
    } else if (d < 0) {
      m.push(G.m[j]);
      c.push(sOne ? G.c[j++] : K.mul(s, G.c[j++]));
    } else {
      const v = K.add(F.c[i], sOne ? G.c[j] : K.mul(s, G.c[j]));
      if (!K.isZero(v)) {
        m.push(F.m[i]);
        c.push(v);
      }
      i++;
      j++;
    }
  }
  for (; i < nf; i++) {
    m.push(F.m[i]);
    c.push(F.c[i]);
  }
  for (; j < ng; j++) {
    m.push(G.m[j]);
    c.push(sOne ? G.c[j] : K.mul(s, G.c[j]));
  }
  return makePoly(m, c);
}

/// s·t·f for a coefficient s and a monomial t.
export function mulTerm<C>(R: RingCtx<C>, f: Poly, s: C, t: Mono): Poly {
  const F = asTyped<C>(f),
    K = R.K;
  if (K.isZero(s)) return makePoly([], []);
  const trivial = t.every((x, i) => i < H || x === 0);
  const m = trivial ? [...F.m] : F.m.map((x) => monoMul(x, t));
  const c = K.isOne(s) ? [...F.c] : F.c.map((x) => K.mul(s, x));
  return makePoly(m, c);
}

export function negPoly<C>(R: RingCtx<C>, f: Poly): Poly {
  const F = asTyped<C>(f);
  return makePoly(
    [...F.m],
    F.c.map((x) => R.K.neg(x)),
  );
}

export function constPoly<C>(R: RingCtx<C>, a: C): Poly {
  return R.K.isZero(a) ? makePoly([], []) : makePoly([monoOne(R.layout)], [a]);
}

/// Makes a polynomial from unsorted terms, combining equal monomials.
export function polyFromTerms<C>(R: RingCtx<C>, m: Mono[], c: C[]): Poly {
  const idx = m.map((_, i) => i).sort((a, b) => R.cmp(m[b], m[a]));
  const om: Mono[] = [],
    oc: C[] = [];
  for (const i of idx) {
    const k = om.length - 1;
    if (k >= 0 && R.cmp(om[k], m[i]) === 0) oc[k] = R.K.add(oc[k], c[i]);
    else {
      om.push(m[i]);
      oc.push(c[i]);
    }
  }
  const rm: Mono[] = [],
    rc: C[] = [];
  for (let i = 0; i < om.length; i++) {
    if (!R.K.isZero(oc[i])) {
      rm.push(om[i]);
      rc.push(oc[i]);
    }
  }
  return makePoly(rm, rc);
}

function maxDegree(f: Poly): number {
  let d = -1;
  for (const t of f.m) if (t[1] > d) d = t[1];
  return d;
}

function guardExponents(f: Poly, g: Poly): void {
  const a = f.m[0],
    b = g.m[0];
  if (!a || !b) return;
  let worst = 0;
  for (let i = H; i < a.length; i++) {
    let ea = 0,
      eb = 0;
    for (const t of f.m) if (t[i] > ea) ea = t[i];
    for (const t of g.m) if (t[i] > eb) eb = t[i];
    if (ea + eb > worst) worst = ea + eb;
  }
  if (worst >= MAX_EXPONENT || maxDegree(f) + maxDegree(g) >= 2 ** 30) {
    throw runtimeError("mul", `an exponent would exceed ${MAX_EXPONENT - 1}`);
  }
}

/// f·g: the products of g with each term of f, summed pairwise like a merge sort.
export function mulPoly<C>(R: RingCtx<C>, f: Poly, g: Poly, opts?: ComputeOptions): Poly {
  if (f.m.length === 0 || g.m.length === 0) return makePoly([], []);
  if (f.m.length > g.m.length) [f, g] = [g, f];
  guardExponents(f, g);
  const F = asTyped<C>(f);
  let parts: Poly[] = F.m.map((t, i) => mulTerm(R, g, F.c[i], t));
  while (parts.length > 1) {
    checkpoint(opts, { stage: "multiply", detail: `${parts.length} partial products` });
    const next: Poly[] = [];
    for (let i = 0; i + 1 < parts.length; i += 2) {
      const s = addScaled(R, parts[i], parts[i + 1], R.K.one);
      checkLimit(opts, "maxTerms", s.m.length, "a product's number of terms");
      next.push(s);
    }
    if (parts.length % 2 === 1) next.push(parts[parts.length - 1]);
    parts = next;
  }
  return parts[0];
}

/// f^k by repeated squaring.
export function powPoly<C>(R: RingCtx<C>, f: Poly, k: number, opts?: ComputeOptions): Poly {
  if (!Number.isInteger(k) || k < 0) throw runtimeError("pow", `the exponent must be a non-negative integer, got ${k}`);
  if (k === 0) return constPoly(R, R.K.one);
  if (f.m.length === 0) return f;
  if (f.m.length === 1) {
    const t = f.m[0];
    for (let i = H; i < t.length; i++) {
      if (t[i] * k >= MAX_EXPONENT) throw runtimeError("pow", `an exponent would exceed ${MAX_EXPONENT - 1}`);
    }
    let c = R.K.one;
    let b = asTyped<C>(f).c[0];
    const big = R.K.field.kind === "Q" && k > 1 << 16 && !R.K.isOne(b) && !R.K.isOne(R.K.neg(b));
    if (big) throw limitError("maxTerms", `pow: the coefficient's ${k}-th power is too large to write down`);
    for (let e = k; e > 0; e >>= 1) {
      if (e & 1) c = R.K.mul(c, b);
      if (e > 1) b = R.K.mul(b, b);
    }
    const m = new Int32Array(t.length);
    for (let i = 0; i < t.length; i++) m[i] = i === 2 ? t[i] : t[i] * k;
    return makePoly([m], [c]);
  }
  if (k > MAX_EXPONENT) throw limitError("maxDegree", `pow: the exponent ${k} is too large`);
  let result = constPoly(R, R.K.one);
  let base = f;
  for (let e = k; e > 0; e = Math.floor(e / 2)) {
    if (e % 2 === 1) result = mulPoly(R, result, base, opts);
    if (e > 1) base = mulPoly(R, base, base, opts);
  }
  return result;
}
