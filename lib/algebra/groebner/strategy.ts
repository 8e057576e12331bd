import type { RingCtx } from "../poly/ring";
import type { Strategy } from "./basis";
import { F4_PRIME_BOUND, interreduceF4, reduceF4 } from "./f4";
import { reducePairwise } from "./reduce-pairwise";

/// One pair at a time, lowest sugar first.
export const pairwiseStrategy: Strategy = {
  bySugar: true,
  select: (pairs) => pairs.splice(0, 1),
  reduce: reducePairwise,
};

/// F4 takes every pair whose lcm has the lowest degree at once (the normal selection
/// strategy of Faugère 1999, §2.5; pairs queued by lcm, which the degree orders compare by
/// degree first). Measured on cyclic-7 over GF(32003): 17% fewer row operations than
/// batches of the lowest sugar, the same on katsura-8 and katsura-9.
export const f4Strategy: Strategy = {
  bySugar: false,
  select(pairs) {
    let k = 1;
    while (k < pairs.length && pairs[k].lcm[1] === pairs[0].lcm[1]) k++;
    return pairs.splice(0, k);
  },
  reduce: reduceF4,
  // The tails of the reduced basis as one F4 matrix too.
  finish: interreduceF4,
};

/// Pair by pair with the normal strategy, for orders that do not compare degrees first.
export const normalStrategy: Strategy = { ...pairwiseStrategy, bySugar: false };

/// The dispatcher. Degree orders over GF(p): F4 for every p < 2^31 (the WebAssembly kernel
/// of f4-kernel.ts is exact for all of them). With the kernel F4 became 2× faster on
/// cyclic-7, 4× on katsura-9 and cyclic-8 and 7.6× on katsura-10 over GF(32003) (README of
/// this folder). The crossover, measured 2026-12-03 on the idle development machine (mean of
/// repeated runs in one warm process, grevlex over GF(32003)): pair by pair wins only below a
/// millisecond — 3 quadrics in 3 variables 0.29 ms against F4's 1.03 ms, cyclic-4 0.15 against
/// 1.04 (F4's fixed cost: a matrix, a kernel instance) — and loses from there on: katsura-4
/// 1.73 against 1.12, cyclic-5 6.5 against 4.6, katsura-5 12 against 2.1, katsura-6 110
/// against 4.1, cyclic-6 120 against 7.9. Nothing cheap to read from the input predicts which
/// side a system falls on, and the loss of a wrong pick is below a millisecond one way and
/// many-fold the other, so F4 takes every graded order over GF(p). Pair by pair with sugar over Q
/// (where the modular method runs F4 per prime instead). Lex and weight orders: pair by pair,
/// normal strategy — there matrices of a sugar degree grow large while a single pair stays
/// cheap (measured on the random systems of the SymPy cross-check).
export function chooseStrategy<C>(R: RingCtx<C>): Strategy {
  const graded = R.ring.order.kind === "grevlex" || R.ring.order.kind === "glex";
  if (!graded) return normalStrategy;
  return R.ring.field.kind === "gf" && R.ring.field.p < F4_PRIME_BOUND ? f4Strategy : pairwiseStrategy;
}
