import { checkpoint, type ComputeOptions } from "../options";
import { monomial, normalForm, mul, terms, type Poly, type PolyRing } from "../index";
import { ringCtx } from "../poly/ring";
import { scalarRank } from "../resolution/scalar";

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
  rec(0, d);
  return out;
}

/// A graded piece (⊕_b (S/J)(−deg_b))_d with a k-basis of standard monomials per summand.
export interface GradedPiece {
  readonly blocks: { readonly b: number; readonly mons: number[][] }[];
  readonly index: Map<string, number>;
  readonly dim: number;
}

export function gradedPiece(w: readonly number[], lead: readonly number[][], degrees: readonly number[], d: number): GradedPiece {
  const blocks: { b: number; mons: number[][] }[] = [];
  const index = new Map<string, number>();
  let dim = 0;
  degrees.forEach((db, b) => {
    const mons = d - db >= 0 ? standardMonomials(w, lead, d - db) : [];
    for (const u of mons) index.set(`${b}:${u.join(",")}`, dim++);
    blocks.push({ b, mons });
  });
  return { blocks, index, dim };
}

/// The rank of the degree-d part of A: ⊕_b (S/J)(−src_b) → ⊕_a (S/J)(−tgt_a), entries
/// reduced modulo the Gröbner basis G of J (normal forms span S/J; Macaulay's theorem).
export function gradedRank(
  R: PolyRing,
  A: readonly (readonly Poly[])[],
  src: GradedPiece,
  tgt: GradedPiece,
  G: readonly Poly[],
  opts?: ComputeOptions,
): number {
  const K = ringCtx(R).K;
  const rows: Map<number, unknown>[] = [];
  for (const { b, mons } of src.blocks) {
    for (const u of mons) {
      checkpoint(opts, { stage: "graded linear algebra" });
      const row = new Map<number, unknown>();
      const xu = monomial(R, u);
      A.forEach((line, a) => {
        const f = line[b];
        if (f.m.length === 0) return;
        for (const t of terms(R, normalForm(R, mul(R, xu, f), G))) {
          const k = tgt.index.get(`${a}:${t.exps.join(",")}`);
          if (k === undefined) throw new Error("gradedRank: a normal form left the graded piece");
          row.set(k, K.add(row.get(k) ?? K.zero, K.fromRational(t.num, t.den)));
        }
      });
      rows.push(row);
    }
  }
  return scalarRank(K, rows);
}
