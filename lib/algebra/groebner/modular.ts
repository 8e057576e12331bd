import { gf } from "../field/field";
import { bigToMod, invMod } from "../field/gfp";
import { previousPrime } from "../field/prime";
import { bigGcd, rat, type Rat } from "../field/rational";
import type { Mono } from "../monomial/monomial";
import { monoDiv, monoMul } from "../monomial/monomial";
import { checkpoint, Ticker, type ComputeOptions } from "../options";
import { asTyped, makePoly, type Poly } from "../poly/poly";
import { polyRing, ringCtx, type RingCtx } from "../poly/ring";
import type { Basis, BasisElt, Pair } from "./basis";
import { buchberger, maxDegree } from "./buchberger";
import { updatePairs } from "./pairs";
import { F4_PRIME_BOUND, replayF4, tracingF4, type F4StepTrace } from "./f4";
import { f4Strategy } from "./strategy";
import { findReducer } from "./reduce";

/// Gröbner bases over Q by the modular method (E. A. Arnold, "Modular algorithms for
/// computing Gröbner bases", J. Symbolic Comput. 2003): reduced bases modulo several primes
/// with the same leading monomials are combined by Chinese remaindering, lifted by rational
/// reconstruction, and the lift is accepted only once it is verified over Q. When lifting
/// keeps failing, Buchberger's algorithm runs directly over Q. In degree orders the primes
/// after the first follow the first one's F4 trace (see groebnerModular).

const MAX_PRIMES = 48;
const MAX_FAILED_VERIFICATIONS = 3;

interface Lift {
  lms: string;
  /// Per basis element: monomials (the union of the supports seen) and CRT residues.
  monos: Mono[][];
  residues: Map<string, bigint>[];
  modulus: bigint;
  primes: number;
  last: string | null;
}

const monoKey = (m: Mono) => m.join(",");

export function groebnerModular(R: RingCtx<Rat>, gens: readonly Poly[], opts: ComputeOptions | undefined): Poly[] {
  const inputs = gens.filter((f) => f.m.length > 0);
  if (inputs.length === 0) return [];
  const lifts = new Map<string, Lift>();
  let failures = 0;
  // Degree orders run F4, exact for every p < 2^31: the largest primes carry the most bits
  // each. The first prime's F4 run is traced and the later primes follow the trace (only
  // the rows that gave new elements, no pair handling, no search for reducers); a prime
  // whose steps differ is computed from scratch and its trace kept instead.
  const graded = R.ring.order.kind === "grevlex" || R.ring.order.kind === "glex";
  let trace: F4StepTrace[] | null = null;
  let p = graded ? F4_PRIME_BOUND : 2 ** 26;
  for (let used = 0; used < MAX_PRIMES; used++) {
    p = previousPrime(p);
    const Rp = ringCtx(polyRing(gf(p), R.ring.vars, { order: R.ring.order, degrees: [...R.ring.degrees] })) as RingCtx<number>;
    const images = reduceInputs(inputs, p);
    if (!images) continue; // p divides a denominator or a leading coefficient
    checkpoint(opts, { stage: "groebner over Q", detail: `prime ${used + 1}` });
    const polys = images.map(([m, c]) => makePoly(m, c));
    let Gp: Poly[] | null = null;
    if (graded) {
      if (trace) Gp = replayF4(Rp, trace, polys, opts);
      if (!Gp) {
        trace = [];
        Gp = buchberger(Rp, polys, opts, tracingF4(f4Strategy, trace));
      }
    } else Gp = buchberger(Rp, polys, opts);
    const lms = Gp.map((g) => monoKey(g.m[0])).join(";");
    let L = lifts.get(lms);
    if (!L) {
      L = { lms, monos: Gp.map(() => []), residues: Gp.map(() => new Map()), modulus: 1n, primes: 0, last: null };
      lifts.set(lms, L);
    }
    combine(L, Gp, p);
    if (best(lifts) !== L) continue;
    const lifted = reconstruct(R, L);
    if (!lifted) continue;
    const text = lifted
      .map((g) =>
        asTyped<Rat>(g)
          .c.map((c) => `${c.n}/${c.d}`)
          .join(" "),
      )
      .join(";");
    const stable = text === L.last;
    L.last = text;
    if (!stable) continue;
    if (verify(R, inputs, lifted, opts)) return lifted;
    if (++failures >= MAX_FAILED_VERIFICATIONS) break;
  }
  return buchberger(R, inputs, opts);
}

