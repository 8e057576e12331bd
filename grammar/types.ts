/// The type language of the notation (notation.md §8), shared by the checker, the
/// signature table, the evaluator and the editor. Types are plain data (JSON-safe).

/// Types without parameters.
export type SimpleKind =
  | "Int"
  | "Rat"
  | "Bool"
  | "Str"
  | "Field"
  | "Poly"
  | "Ideal"
  | "Matrix"
  | "Module"
  | "Complex"
  | "BettiTable"
  | "HilbertSeries"
  | "Series"
  | "Experiment"
  | "None"
  | "Any";

export type SimpleType = { readonly kind: SimpleKind };

/// A ring; `vars` are its variable names when the checker knows them (from a ring
/// literal, a quotient of a known ring, or a restored binding), otherwise null.
export type RingType = { readonly kind: "Ring"; readonly vars: readonly string[] | null };

export type ListType = { readonly kind: "List"; readonly item: Type };

/// A record; `fields` null when the field names are not known statically.
export type RecordType = {
  readonly kind: "Record";
  readonly fields: Readonly<Record<string, Type>> | null;
};

/// A function value (a lambda); `params` null when the arity is unknown.
export type FunctionType = {
  readonly kind: "Function";
  readonly params: readonly Type[] | null;
  readonly result: Type;
};

/// A family of examples for experiments (notation.md §11); `member` is the type of its
/// members: Ideal for the generated families, whatever the List held for `family(xs)`.
export type FamilyType = { readonly kind: "Family"; readonly member: Type };

/// A table from `sweep`: one row per family member; `columns` as the probe's Record.
export type TableType = {
  readonly kind: "Table";
  readonly columns: Readonly<Record<string, Type>> | null;
};

/// One of several types (e.g. "Number" = Int or Rat; a value that may be `none`).
export type UnionType = { readonly kind: "Union"; readonly options: readonly Type[] };

/// A type variable, used only inside the signature table (`sum(xs: List<T>) -> T`).
export type VarType = { readonly kind: "Var"; readonly name: string };

export type Type = SimpleType | RingType | ListType | RecordType | FunctionType | FamilyType | TableType | UnionType | VarType;

export type TypeKind = Type["kind"];

const simple = <K extends SimpleKind>(kind: K): { readonly kind: K } => ({ kind });

/// Constructors and the constant types.
export const T = {
  Int: simple("Int"),
  Rat: simple("Rat"),
  Bool: simple("Bool"),
  Str: simple("Str"),
  Field: simple("Field"),
  Poly: simple("Poly"),
  Ideal: simple("Ideal"),
  Matrix: simple("Matrix"),
  Module: simple("Module"),
  Complex: simple("Complex"),
  BettiTable: simple("BettiTable"),
  HilbertSeries: simple("HilbertSeries"),
  Series: simple("Series"),
  Experiment: simple("Experiment"),
  Family: { kind: "Family", member: { kind: "Ideal" } } as FamilyType,
  family: (member: Type): FamilyType => ({ kind: "Family", member }),
  None: simple("None"),
  Any: simple("Any"),
  Ring: { kind: "Ring", vars: null } as RingType,
  ring: (vars: readonly string[] | null): RingType => ({ kind: "Ring", vars }),
  list: (item: Type): ListType => ({ kind: "List", item }),
  record: (fields: Record<string, Type> | null): RecordType => ({ kind: "Record", fields }),
  fn: (params: readonly Type[] | null, result: Type): FunctionType => ({
    kind: "Function",
    params,
    result,
  }),
  table: (columns: Record<string, Type> | null): TableType => ({ kind: "Table", columns }),
  union: (...options: Type[]): Type => makeUnion(options),
  v: (name: string): VarType => ({ kind: "Var", name }),
} as const;

/// Int or Rat.
export const NumberType: Type = T.union(T.Int, T.Rat);
/// Where a Module is expected a quotient ring A/I also serves (the cyclic A-module).
export const ModuleLike: Type = T.union(T.Module, T.Ring);
/// A value that may be `none`.
export const orNone = (t: Type): Type => T.union(t, T.None);

/// Flattens nested unions, drops duplicates, and collapses a one-member union.
export function makeUnion(options: readonly Type[]): Type {
  const flat: Type[] = [];
  for (const o of options) {
    const members = o.kind === "Union" ? o.options : [o];
    for (const m of members) {
      if (m.kind === "Any") return T.Any;
      if (!flat.some((f) => sameType(f, m))) flat.push(m);
    }
  }
  if (flat.length === 1) return flat[0];
  return { kind: "Union", options: flat };
}

