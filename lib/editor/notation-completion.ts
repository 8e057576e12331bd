/// Completion from the grammar's signature table (the one table the checker reads):
/// after `expr.` the properties of the expression's type with their descriptions, inside
/// a call the function's named options, after `;` in ring brackets the ring options,
/// elsewhere functions, bindings, the current ring's variables and keywords.
import { autocompletion, type Completion, type CompletionContext, type CompletionResult } from "@codemirror/autocomplete";
import type { Extension } from "@codemirror/state";
import type { Analysis, Env } from "@/grammar/analysis";
import type { Expr } from "@/grammar/ast";
import { CONSTANTS, FUNCTIONS, RING_OPTIONS, lookupFunction, propertiesOf, type PropertySig } from "@/grammar/signatures";
import { typeToString, type Type, type TypeKind } from "@/grammar/types";
import { completionPlace } from "./completion-context";

/// What completion needs from the page: the checker and the session's environment.
export interface NotationCompletionOptions {
  readonly analyze: (source: string, env: Env) => Analysis;
  readonly env: () => Env;
}

const KEYWORDS = ["use", "in", "for", "if", "then", "else", "and", "or", "not", "true", "false"];

/// The kinds whose properties a value of type `t` answers; a quotient ring also answers
/// every Module property (notation.md §3).
export function ownerKinds(t: Type): TypeKind[] {
  if (t.kind === "Union") return t.options.flatMap(ownerKinds);
  if (t.kind === "Ring") return ["Ring", "Module"];
  return [t.kind];
}

/// The type of the expression that ends exactly at `dot` (the outermost one), by
/// checking the text before the dot with the session's environment.
export function typeBefore(options: NotationCompletionOptions, source: string, dot: number): Type | null {
  let analysis: Analysis;
  try {
    analysis = options.analyze(source.slice(0, dot), options.env());
  } catch {
    return null;
  }
  let best: { expr: Expr; type: Type } | null = null;
  for (const [expr, type] of analysis.types) {
    if (expr.span.to.offset !== dot) continue;
    if (!best || expr.span.from.offset < best.expr.span.from.offset) best = { expr, type };
  }
  return best?.type ?? null;
}

function propertyOption(p: PropertySig, extra: boolean): Completion {
  const params = p.params ? `(${p.params.map((q) => q.name).join(", ")})` : "";
  return {
    label: p.name,
    type: p.params ? "method" : "property",
    detail: `${params} → ${typeToString(p.result)}${extra ? " (as a module)" : ""}`,
    info: p.description,
    apply: p.params ? `${p.name}(` : p.name,
  };
}

function propertyCompletions(options: NotationCompletionOptions, source: string, dot: number): Completion[] {
  const t = typeBefore(options, source, dot);
  if (!t) return [];
  const seen = new Set<string>();
  const out: Completion[] = [];
  ownerKinds(t).forEach((kind, k) => {
    for (const p of propertiesOf(kind)) {
      if (seen.has(p.name)) continue;
      seen.add(p.name);
      out.push(propertyOption(p, t.kind === "Ring" && k > 0));
    }
  });
  return out;
}

function nameCompletions(options: NotationCompletionOptions, source: string): Completion[] {
  const env = options.env();
  let finalEnv: Env = env;
  try {
    finalEnv = options.analyze(source, env).finalEnv;
  } catch {
    // A checker failure must not take completion down; the session's names remain.
  }
  const out: Completion[] = FUNCTIONS.map((f) => ({
    label: f.name,
    type: "function",
    detail: f.options.length ? `(…; ${f.options.map((o) => o.name).join(", ")})` : "(…)",
    info: `${f.description}\ne.g. ${f.example}`,
  }));
  for (const c of CONSTANTS) out.push({ label: c.name, type: "constant", info: c.description });
  for (const [name, t] of Object.entries({ ...env.bindings, ...finalEnv.bindings })) {
    out.push({ label: name, type: "variable", detail: typeToString(t), boost: 2 });
  }
  const ringName = finalEnv.currentRing ?? env.currentRing;
  const ring = ringName ? (finalEnv.bindings[ringName] ?? env.bindings[ringName]) : undefined;
  if (ring?.kind === "Ring" && ring.vars) {
    for (const v of ring.vars) out.push({ label: v, type: "variable", detail: `variable of ${ringName}`, boost: 1 });
  }
  for (const k of KEYWORDS) out.push({ label: k, type: "keyword" });
  return out;
}

/// The completion source of the notation (exported for tests and reuse).
export function notationCompletionSource(options: NotationCompletionOptions) {
  return (context: CompletionContext): CompletionResult | null => {
    const source = context.state.doc.toString();
    const place = completionPlace(source, context.pos);
    const typed = place.from < context.pos;
    if (place.kind === "property") {
      const items = propertyCompletions(options, source, place.dot);
      return items.length ? { from: place.from, options: items, validFor: /^[A-Za-z_]*$/ } : null;
    }
    if (place.kind === "ring-option") {
      return {
        from: place.from,
        options: RING_OPTIONS.map((o) => ({
          label: o.name,
          type: "property",
          detail: `= ${o.values}`,
          info: `${o.description} (default ${o.default})`,
          apply: `${o.name} = `,
        })),
      };
    }
    if (place.kind === "option") {
      const fn = lookupFunction(place.fn);
      if (fn && fn.options.length) {
        const opts: Completion[] = fn.options.map((o) => ({
          label: o.name,
          type: "property",
          detail: `= ${typeToString(o.type)}${o.default !== null ? ` (default ${o.default})` : ""}`,
          info: o.description,
          apply: `${o.name} = `,
          boost: 5,
        }));
        return { from: place.from, options: [...opts, ...nameCompletions(options, source)], validFor: /^[A-Za-z_]*$/ };
      }
    }
    if (!typed && !context.explicit) return null;
    return { from: place.from, options: nameCompletions(options, source), validFor: /^[A-Za-z0-9_']*$/ };
  };
}

/// Completion for the Ringside input, opening by itself after `.` and `(`.
export function notationCompletion(options: NotationCompletionOptions): Extension {
  return autocompletion({
    override: [notationCompletionSource(options)],
    activateOnTyping: true,
    icons: false,
  });
}