function best(lifts: Map<string, Lift>): Lift {
  let b: Lift | null = null;
  for (const L of lifts.values()) if (!b || L.primes > b.primes) b = L;
  return b!;
}

/// The inputs modulo p, or null when p divides a denominator or a leading coefficient.
function reduceInputs(inputs: readonly Poly[], p: number): [Mono[], number[]][] | null {
  const out: [Mono[], number[]][] = [];
  for (const f of inputs) {
    const F = asTyped<Rat>(f);
    const m: Mono[] = [],
      c: number[] = [];
    for (let k = 0; k < F.m.length; k++) {
      const d = bigToMod(F.c[k].d, p);
      if (d === 0) return null;
      const v = Number((((F.c[k].n % BigInt(p)) + BigInt(p)) * BigInt(invMod(d, p))) % BigInt(p));
      if (v === 0 && k === 0) return null;
      if (v !== 0) {
        m.push(F.m[k]);
        c.push(v);
      }
    }
    out.push([m, c]);
  }
  return out;
}

/// Chinese remaindering of the new images into the lift (coefficients missing from one
/// image count as 0).
function combine(L: Lift, Gp: Poly[], p: number): void {
  const P = BigInt(p);
  const Minv = BigInt(invMod(bigToMod(L.modulus, p), p));
  for (let k = 0; k < Gp.length; k++) {
    const g = asTyped<number>(Gp[k]);
    const res = L.residues[k];
    const image = new Map<string, number>();
    g.m.forEach((m, t) => {
      const key = monoKey(m);
      image.set(key, g.c[t]);
      if (!res.has(key)) {
        res.set(key, 0n);
        L.monos[k].push(m);
      }
    });
    for (const [key, a] of res) {
      const b = BigInt(image.get(key) ?? 0);
      // x ≡ a (mod M), x ≡ b (mod p): x = a + M·((b − a)·M⁻¹ mod p)
      let t = ((b - (a % P)) * Minv) % P;
      if (t < 0n) t += P;
      res.set(key, a + L.modulus * t);
    }
  }
  L.modulus *= P;
  L.primes++;
}

/// Rational reconstruction of u mod M with |num|, den ≤ sqrt(M/2)
/// (P. S. Wang, "A p-adic algorithm for univariate partial fractions", SYMSAC 1981).
function ratRecon(u: bigint, M: bigint): Rat | null {
  const bound = bigSqrt(M / 2n);
  let r0 = M,
    r1 = ((u % M) + M) % M,
    s0 = 0n,
    s1 = 1n;
  while (r1 > bound) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  if (s1 === 0n || (s1 < 0n ? -s1 : s1) > bound) return null;
  const x = rat(r1, s1);
  return x.d > bound ? null : x;
}

/// Integer square root by Newton's iteration.
function bigSqrt(n: bigint): bigint {
  if (n < 2n) return n;
  let x = 1n << (BigInt(n.toString(2).length) / 2n + 1n);
  for (;;) {
    const y = (x + n / x) >> 1n;
    if (y >= x) return x;
    x = y;
  }
}

function reconstruct(R: RingCtx<Rat>, L: Lift): Poly[] | null {
  const out: Poly[] = [];
  for (let k = 0; k < L.monos.length; k++) {
    const m: Mono[] = [],
      c: Rat[] = [];
    for (const mono of L.monos[k]) {
      const u = L.residues[k].get(monoKey(mono))!;
      if (u === 0n) continue;
      const q = ratRecon(u, L.modulus);
      if (!q) return null;
      m.push(mono);
      c.push(q);
    }
    const idx = m.map((_, i) => i).sort((a, b) => R.cmp(m[b], m[a]));
    out.push(
      makePoly(
        idx.map((i) => m[i]),
        idx.map((i) => c[i]),
      ),
    );
  }
  return out;
}