/// Structural equality; a ring's variable names do not take part.
export function sameType(a: Type, b: Type): boolean {
  if (a.kind !== b.kind) return false;
  switch (a.kind) {
    case "List":
      return sameType(a.item, (b as ListType).item);
    case "Family":
      return sameType(a.member, (b as FamilyType).member);
    case "Record":
    case "Table": {
      const fa = a.kind === "Record" ? a.fields : a.columns;
      const fb = b.kind === "Record" ? (b as RecordType).fields : (b as TableType).columns;
      if (fa === null || fb === null) return fa === fb;
      const ka = Object.keys(fa);
      return ka.length === Object.keys(fb).length && ka.every((k) => k in fb && sameType(fa[k], fb[k]));
    }
    case "Function": {
      const fb = b as FunctionType;
      if ((a.params === null) !== (fb.params === null)) return false;
      if (a.params && fb.params) {
        if (a.params.length !== fb.params.length) return false;
        if (!a.params.every((p, i) => sameType(p, fb.params![i]))) return false;
      }
      return sameType(a.result, fb.result);
    }
    case "Union": {
      const ub = b as UnionType;
      return a.options.length === ub.options.length && a.options.every((o) => ub.options.some((p) => sameType(o, p)));
    }
    case "Var":
      return a.name === (b as VarType).name;
    default:
      return true;
  }
}

/// Whether a value of type `from` may be used where `to` is expected, with the
/// notation's implicit conversions: Int → Rat → Poly (constants), a Ring where a
/// Module is expected (quotient ring as cyclic module), a List of ideals where a
/// Family is expected, `T or None` where T is expected. Any goes everywhere (the
/// check is left to run time).
export function isAssignable(from: Type, to: Type): boolean {
  if (from.kind === "Any" || to.kind === "Any" || to.kind === "Var") return true;
  // A value that may be `none` is accepted where its other type is expected; the
  // evaluator reports `none` at run time (there is no flow typing to rule it out).
  if (from.kind === "Union") {
    const real = to.kind === "None" ? from.options : from.options.filter((o) => o.kind !== "None");
    return real.length > 0 && real.every((o) => isAssignable(o, to));
  }
  if (to.kind === "Union") return to.options.some((o) => isAssignable(from, o));
  switch (to.kind) {
    case "Rat":
      return from.kind === "Int" || from.kind === "Rat";
    case "Poly":
      return from.kind === "Int" || from.kind === "Rat" || from.kind === "Poly";
    case "Module":
      return from.kind === "Module" || from.kind === "Ring";
    case "Family":
      // a List of rings, ideals or modules serves as the Family of its items
      if (from.kind === "Family") return isAssignable(from.member, to.member);
      return from.kind === "List" && isFamilyMember(from.item) && isAssignable(from.item, to.member);
    case "List":
      return from.kind === "List" && isAssignable(from.item, to.item);
    case "Record":
      if (from.kind !== "Record") return false;
      if (to.fields === null || from.fields === null) return true;
      return Object.entries(to.fields).every(([k, t]) => k in from.fields! && isAssignable(from.fields![k], t));
    case "Table":
      return from.kind === "Table";
    case "Function":
      if (from.kind !== "Function") return false;
      return to.params === null || from.params === null || to.params.length === from.params.length;
    default:
      return from.kind === to.kind;
  }
}

/// What a Family may hold: rings, ideals, modules (or a type known only at run time).
export function isFamilyMember(t: Type): boolean {
  if (t.kind === "Union") return t.options.every(isFamilyMember);
  return t.kind === "Ring" || t.kind === "Ideal" || t.kind === "Module" || t.kind === "Any" || t.kind === "Var";
}

/// The least type covering both (for `if` branches and list items); Any when unrelated.
export function joinTypes(a: Type, b: Type): Type {
  if (isAssignable(a, b)) return b.kind === "Any" ? a : b;
  if (isAssignable(b, a)) return a;
  if (a.kind === "None" || b.kind === "None") return makeUnion([a, b]);
  if (a.kind === "List" && b.kind === "List") return T.list(joinTypes(a.item, b.item));
  return makeUnion([a, b]);
}

/// Human-readable type name, as used in error messages and the reference.
export function typeToString(t: Type): string {
  switch (t.kind) {
    case "List":
      return `List<${typeToString(t.item)}>`;
    case "Record":
      return t.fields === null
        ? "Record"
        : `Record{${Object.entries(t.fields)
            .map(([k, v]) => `${k}: ${typeToString(v)}`)
            .join(", ")}}`;
    case "Table":
      return "Table";
    case "Family":
      // the families of notation.md §11 hold ideals; only other members are spelled out
      return t.member.kind === "Ideal" ? "Family" : `Family<${typeToString(t.member)}>`;
    case "Function":
      return t.params === null ? "Function" : `Function(${t.params.map(typeToString).join(", ")}) -> ${typeToString(t.result)}`;
    case "Union":
      return t.options.map(typeToString).join(" or ");
    case "Var":
      return t.name;
    default:
      return t.kind;
  }
}

/// "a Ring", "an Ideal", "an Int or Rat" — for messages in the form of notation.md §8.
export function withArticle(t: Type): string {
  const s = typeToString(t);
  return (/^[AEIOU]/.test(s) ? "an " : "a ") + s;
}
