/// The checker's type of a runtime value, so restored bindings type-check in later cells
/// and the evaluator can pick the signature row a value matches.
import { T, joinTypes, type Type } from "../../grammar/types";
import type { Value } from "./values";

export function valueType(v: Value): Type {
  switch (v.type) {
    case "Ring":
      return T.ring(v.poly.vars);
    case "List":
      return T.list(v.items.length === 0 ? T.Any : v.items.map(valueType).reduce(joinTypes));
    case "Record":
      return T.record(Object.fromEntries([...v.fields].map(([k, x]) => [k, valueType(x)])));
    case "Function":
      return T.fn(
        v.params.map(() => T.Any),
        T.Any,
      );
    case "Table":
      return T.table(v.columns.length ? Object.fromEntries(v.columns.map((c) => [c, T.Any])) : null);
    case "Family":
      return T.family(v.members.length === 0 ? T.Ideal : v.members.map(valueType).reduce(joinTypes));
    default:
      return T[v.type];
  }
}
