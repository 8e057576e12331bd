import { runtimeError } from "../errors";
import { isPrime } from "./prime";

/// A coefficient field: the prime field Z/p or the rationals.
export type Field = { readonly kind: "gf"; readonly p: number } | { readonly kind: "Q" };

export type PrimeField = Extract<Field, { kind: "gf" }>;

export const GF_MAX = 2 ** 31;

/// The prime field GF(p); p must be a prime below 2^31.
export function gf(p: number): PrimeField {
  if (typeof p !== "number" || !Number.isInteger(p)) {
    throw runtimeError("gf", `the characteristic must be an integer, got ${String(p)}`);
  }
  if (p < 2 || p >= GF_MAX) {
    throw runtimeError("gf", `the characteristic must be a prime with 2 <= p < 2^31, got ${p}`);
  }
  if (!isPrime(p)) throw runtimeError("gf", `${p} is not prime, so Z/${p} is not a field`);
  return Object.freeze({ kind: "gf", p });
}

/// The rationals.
export const QQ: Field = Object.freeze({ kind: "Q" });

export function fieldName(F: Field): string {
  return F.kind === "Q" ? "Q" : `GF(${F.p})`;
}
