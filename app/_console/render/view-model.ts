/// Turns a §9 value into what the transcript draws: TeX for algebra, a grid for Betti
/// tables, a chain of ranks for resolutions, plain text for the rest. Pure functions of
/// the JSON, so every rendering rule is unit-tested without a browser.
import type { ValueReading } from "@/lib/wire/reading";
import { bettiGrid, type BettiEntry, type BettiGrid } from "./betti";
import { hilbertFacts, texOfHilbertPolynomial, type HilbertFacts } from "./hilbert";
import { resolutionView, ringNameOf, type ResolutionView } from "./resolution";
import { texOfHilbertSeries, texOfSeriesPrefix } from "./series";
import { texOfExpression, texOfIdeal, texOfMatrix, texOfVariable, texOrVerbatim } from "./tex";

/// What one value looks like on screen.
export type ValueView =
  | { readonly kind: "tex"; readonly tex: string; readonly note?: string }
  | { readonly kind: "betti"; readonly grid: BettiGrid }
  | {
      readonly kind: "complex";
      /// the chain of free modules with their twists (resolution.chain)
      readonly chain: string;
      readonly grid: BettiGrid;
      readonly resolution: ResolutionView;
      /// the chain in plain text: S <- S(-2)^3 <- S(-3)^2 <- 0
      readonly resolutionText: string;
    }
  | {
      readonly kind: "hilbert";
      /// the series as computed, N(t)/(1−t)^n
      readonly tex: string;
      /// the reduced form h(t)/(1−t)^d, and what it tells; null for a non-standard grading
      readonly facts: (HilbertFacts & { readonly reducedTex: string; readonly polynomialTex: string }) | null;
    }
  | { readonly kind: "series"; readonly tex: string; readonly note: string }
  | { readonly kind: "text"; readonly text: string }
  | { readonly kind: "list"; readonly items: readonly ValueView[] }
  | { readonly kind: "record"; readonly fields: readonly (readonly [string, ValueView])[] }
  | { readonly kind: "table"; readonly columns: readonly string[]; readonly rows: readonly (readonly string[])[] };

/// What the transcript knows around a value: the session's named objects, so a
/// resolution is written over the ring's name (S, not R); and where the whole of a value
/// stored as a summary is fetched (render/detail.ts), absent outside an open session.
export interface ViewContext {
  readonly objects?: readonly { readonly name: string; readonly value: ValueReading }[];
  readonly detailAddress?: (detailId: string) => string;
}

/// The field names of a §9 Record in the order the user wrote them (`fieldOrder`, kept beside
/// the fields because stored JSON does not keep key order).
export function recordFieldOrder(v: ValueReading): string[] {
  const fields = v.fields ?? {};
  const keys = Object.keys(fields);
  const order = (v as ValueReading & { fieldOrder?: readonly unknown[] }).fieldOrder;
  if (Array.isArray(order) && order.length === keys.length && order.every((k) => typeof k === "string" && Object.hasOwn(fields, k))) {
    return order as string[];
  }
  return keys;
}

/// Plain text of a resolution's chain, for copying: S <- S(-2)^3 <- S(-3)^2 <- 0.
function resolutionPlainText(v: ValueReading, ringName: string | null): string {
  const ring = ringName ?? "R";
  const entries = (v.betti ?? []).filter((e) => Array.isArray(e) && e.length === 3);
  const ranks = v.ranks ?? [];
  const length = Math.max(ranks.length, ...entries.map(([i]) => i + 1));
  const modules = Array.from({ length }, (_, i) => {
    const parts = entries.filter(([h, , b]) => h === i && b !== 0).sort((a, b) => a[1] - b[1]);
    if (parts.length === 0) return (ranks[i] ?? 0) === 0 ? "0" : ranks[i] === 1 ? ring : `${ring}^${ranks[i]}`;
    return parts.map(([, j, b]) => `${ring}${j === 0 ? "" : `(${-j})`}${b === 1 ? "" : `^${b}`}`).join(" + ");
  });
  return `0 <- ${modules.join(" <- ")}${v.complete !== false ? " <- 0" : " <- ..."}`;
}

/// TeX of a field name of §9 ("Q", "GF(p)").
export function texOfField(field: string): string {
  if (field === "Q") return "\\mathbb{Q}";
  const p = /^GF\((\d+)\)$/.exec(field);
  return p ? `\\mathbb{F}_{${p[1]}}` : texOrVerbatim(field);
}

/// TeX of a ring from its §9 encoding: K[x, y, …], over its defining ideal when nonzero.
export function texOfRing(v: ValueReading): string {
  const vars = (v.vars ?? []).map(texOfVariable).join(", ");
  const base = `${texOfField(v.field ?? "?")}[${vars}]`;
  const ideal = (v.ideal ?? []).filter((g) => g !== "0");
  const global = ideal.length ? `${base} / ${texOfIdeal(ideal)}` : base;
  // a local ring (notation.md §11): the ring localised at the maximal ideal of its point
  const at = v.local?.at;
  if (!at) return global;
  const point = at.every((a) => a === "0")
    ? "0"
    : `(${at.map((a) => (a.includes("/") ? `\\tfrac{${a.split("/")[0]}}{${a.split("/")[1]}}` : a)).join(", ")})`;
  return `\\left(${global}\\right)_{\\mathfrak{m}_{${point}}}`;
}

