/// Rings of one evaluation, interned: the same ring written twice (or restored from the
/// JSON of several saved objects) is one RingValue, so its polynomials mix freely and its
/// Gröbner basis is computed once.
import { QQ, formatPoly, gf, polyRing, type Field, type OrderSpec, type Poly, type PolyRing } from "../algebra/index";
import { fieldText, orderText } from "./text";
import type { RingValue } from "./values";

export function parseField(text: string): Field | null {
  if (text === "Q") return QQ;
  const m = /^GF\((\d+)\)$/.exec(text);
  if (!m) return null;
  return gf(Number(m[1]));
}

export function parseOrder(text: string): OrderSpec | null {
  if (text === "grevlex" || text === "lex" || text === "glex") return { kind: text };
  const m = /^weights\(\s*(\d+(?:\s*,\s*\d+)*)\s*\)$/.exec(text);
  if (!m) return null;
  return { kind: "weights", weights: m[1].split(",").map((w) => Number(w.trim())) };
}

export class RingRegistry {
  private readonly rings = new Map<string, RingValue>();

  polynomialRing(field: Field, vars: readonly string[], opts?: { order?: OrderSpec; degrees?: number[] }): RingValue {
    const poly = polyRing(field, vars, opts);
    const key = keyOf(poly);
    let r = this.rings.get(key);
    if (!r) {
      r = { type: "Ring", poly, ideal: [] };
      this.rings.set(key, r);
    }
    return r;
  }

  /// The ring `base.poly / (base.ideal + gens)`; generators must be polynomials of base.poly.
  quotient(base: RingValue, gens: readonly Poly[]): RingValue {
    const ideal = [...base.ideal, ...gens];
    const ambient = this.ambient(base);
    // (S/J)/I and S/(J+I) are the same ring but not the same module: keep them apart.
    const over = base.ideal.length > 0 ? base : undefined;
    const key = `${keyOf(ambient.poly)}/${ideal.map((f) => formatPoly(ambient.poly, f)).join(",")}${over ? `|over:${base.ideal.length}` : ""}`;
    let r = this.rings.get(key);
    if (!r) {
      r = over ? { type: "Ring", poly: ambient.poly, ideal, over } : { type: "Ring", poly: ambient.poly, ideal };
      this.rings.set(key, r);
    }
    return r;
  }

  /// The polynomial ring a ring is a quotient of.
  ambient(r: RingValue): RingValue {
    return this.polynomialRing(r.poly.field, r.poly.vars, { order: r.poly.order, degrees: [...r.poly.degrees] });
  }
}

const keyOf = (p: PolyRing): string => `${fieldText(p.field)}|${p.vars.join(",")}|${p.degrees.join(",")}|${orderText(p.order)}`;
