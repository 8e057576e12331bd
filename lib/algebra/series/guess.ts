import { bigGcd, rat, ratMul, ratSub, type Rat, RAT_ONE, RAT_ZERO } from "../field/rational";
import type { TruncatedSeries } from "./power";

/// A rational function num/den with integer coefficients, den(0) = 1, in lowest terms,
/// that reproduces every known coefficient.
export interface RationalGuess {
  numerator: bigint[];
  denominator: bigint[];
  /// How many coefficients (t^0 … t^{checkedOn−1}) it was checked against.
  checkedOn: number;
  /// How many of them were needed to determine it (2·L for a recurrence of length L).
  determinedBy: number;
}

/// The shortest linear recurrence of the coefficients (Berlekamp–Massey over Q: J. Massey,
/// "Shift-register synthesis and BCH decoding", IEEE Trans. Inform. Theory 1969), read as
/// num/den with den the connection polynomial. Such a recurrence of length L is unique once
/// 2L coefficients are known; the guess is returned only when at least `margin` further
/// coefficients confirm it, otherwise `null` (too few terms to decide).
export function guessRational(s: TruncatedSeries, margin = 2): RationalGuess | null {
  const a = s.coeffs.map((c) => rat(c));
  const N = a.length;
  const C: Rat[] = [RAT_ONE];
  let B: Rat[] = [RAT_ONE];
  let L = 0,
    m = 1;
  let b: Rat = RAT_ONE;
  for (let k = 0; k < N; k++) {
    // The discrepancy of the recurrence Σ_i C_i a_{k−i} = 0 (C_0 = 1) at k.
    let d = a[k];
    for (let i = 1; i < C.length; i++) d = addR(d, ratMul(C[i], a[k - i] ?? RAT_ZERO));
    if (d.n === 0n) {
      m++;
      continue;
    }
    const coef = ratMul(d, rat(b.d, b.n));
    const T = C.slice();
    const need = B.length + m;
    while (C.length < need) C.push(RAT_ZERO);
    for (let i = 0; i < B.length; i++) C[i + m] = ratSub(C[i + m], ratMul(coef, B[i]));
    if (2 * L <= k) {
      L = k + 1 - L;
      B = T;
      b = d;
      m = 1;
    } else m++;
  }
  if (N < 2 * L + margin) return null;
  while (C.length > 1 && C[C.length - 1].n === 0n) C.pop();
  // num = (den · series) mod t^L.
  const num: Rat[] = [];
  for (let k = 0; k < L; k++) {
    let c = RAT_ZERO;
    for (let i = 0; i <= k && i < C.length; i++) c = addR(c, ratMul(C[i], a[k - i]));
    num.push(c);
  }
  while (num.length > 0 && num[num.length - 1].n === 0n) num.pop();
  const [nz, dz] = clearDenominators(num, C);
  return { numerator: nz, denominator: dz, checkedOn: N, determinedBy: 2 * L };
}

function addR(x: Rat, y: Rat): Rat {
  return ratSub(x, rat(-y.n, y.d));
}

/// Integer coefficients: the reduced form of an integral rational series already has them
/// with den(0) = 1 (Fatou's lemma); otherwise both are scaled by the common denominator.
function clearDenominators(num: Rat[], den: Rat[]): [bigint[], bigint[]] {
  let l = 1n;
  for (const c of [...num, ...den]) l = (l * c.d) / bigGcd(l, c.d);
  return [num.map((c) => (c.n * l) / c.d), den.map((c) => (c.n * l) / c.d)];
}
