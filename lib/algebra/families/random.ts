/// The engine's seeded pseudo-random generator, identical on every machine and in every
/// process: 32-bit integer arithmetic only (Math.imul, >>>), no Math.random, no floats.
///
/// * Generator: xoshiro128** (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
///   generators", ACM Trans. Math. Softw. 47 (2021), §4 and its reference code), 128 bits
///   of state, period 2^128 − 1.
/// * Seeding: the four state words come from SplitMix32-style mixing (the finaliser of
///   MurmurHash3, common practice) of (seed, stream): seed an Int, stream a member index,
///   so member k of a family depends only on (seed, k) and can be regenerated alone.
/// * Uniform integers in [0, n): rejection sampling on 32-bit outputs (no modulo bias).
import { runtimeError } from "../errors";

/// MurmurHash3's 32-bit finaliser: a bijection that spreads every input bit.
function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

export class SeededRandom {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  /// `seed` any integer (reduced to 64 bits, two's complement); `stream` a non-negative index.
  constructor(seed: bigint, stream = 0) {
    const s = BigInt.asUintN(64, seed);
    const lo = Number(s & 0xffffffffn);
    const hi = Number(s >> 32n);
    let x = (lo ^ Math.imul(stream + 1, 0x9e3779b9)) >>> 0;
    const next = () => {
      x = (x + 0x9e3779b9) >>> 0;
      return fmix32(x ^ fmix32(hi + stream));
    };
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1; // the all-zero state is a fixed point
  }

  /// The next 32-bit output, as an unsigned number.
  nextU32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /// A uniform integer in [0, n), 1 ≤ n ≤ 2^32, by rejection (no modulo bias).
  below(n: number): number {
    if (!Number.isInteger(n) || n < 1 || n > 2 ** 32) throw runtimeError("random", `below(n) needs 1 ≤ n ≤ 2^32, got ${n}`);
    const limit = 2 ** 32 - (2 ** 32 % n);
    for (;;) {
      const r = this.nextU32();
      if (r < limit) return r % n;
    }
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
