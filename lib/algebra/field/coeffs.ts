import { runtimeError } from "../errors";
import type { Field } from "./field";
import { bigToMod, invMod, mulModLarge, mulModSmall, SMALL_PRIME_BOUND } from "./gfp";
import { rat, ratAdd, ratInv, ratMul, ratNeg, ratSub, type Rat, RAT_ONE, RAT_ZERO } from "./rational";

/// Arithmetic of one coefficient field, passed explicitly to the polynomial code.
export interface Coeffs<C> {
  readonly field: Field;
  readonly zero: C;
  readonly one: C;
  add(a: C, b: C): C;
  sub(a: C, b: C): C;
  mul(a: C, b: C): C;
  neg(a: C): C;
  /// Caller guarantees a != 0.
  inv(a: C): C;
  isZero(a: C): boolean;
  isOne(a: C): boolean;
  eq(a: C, b: C): boolean;
  /// The element num/den; an error when den is 0 in the field.
  fromRational(num: bigint, den: bigint): C;
  /// num/den with den > 0; over GF(p) the symmetric representative -p/2 < num <= p/2, den 1.
  toRational(a: C): { num: bigint; den: bigint };
}

export interface GFCoeffs extends Coeffs<number> {
  readonly p: number;
}

const INVERSE_TABLE_BOUND = 1 << 16;

export function gfCoeffs(F: Field & { kind: "gf" }): GFCoeffs {
  const p = F.p;
  const mul = p < SMALL_PRIME_BOUND ? (a: number, b: number) => mulModSmall(a, b, p) : (a: number, b: number) => mulModLarge(a, b, p);
  // Small fields get a full table of inverses, larger ones a lazily filled cache.
  const table = p < INVERSE_TABLE_BOUND ? new Int32Array(p) : null;
  const cache = new Map<number, number>();
  const inv = (a: number): number => {
    if (table) {
      const t = table[a];
      if (t !== 0) return t;
      const r = invMod(a, p);
      table[a] = r;
      return r;
    }
    let r = cache.get(a);
    if (r === undefined) {
      r = invMod(a, p);
      if (cache.size < 4096) cache.set(a, r);
    }
    return r;
  };
  return {
    field: F,
    p,
    zero: 0,
    one: 1 % p,
    add: (a, b) => {
      const s = a + b;
      return s >= p ? s - p : s;
    },
    sub: (a, b) => {
      const s = a - b;
      return s < 0 ? s + p : s;
    },
    mul,
    neg: (a) => (a === 0 ? 0 : p - a),
    inv,
    isZero: (a) => a === 0,
    isOne: (a) => a === 1,
    eq: (a, b) => a === b,
    fromRational(num, den) {
      const d = bigToMod(den, p);
      if (d === 0) throw runtimeError("constant", `the denominator ${den} is 0 in GF(${p})`);
      return mul(bigToMod(num, p), inv(d));
    },
    toRational(a) {
      return { num: BigInt(a > p / 2 ? a - p : a), den: 1n };
    },
  };
}

export const qCoeffs: Coeffs<Rat> = {
  field: { kind: "Q" },
  zero: RAT_ZERO,
  one: RAT_ONE,
  add: ratAdd,
  sub: ratSub,
  mul: ratMul,
  neg: ratNeg,
  inv: ratInv,
  isZero: (a) => a.n === 0n,
  isOne: (a) => a.n === 1n && a.d === 1n,
  eq: (a, b) => a.n === b.n && a.d === b.d,
  fromRational(num, den) {
    if (den === 0n) throw runtimeError("constant", "division by zero");
    return rat(num, den);
  },
  toRational: (a) => ({ num: a.n, den: a.d }),
};

/// Formats a coefficient as a signed number: "3", "-3/4".
export function formatCoeff<C>(K: Coeffs<C>, a: C): string {
  const { num, den } = K.toRational(a);
  return den === 1n ? num.toString() : `${num}/${den}`;
}

export function coeffsOf(F: Field): Coeffs<unknown> {
  return (F.kind === "Q" ? qCoeffs : gfCoeffs(F)) as Coeffs<unknown>;
}
