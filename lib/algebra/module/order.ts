import { monoMul, monoOne, type Mono, type MonoLayout } from "../monomial/monomial";
import type { MonoCompare } from "../order/order";

/// A monomial order on a free module with basis e_1..e_r, in a flattened form that covers
/// position-over-term, term-over-position and every Schreyer order built on them:
/// u·e_a > v·e_b iff (pos_a, u·T_a, rank_a) > (pos_b, v·T_b, rank_b) lexicographically,
/// the middle key compared in the ring's monomial order.
export interface ModuleOrder {
  readonly kind: "top" | "pot" | "schreyer";
  /// Primary key: 0 everywhere for term-over-position; the position for position-over-term.
  readonly pos: Int32Array;
  /// The monomial each basis element's terms are multiplied by before comparing.
  readonly T: readonly Mono[];
  /// Tie-break after the monomial; larger is bigger.
  readonly rank: Int32Array;
}

/// Term over position: compare monomials first, then e_1 > e_2 > … .
export function termOverPosition(L: MonoLayout, r: number): ModuleOrder {
  const one = monoOne(L);
  return {
    kind: "top",
    pos: new Int32Array(r),
    T: new Array<Mono>(r).fill(one),
    rank: Int32Array.from({ length: r }, (_, i) => r - i),
  };
}

/// Position over term: e_1-terms above e_2-terms above …, monomials within a position.
export function positionOverTerm(L: MonoLayout, r: number): ModuleOrder {
  const one = monoOne(L);
  return {
    kind: "pot",
    pos: Int32Array.from({ length: r }, (_, i) => r - i),
    T: new Array<Mono>(r).fill(one),
    rank: new Int32Array(r),
  };
}

/// The Schreyer order induced by elements g_1..g_s with leading terms u_l·e_{c_l} under O:
/// m·e_l > n·e_k iff in(m·g_l) > in(n·g_k), or they are equal and l < k
/// (D. Eisenbud, Commutative Algebra with a View Toward Algebraic Geometry, Ch. 15).
export function schreyerOrder(O: ModuleOrder, leads: readonly { mono: Mono; comp: number }[]): ModuleOrder {
  const s = leads.length;
  const idx = Array.from({ length: s }, (_, l) => l);
  idx.sort((a, b) => O.rank[leads[b].comp] - O.rank[leads[a].comp] || a - b);
  const rank = new Int32Array(s);
  idx.forEach((l, k) => (rank[l] = s - k));
  return {
    kind: "schreyer",
    pos: Int32Array.from(leads, (t) => O.pos[t.comp]),
    T: leads.map((t) => monoMul(t.mono, O.T[t.comp])),
    rank,
  };
}

/// Compares two terms given by their comparison monomials (u·T_a) and basis indices.
export function compareKeys(cmp: MonoCompare, O: ModuleOrder, totA: Mono, a: number, totB: Mono, b: number): number {
  const p = O.pos[a] - O.pos[b];
  if (p !== 0) return p;
  const c = cmp(totA, totB);
  return c !== 0 ? c : O.rank[a] - O.rank[b];
}
