/// Rings of one evaluation, interned: the same ring written twice (or restored from the
/// JSON of several saved objects) is one RingValue, so its polynomials mix freely and its
/// Gröbner basis is computed once.
import { QQ, formatPoly, gf, polyRing, type Field, type OrderSpec, type Poly, type PolyRing } from "../algebra/index";
import { fieldText, orderText } from "./text";
import type { Rat } from "../algebra/index";
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
  /// A quotient of a local ring is local at the same point, and read as a module it lives
  /// over that local ring.
  quotient(base: RingValue, gens: readonly Poly[]): RingValue {
    const ideal = [...base.ideal, ...gens];
    const ambient = this.ambient(base);
    // (S/J)/I and S/(J+I) are the same ring but not the same module: keep them apart.
    const over = base.ideal.length > 0 || base.local ? base : undefined;
    const key = `${keyOf(ambient.poly)}/${ideal.map((f) => formatPoly(ambient.poly, f)).join(",")}${over ? `|over:${base.ideal.length}` : ""}${localKey(base)}`;
    let r = this.rings.get(key);
    if (!r) {
      r = { type: "Ring", poly: ambient.poly, ideal, ...(over ? { over } : {}), ...(base.local ? { local: base.local } : {}) };
      this.rings.set(key, r);
    }
    return r;
  }

  /// The local ring of r at the point `at` (grammar/README.md, "Local rings"): the polynomial ring localised
  /// there, and r's defining ideal (and the ring it was formed from) carried over.
  localize(r: RingValue, at: readonly Rat[]): RingValue {
    if (r.local) {
      if (r.local.at.every((a, i) => a.n === at[i].n && a.d === at[i].d)) return r;
      r = this.unlocalized(r);
    }
    if (r.over) return this.quotient(this.localize(r.over, at), r.ideal.slice(r.over.ideal.length));
    const key = `${keyOf(r.poly)}${localKey({ local: { at } })}`;
    let base = this.rings.get(key);
    if (!base) {
      base = { type: "Ring", poly: r.poly, ideal: [], local: { at: [...at] } };
      this.rings.set(key, base);
    }
    return r.ideal.length === 0 ? base : this.quotient(base, r.ideal);
  }

  /// The global ring a local ring is a localisation of.
  unlocalized(r: RingValue): RingValue {
    if (!r.local) return r;
    if (r.over) return this.quotient(this.unlocalized(r.over), r.ideal.slice(r.over.ideal.length));
    const S = this.ambient(r);
    return r.ideal.length === 0 ? S : this.quotient(S, r.ideal);
  }

  /// The polynomial ring a ring is a quotient of.
  ambient(r: RingValue): RingValue {
    return this.polynomialRing(r.poly.field, r.poly.vars, { order: r.poly.order, degrees: [...r.poly.degrees] });
  }
}

const localKey = (r: { local?: { at: readonly Rat[] } }): string =>
  r.local ? `@local(${r.local.at.map((a) => `${a.n}/${a.d}`).join(",")})` : "";

const keyOf = (p: PolyRing): string => `${fieldText(p.field)}|${p.vars.join(",")}|${p.degrees.join(",")}|${orderText(p.order)}`;
