/// Rings of one evaluation, interned: the same ring written twice (or restored from the
/// JSON of several saved objects) is one RingValue, so its polynomials mix freely and its
/// Gröbner basis is computed once.
import { QQ, gf, polyRing, type Field, type OrderSpec, type Poly } from "../algebra/index";
import { fieldText, orderText } from "./text";
import type { RingValue } from "./values";
import { formatPoly } from "../algebra/index";

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
    const key = `${fieldText(poly.field)}|${poly.vars.join(",")}|${poly.degrees.join(",")}|${orderText(poly.order)}`;
    let r = this.rings.get(key);
    if (!r) {
      r = { type: "Ring", poly, ideal: [] };
      this.rings.set(key, r);
    }
    return r;
  }

  /// The ring `base.poly / (base.ideal + gens)`; generators must be polynomials of base.poly.
  quotient(base: RingValue, gens: readonly Poly[], basis?: readonly Poly[]): RingValue {
    const ideal = [...base.ideal, ...gens];
    const ambient = this.polynomialRing(base.poly.field, base.poly.vars, { order: base.poly.order, degrees: [...base.poly.degrees] });
    const key = `${this.keyOf(ambient)}/${ideal.map((f) => formatPoly(ambient.poly, f)).join(",")}`;
    let r = this.rings.get(key);
    if (!r) {
      r = { type: "Ring", poly: ambient.poly, ideal, ...(basis ? { basis } : {}) };
      this.rings.set(key, r);
    }
    return r;
  }

  /// The polynomial ring a ring is a quotient of.
  ambient(r: RingValue): RingValue {
    return this.polynomialRing(r.poly.field, r.poly.vars, { order: r.poly.order, degrees: [...r.poly.degrees] });
  }

  private keyOf(r: RingValue): string {
    return `${fieldText(r.poly.field)}|${r.poly.vars.join(",")}|${r.poly.degrees.join(",")}|${orderText(r.poly.order)}`;
  }
}