/// The lift is the reduced basis of the input ideal over Q when every input reduces to 0
/// and every S-pair left by the Gebauer–Möller criteria reduces to 0 (Buchberger's criterion).
/// Both tests only ask whether a remainder is zero, so they run on integer multiples:
/// each element is scaled to a primitive integer polynomial and each reduction step is the
/// fraction-free h ← (a/d)·h − (c/d)·t·g with d = gcd(a, c) (a the leading coefficient of g,
/// c that of h), which changes h only by a non-zero factor — no rational arithmetic and one
/// gcd per step instead of one per coefficient operation; contents are divided out as they
/// grow.
function verify(R: RingCtx<Rat>, inputs: readonly Poly[], G: Poly[], opts: ComputeOptions | undefined): boolean {
  const ticker = new Ticker(opts, () => ({ stage: "groebner over Q", detail: "verifying the lifted basis" }));
  const basis: Basis = { elts: [], active: [] };
  const elts: BasisElt[] = G.map((poly) => ({ poly, lm: poly.m[0], sugar: maxDegree(poly) }));
  const Z = G.map(integral);
  const ids = elts.map((_, i) => i);
  for (const f of inputs) if (!reducesToZero(R, integral(f), elts, Z, ids, ticker)) return false;
  let pairs: Pair[] = [];
  for (const e of elts) {
    basis.elts.push(e);
    pairs = updatePairs(R.layout, { cmp: R.cmp, bySugar: false }, basis, pairs, basis.elts.length - 1);
  }
  for (const pr of pairs) {
    const gi = Z[pr.i],
      gj = Z[pr.j];
    const ai = gi.c[0],
      aj = gj.c[0];
    const d = bigGcd(ai, aj);
    const s = combineZ(R, mulZ(gi, monoDiv(pr.lcm, elts[pr.i].lm)), aj / d, mulZ(gj, monoDiv(pr.lcm, elts[pr.j].lm)), -(ai / d), 1);
    if (!reducesToZero(R, s, elts, Z, ids, ticker)) return false;
  }
  return true;
}

/// A polynomial with integer coefficients, terms in decreasing order.
interface ZPoly {
  m: Mono[];
  c: bigint[];
}

/// The primitive integer multiple of f with a positive leading coefficient.
function integral(f: Poly): ZPoly {
  const F = asTyped<Rat>(f);
  let den = 1n;
  for (const c of F.c) den = (den / bigGcd(den, c.d)) * c.d;
  const c = F.c.map((x) => x.n * (den / x.d));
  return primitive({ m: [...F.m], c });
}

function primitive(h: ZPoly): ZPoly {
  let g = 0n;
  for (const x of h.c) {
    g = bigGcd(g, x);
    if (g === 1n) return h;
  }
  if (h.c.length > 0 && h.c[0] < 0n) g = -g;
  return g === 1n || g === 0n ? h : { m: h.m, c: h.c.map((x) => x / g) };
}

function mulZ(g: ZPoly, t: Mono): ZPoly {
  return { m: g.m.map((m) => monoMul(m, t)), c: g.c };
}

/// a·f + b·g without the first `skip` terms of each (their leading terms cancel).
function combineZ(R: RingCtx<Rat>, f: ZPoly, a: bigint, g: ZPoly, b: bigint, skip: number): ZPoly {
  const m: Mono[] = [],
    c: bigint[] = [];
  let i = skip,
    j = skip;
  while (i < f.m.length || j < g.m.length) {
    const o = i >= f.m.length ? -1 : j >= g.m.length ? 1 : R.cmp(f.m[i], g.m[j]);
    if (o > 0) {
      m.push(f.m[i]);
      c.push(a * f.c[i++]);
    } else if (o < 0) {
      m.push(g.m[j]);
      c.push(b * g.c[j++]);
    } else {
      const v = a * f.c[i] + b * g.c[j];
      if (v !== 0n) {
        m.push(f.m[i]);
        c.push(v);
      }
      i++;
      j++;
    }
  }
  return { m, c };
}

function reducesToZero(R: RingCtx<Rat>, h: ZPoly, elts: BasisElt[], Z: ZPoly[], ids: number[], ticker: Ticker): boolean {
  let steps = 0;
  while (h.m.length > 0) {
    ticker.tick();
    const r = findReducer(elts, ids, h.m[0]);
    if (r < 0) return false;
    const g = Z[r];
    const a = g.c[0],
      c = h.c[0];
    const d = bigGcd(a, c);
    h = combineZ(R, h, a / d, mulZ(g, monoDiv(h.m[0], elts[r].lm)), -(c / d), 1);
    if (++steps % 4 === 0) h = primitive(h);
  }
  return true;
}
