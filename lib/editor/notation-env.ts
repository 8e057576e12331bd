/// The checker's environment built from a session's named objects (name, type and §9
/// JSON), so diagnostics and completion know the bindings' types before anything runs.
import type { Env } from "@/grammar/analysis";
import { T, type SimpleKind, type Type } from "@/grammar/types";

/// The part of a named object the environment needs.
export interface TypedBinding {
  readonly name: string;
  readonly type: string;
  readonly value: { readonly type?: string; readonly vars?: readonly string[] };
  readonly updatedAt?: string;
}

const SIMPLE: ReadonlySet<string> = new Set<SimpleKind>([
  "Int",
  "Rat",
  "Bool",
  "Str",
  "Field",
  "Poly",
  "Ideal",
  "Matrix",
  "Module",
  "Complex",
  "BettiTable",
  "HilbertSeries",
  "Series",
  "None",
]);

type Json = { readonly type?: unknown; readonly [k: string]: unknown };

const isJson = (v: unknown): v is Json => typeof v === "object" && v !== null;

/// The checker type of a §9 value (recursively for lists and records); Any when the
/// JSON does not say enough.
export function typeOfValueJson(v: unknown): Type {
  if (!isJson(v) || typeof v.type !== "string") return T.Any;
  const kind = v.type;
  if (kind === "Ring") {
    const vars = Array.isArray(v.vars) && v.vars.every((x) => typeof x === "string") ? (v.vars as string[]) : null;
    return T.ring(vars);
  }
  if (kind === "List") {
    const items = Array.isArray(v.items) ? v.items : [];
    return T.list(items.length ? typeOfValueJson(items[0]) : T.Any);
  }
  if (kind === "Record" && isJson(v.fields)) {
    return T.record(Object.fromEntries(Object.entries(v.fields).map(([k, f]) => [k, typeOfValueJson(f)])));
  }
  if (kind === "Function") {
    const params = Array.isArray(v.params) ? v.params.map(() => T.Any) : null;
    return T.fn(params, T.Any);
  }
  if (kind === "Table") return T.table(null);
  if (kind === "Family") {
    const members = Array.isArray(v.members) ? v.members : [];
    return T.family(members.length ? typeOfValueJson(members[0]) : T.Ideal);
  }
  if (SIMPLE.has(kind)) return { kind } as Type;
  return T.Any;
}

/// The environment of a session: every object's type, and as the current ring the
/// most recently updated Ring (the page cannot see `use` statements of earlier cells,
/// so this is the best guess; the server's checker has the final word).
export function envFromObjects(objects: readonly TypedBinding[]): Env {
  const bindings: Record<string, Type> = {};
  let currentRing: string | null = null;
  let newest = "";
  for (const o of objects) {
    const t = typeOfValueJson({ ...o.value, type: o.value.type ?? o.type });
    bindings[o.name] = t;
    if (t.kind === "Ring" && (o.updatedAt ?? "") >= newest) {
      newest = o.updatedAt ?? "";
      currentRing = o.name;
    }
  }
  return { bindings, currentRing };
}
