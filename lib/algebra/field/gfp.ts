import { runtimeError } from "../errors";

/// Arithmetic in Z/p on JS numbers in [0, p). For p < 2^26 a product of two residues is
/// below 2^52 and exact in a double; above that the multiplier is split into 16-bit halves.
export const SMALL_PRIME_BOUND = 2 ** 26;

export function mulModSmall(a: number, b: number, p: number): number {
  return (a * b) % p;
}

export function mulModLarge(a: number, b: number, p: number): number {
  const hi = Math.floor(b / 65536);
  const lo = b - hi * 65536;
  return (((a * hi) % p) * 65536 + a * lo) % p;
}

/// Inverse by the extended Euclidean algorithm.
export function invMod(a: number, p: number): number {
  if (a === 0) throw runtimeError("invMod", `0 has no inverse in GF(${p})`);
  let r0 = p,
    r1 = a,
    s0 = 0,
    s1 = 1;
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  return s0 < 0 ? s0 + p : s0;
}

/// A residue of a BigInt.
export function bigToMod(n: bigint, p: number): number {
  const r = Number(n % BigInt(p));
  return r < 0 ? r + p : r;
}