/// TeX of a presented module: 0, a graded free module ⊕ R(−d)^m when there are no
/// relations, else coker of the presentation with the generators' degrees when not all 0.
export function texOfModule(rows: readonly (readonly string[])[], degrees: readonly number[], ring?: ValueReading): string {
  if (rows.length === 0) return "0";
  const R = ring?.vars ? texOfRing(ring) : "R";
  const base = ring?.ideal?.some((g) => g !== "0") ? `\\left(${R}\\right)` : R;
  if (rows.every((r) => r.length === 0)) {
    const counts = new Map<number, number>();
    rows.forEach((_, a) => counts.set(degrees[a] ?? 0, (counts.get(degrees[a] ?? 0) ?? 0) + 1));
    return [...counts]
      .sort(([d], [e]) => d - e)
      .map(([d, m]) => `${base}${d === 0 ? "" : `(${-d})`}${m === 1 ? "" : `^{${m}}`}`)
      .join(" \\oplus ");
  }
  const shifted = degrees.some((d) => d !== 0) ? ` \\quad \\text{(generators in degrees ${degrees.join(", ")})}` : "";
  return `\\operatorname{coker} ${texOfMatrix(rows)}${shifted}`;
}

const entriesOf = (v: ValueReading): BettiEntry[] =>
  ((v.entries ?? v.betti ?? []) as readonly BettiEntry[]).filter(
    (e) => Array.isArray(e) && e.length === 3 && e.every((n) => typeof n === "number"),
  );

function isStringRows(rows: ValueReading["rows"]): rows is readonly (readonly string[])[] {
  return Array.isArray(rows) && rows.every((r) => Array.isArray(r) && r.every((c) => typeof c === "string"));
}

/// The view of a §9 value; unknown or malformed values fall back to their `text`.
export function viewOfValue(v: ValueReading, ctx: ViewContext = {}): ValueView {
  switch (v.type) {
    case "Poly":
      return { kind: "tex", tex: texOrVerbatim(v.text) };
    case "Int":
      // the number alone; its note, if any, is drawn under it (noteOfValue)
      return { kind: "text", text: typeof v.value === "string" ? v.value : v.text };
    case "Rat": {
      const t = typeof v.value === "string" ? v.value : v.text;
      return { kind: "tex", tex: texOfExpression(t) ?? texOrVerbatim(t) };
    }
    case "Ideal":
      return v.gens ? { kind: "tex", tex: texOfIdeal(v.gens) } : { kind: "text", text: v.text };
    case "Ring":
      return v.vars ? { kind: "tex", tex: texOfRing(v) } : { kind: "text", text: v.text };
    case "Field":
      return { kind: "tex", tex: texOfField(v.text) };
    case "Matrix":
      return isStringRows(v.rows) ? { kind: "tex", tex: texOfMatrix(v.rows) } : { kind: "text", text: v.text };
    case "Module": {
      const p = v.presentation;
      if (!p || !isStringRows(p.rows)) return { kind: "text", text: v.text };
      return { kind: "tex", tex: texOfModule(p.rows, v.degrees ?? [], v.ring ?? undefined) };
    }
    case "BettiTable":
      return { kind: "betti", grid: bettiGrid(entriesOf(v), v.complete !== false) };
    case "Complex": {
      const complete = v.complete !== false;
      const ringName = ringNameOf(v.ring ?? undefined, ctx.objects ?? []);
      const resolution = resolutionView(v, ringName);
      return {
        kind: "complex",
        chain: resolution.chain,
        grid: bettiGrid(entriesOf(v), complete),
        resolution,
        resolutionText: resolutionPlainText(v, ringName),
      };
    }
    case "HilbertSeries": {
      if (!v.numerator || typeof v.denominator !== "string") return { kind: "text", text: v.text };
      const lowest = typeof v.lowest === "number" ? v.lowest : 0;
      const facts = hilbertFacts(v.numerator, v.denominator, lowest);
      return {
        kind: "hilbert",
        tex: texOfHilbertSeries(v.numerator, v.denominator, lowest),
        facts: facts && {
          ...facts,
          reducedTex: texOrVerbatim(facts.reduced),
          polynomialTex: texOfHilbertPolynomial(facts.polynomial),
        },
      };
    }
    case "Series": {
      const coefficients = v.coefficients ?? [];
      const terms = `${coefficients.length} term${coefficients.length === 1 ? "" : "s"}`;
      if (v.rational) {
        const checked = typeof v.checked === "number" ? v.checked : 0;
        // the computed terms first, then the guess beside them: the guess is not the answer
        return {
          kind: "series",
          tex: `${texOfSeriesPrefix(coefficients)} \\qquad ${texOrVerbatim(v.rational)}`,
          note: `guessed rational function (not a proof): it reproduces ${checked} computed term${checked === 1 ? "" : "s"} beyond those it was fitted to`,
        };
      }
      return { kind: "series", tex: texOfSeriesPrefix(coefficients), note: `${terms} computed; no rational function found that fits them` };
    }
    case "List":
      return { kind: "list", items: (v.items ?? []).map((x) => viewOfValue(x, ctx)) };
    case "Record": {
      const fields = v.fields ?? {};
      return { kind: "record", fields: recordFieldOrder(v).map((k) => [k, viewOfValue(fields[k]!, ctx)] as const) };
    }
    case "Table": {
      const rows = (v.rows ?? []) as readonly (readonly ValueReading[])[];
      return {
        kind: "table",
        columns: v.columns ?? [],
        rows: rows.map((r) => (Array.isArray(r) ? r.map((c) => (typeof c === "object" && c ? c.text : String(c))) : [])),
      };
    }
    case "Experiment":
      // A background sweep: its text gives status, done/total and how to follow it (the
      // experiments pages link it by id).
      return { kind: "text", text: v.text };
    default:
      return { kind: "text", text: v.text };
  }
}

/// The value's own warning (a bound that cut it, a random choice behind it), shown under it
/// in words: the `text` carries it too, but the typeset view would otherwise hide it.
export function noteOfValue(v: ValueReading): string | null {
  return typeof v.note === "string" && v.note !== "" ? v.note : null;
}
