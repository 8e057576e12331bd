/// The polynomial operations of the public interface, each checking that its arguments belong
/// to the ring it is given (the engine's internal `*Ctx` functions trust their callers).
import { runtimeError } from "../errors";
import { HEAD, MAX_EXPONENT, monoEq, monoExps, monoFromExps } from "../monomial/monomial";
import type { ComputeOptions } from "../options";
import { addScaled, constPoly, mulPoly, mulTerm, negPoly, powPoly } from "./arith";
import { formatPoly as formatCtx } from "./format";
import { parsePoly as parseCtx } from "./parse";
import { makePoly, Poly } from "./poly";
import { ringCtx, type PolyRing, type RingCtx } from "./ring";

/// The ring's context after checking that f is one of its polynomials.
export function ctxFor(R: PolyRing, where: string, ...fs: Poly[]): RingCtx {
  const C = ringCtx(R);
  for (const f of fs) {
    if (!(f instanceof Poly)) throw runtimeError(where, "expected a polynomial");
    const t = f.m[0];
    if (t && (t.length !== HEAD + C.n || (typeof f.c[0] === "number") !== (R.field.kind === "gf"))) {
      throw runtimeError(where, "the polynomial belongs to a different ring");
    }
  }
  return C;
}

export function zero(R: PolyRing): Poly {
  ctxFor(R, "zero");
  return makePoly([], []);
}

export function one(R: PolyRing): Poly {
  const C = ctxFor(R, "one");
  return constPoly(C, C.K.one);
}

/// The constant num/den (den defaults to 1).
export function constant(R: PolyRing, num: bigint, den: bigint = 1n): Poly {
  const C = ctxFor(R, "constant");
  if (typeof num !== "bigint" || typeof den !== "bigint") throw runtimeError("constant", "num and den must be bigints");
  return constPoly(C, C.K.fromRational(num, den));
}

/// The i-th variable (0-based).
export function variable(R: PolyRing, i: number): Poly {
  const C = ctxFor(R, "variable");
  if (!Number.isInteger(i) || i < 0 || i >= C.n) {
    throw runtimeError("variable", `index ${i} is out of range: the ring has ${C.n} variables`);
  }
  const exps = new Array<number>(C.n).fill(0);
  exps[i] = 1;
  return makePoly([monoFromExps(C.layout, exps)], [C.K.one]);
}

/// The polynomial num/den · x^exps (exponents non-negative integers).
export function monomial(R: PolyRing, exps: readonly number[], num: bigint = 1n, den: bigint = 1n): Poly {
  const C = ctxFor(R, "monomial");
  if (exps.length !== C.n) throw runtimeError("monomial", `expected ${C.n} exponents, got ${exps.length}`);
  for (const e of exps) {
    if (!Number.isInteger(e) || e < 0 || e >= MAX_EXPONENT) {
      throw runtimeError("monomial", `exponents must be integers in [0, ${MAX_EXPONENT}), got ${e}`);
    }
  }
  const c = C.K.fromRational(num, den);
  return C.K.isZero(c) ? makePoly([], []) : makePoly([monoFromExps(C.layout, exps)], [c]);
}

export function add(R: PolyRing, f: Poly, g: Poly): Poly {
  const C = ctxFor(R, "add", f, g);
  return addScaled(C, f, g, C.K.one);
}

export function sub(R: PolyRing, f: Poly, g: Poly): Poly {
  const C = ctxFor(R, "sub", f, g);
  return addScaled(C, f, g, C.K.neg(C.K.one));
}

export function neg(R: PolyRing, f: Poly): Poly {
  return negPoly(ctxFor(R, "neg", f), f);
}

export function mul(R: PolyRing, f: Poly, g: Poly, opts?: ComputeOptions): Poly {
  return mulPoly(ctxFor(R, "mul", f, g), f, g, opts);
}

export function pow(R: PolyRing, f: Poly, k: number, opts?: ComputeOptions): Poly {
  return powPoly(ctxFor(R, "pow", f), f, k, opts);
}

/// (num/den)·f.
export function scale(R: PolyRing, f: Poly, num: bigint, den: bigint = 1n): Poly {
  const C = ctxFor(R, "scale", f);
  const s = C.K.fromRational(num, den);
  return mulTerm(C, f, s, monoFromExps(C.layout, new Array<number>(C.n).fill(0)));
}

export function isZero(f: Poly): boolean {
  return f.m.length === 0;
}

export function equals(R: PolyRing, f: Poly, g: Poly): boolean {
  const C = ctxFor(R, "equals", f, g);
  if (f.m.length !== g.m.length) return false;
  for (let i = 0; i < f.m.length; i++) {
    if (!monoEq(f.m[i], g.m[i]) || !C.K.eq(f.c[i], g.c[i])) return false;
  }
  return true;
}

export function termCount(f: Poly): number {
  return f.m.length;
}

/// The terms in decreasing order; over GF(p) num is the symmetric representative and den 1.
export function terms(R: PolyRing, f: Poly): { num: bigint; den: bigint; exps: number[] }[] {
  const C = ctxFor(R, "terms", f);
  return f.m.map((m, i) => ({ ...C.K.toRational(f.c[i]), exps: monoExps(m) }));
}

export function leadExponents(R: PolyRing, f: Poly): number[] {
  ctxFor(R, "leadExponents", f);
  if (f.m.length === 0) throw runtimeError("leadExponents", "the zero polynomial has no leading term");
  return monoExps(f.m[0]);
}

/// The leading coefficient as num/den (symmetric over GF(p)).
export function leadCoefficient(R: PolyRing, f: Poly): { num: bigint; den: bigint } {
  const C = ctxFor(R, "leadCoefficient", f);
  if (f.m.length === 0) throw runtimeError("leadCoefficient", "the zero polynomial has no leading term");
  return C.K.toRational(f.c[0]);
}

/// The largest (weighted) degree of a term; -1 for the zero polynomial.
export function degree(R: PolyRing, f: Poly): number {
  ctxFor(R, "degree", f);
  let d = -1;
  for (const m of f.m) if (m[1] > d) d = m[1];
  return d;
}

/// Whether all terms have the same (weighted) degree; 0 counts as homogeneous.
export function isHomogeneous(R: PolyRing, f: Poly): boolean {
  ctxFor(R, "isHomogeneous", f);
  return f.m.every((m) => m[1] === f.m[0][1]);
}

export function formatPoly(R: PolyRing, f: Poly): string {
  return formatCtx(ctxFor(R, "formatPoly", f), f);
}

export function parsePoly(R: PolyRing, text: string, opts?: ComputeOptions): Poly {
  return parseCtx(ctxFor(R, "parsePoly"), text, opts);
}
