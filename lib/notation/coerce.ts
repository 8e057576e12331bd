/// Numbers and polynomials moved into the ring an operation works in: integers and
/// rationals become constants, a polynomial of S becomes its class in a quotient S/J
/// (the natural map), and everything in a quotient ring is kept in normal form.
import type { Span } from "../../grammar/ast";
import { constant, groebnerBasis, isZero, normalForm, type ComputeOptions, type Poly } from "../algebra/index";
import { runtime } from "./errors";
import { ringText } from "./text";
import type { RingValue, Value } from "./values";

/// Reduced Gröbner basis of the defining ideal (computed once per ring).
export function ringBasis(r: RingValue, opts?: ComputeOptions): readonly Poly[] {
  if (!r.basis) r.basis = r.ideal.length === 0 ? [] : groebnerBasis(r.poly, [...r.ideal], opts);
  return r.basis;
}

/// The normal form of f modulo the defining ideal of r: the canonical representative.
export function reduceIn(r: RingValue, f: Poly, opts?: ComputeOptions): Poly {
  if (r.ideal.length === 0 || isZero(f)) return f;
  return normalForm(r.poly, f, ringBasis(r, opts), opts);
}

/// Whether elements of `from` map naturally into `to`: the same ring, or `from` is the
/// polynomial ring `to` is a quotient of.
export function mapsInto(from: RingValue, to: RingValue): boolean {
  return from === to || (from.poly === to.poly && from.ideal.length === 0);
}

export function toPoly(v: Value, ring: RingValue, span: Span, opts?: ComputeOptions): Poly {
  switch (v.type) {
    case "Int":
      return reduceIn(ring, constant(ring.poly, v.value), opts);
    case "Rat":
      if (ring.poly.field.kind === "gf" && v.value.d % BigInt(ring.poly.field.p) === 0n) {
        throw runtime(`division by zero: ${v.value.d} is 0 in GF(${ring.poly.field.p})`, span);
      }
      return reduceIn(ring, constant(ring.poly, v.value.n, v.value.d), opts);
    case "Poly":
      if (!mapsInto(v.ring, ring)) {
        throw runtime(`this polynomial belongs to ${ringText(v.ring)}, but ${ringText(ring)} is expected here`, span);
      }
      return v.ring === ring ? v.poly : reduceIn(ring, v.poly, opts);
    default:
      throw runtime(`expected a polynomial, got ${v.type}`, span);
  }
}

/// The ring two polynomial operands share: the one the other maps into.
export function commonRing(a: RingValue, b: RingValue, span: Span): RingValue {
  if (mapsInto(a, b)) return b;
  if (mapsInto(b, a)) return a;
  throw runtime(`the operands live in different rings: ${ringText(a)} and ${ringText(b)}`, span);
}

/// The ring of the polynomial operands (numbers take the other operand's ring).
export function ringOfOperands(values: readonly Value[], span: Span, fallback: RingValue | null): RingValue {
  let ring: RingValue | null = null;
  for (const v of values) {
    const r = v.type === "Poly" || v.type === "Ideal" || v.type === "Matrix" ? v.ring : null;
    if (r) ring = ring ? commonRing(ring, r, span) : r;
  }
  if (ring) return ring;
  if (fallback) return fallback;
  throw runtime("there is no current ring to compute in", span);
}
