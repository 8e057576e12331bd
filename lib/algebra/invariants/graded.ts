import { monoExps, monoFromExps, monoMul, monoOne, type Mono } from "../monomial/monomial";
import { Ticker, checkpoint, type ComputeOptions } from "../options";
import { asTyped, type Poly } from "../poly/poly";
import type { RingCtx } from "../poly/ring";
import { divisorsOf, heapDivide, makeStream, type Divisors } from "../module/divide";
import { moduleGroebner } from "../module/groebner";
import { termOverPosition, type ModuleOrder } from "../module/order";
import { vecFromPolys, type Vec } from "../module/vector";
import { scalarRank } from "../resolution/schreyer/scalar";

/// A graded module N = G_0 / U given by a presentation, with a Gröbner basis of U ready for
/// normal forms: a k-basis of N_d is the standard terms u·e_c of degree d (Macaulay).
export interface GradedModule<C> {
  readonly R: RingCtx<C>;
  readonly degrees: readonly number[];
  readonly O: ModuleOrder;
  readonly D: Divisors<C>;
  readonly leads: number[][][];
}

export function gradedModule<C>(
  R: RingCtx<C>,
  rows: readonly (readonly Poly[])[],
  degrees: readonly number[],
  opts?: ComputeOptions,
): GradedModule<C> {
  const O = termOverPosition(R.layout, degrees.length);
  const ncols = rows.length === 0 ? 0 : rows[0].length;
  const gens: Vec<C>[] = [];
  for (let q = 0; q < ncols; q++) {
    const v = vecFromPolys(
      R,
      O,
      rows.map((row) => row[q]),
    );
    if (v.mono.length > 0) gens.push(v);
  }
  const G = moduleGroebner(R, O, degrees, gens, opts);
  const leads = degrees.map((_, c) => G.filter((g) => g.comp[0] === c).map((g) => monoExps(g.mono[0])));
  return { R, degrees, O, D: divisorsOf(G), leads };
}

/// Exponent vectors of weighted degree d (weights w) not divisible by any of `lead`.
export function standardMonomials(w: readonly number[], lead: readonly number[][], d: number): number[][] {
  const out: number[][] = [];
  const e = new Array<number>(w.length).fill(0);
  const rec = (k: number, left: number) => {
    if (k === w.length) {
      if (left === 0 && !lead.some((u) => u.every((x, i) => x <= e[i]))) out.push([...e]);
      return;
    }
    for (let x = 0; x * w[k] <= left; x++) {
      e[k] = x;
      rec(k + 1, left - x * w[k]);
    }
    e[k] = 0;
  };
  if (d >= 0) rec(0, d);
  return out;
}

/// The degree-d piece of ⊕_b N(−deg_b) with a k-basis of standard terms per summand.
export interface GradedPiece {
  readonly basis: { readonly b: number; readonly c: number; readonly u: number[] }[];
  readonly index: Map<string, number>;
}

export function gradedPiece<C>(N: GradedModule<C>, shifts: readonly number[], d: number): GradedPiece {
  const basis: { b: number; c: number; u: number[] }[] = [];
  const index = new Map<string, number>();
  shifts.forEach((s, b) => {
    N.degrees.forEach((dc, c) => {
      for (const u of standardMonomials(N.R.ring.degrees, N.leads[c], d - s - dc)) {
        index.set(`${b}:${c}:${u.join(",")}`, basis.length);
        basis.push({ b, c, u });
      }
    });
  });
  return { basis, index };
}

/// The rank of the degree-d part of A ⊗ N: ⊕_b N(−src_b) → ⊕_a N(−tgt_a), by normal forms
/// modulo the Gröbner basis of N's relations.
export function gradedRank<C>(
  N: GradedModule<C>,
  A: readonly (readonly Poly[])[],
  src: GradedPiece,
  tgt: GradedPiece,
  opts?: ComputeOptions,
): number {
  const R = N.R,
    K = R.K;
  const ticker = new Ticker(opts, () => ({ stage: "graded linear algebra" }));
  const rows: Map<number, C>[] = [];
  for (const { b, c, u } of src.basis) {
    checkpoint(opts, { stage: "graded linear algebra" });
    const row = new Map<number, C>();
    const xu = monoFromList(R, u);
    A.forEach((line, a) => {
      const f = asTyped<C>(line[b]);
      if (f.m.length === 0) return;
      const mono: Mono[] = f.m.map((t) => monoMul(t, xu));
      const v: Vec<C> = { mono, comp: mono.map(() => c), coef: [...f.c], tot: mono.map((m) => monoMul(m, N.O.T[c])) };
      const { remainder } = heapDivide(R, N.O, [makeStream(monoOne(R.layout), K.one, v, 0)], N.D, true, ticker, Infinity);
      for (const t of remainder) {
        const k = tgt.index.get(`${a}:${t.comp}:${monoExps(t.tot).join(",")}`);
        if (k === undefined) throw new Error("gradedRank: a normal form left the graded piece");
        row.set(k, t.coef);
      }
    });
    rows.push(row);
  }
  return scalarRank(K, rows, opts);
}

function monoFromList<C>(R: RingCtx<C>, u: number[]): Mono {
  return monoFromExps(R.layout, u);
}
