/// The identifiers a lambda's body refers to that it does not bind itself: what a
/// closure captures.
import type { Expr, Identifier, Lambda } from "../../grammar/ast";

export function freeNames(lambda: Lambda): Identifier[] {
  const out: Identifier[] = [];
  const walk = (e: Expr, bound: ReadonlySet<string>): void => {
    switch (e.kind) {
      case "Identifier":
        if (!bound.has(e.name)) out.push(e);
        return;
      case "Binary":
        walk(e.left, bound);
        walk(e.right, bound);
        return;
      case "Unary":
        walk(e.operand, bound);
        return;
      case "Range":
        walk(e.from, bound);
        walk(e.to, bound);
        return;
      case "IdealLit":
        e.gens.forEach((g) => walk(g, bound));
        return;
      case "ListLit":
      case "Tuple":
        e.items.forEach((g) => walk(g, bound));
        return;
      case "MatrixLit":
        e.rows.forEach((row) => row.forEach((g) => walk(g, bound)));
        return;
      case "Comprehension": {
        const inner = new Set(bound);
        for (const c of e.clauses) {
          walk(c.source, inner);
          inner.add(c.name.name);
        }
        walk(e.element, inner);
        return;
      }
      case "RecordLit":
        e.fields.forEach((f) => walk(f.value, bound));
        return;
      case "Lambda":
        walk(e.body, new Set([...bound, ...e.params.map((p) => p.name)]));
        return;
      case "If":
        walk(e.cond, bound);
        walk(e.then, bound);
        walk(e.else, bound);
        return;
      case "Call":
        walk(e.callee, bound);
        e.args.forEach((a) => walk(a, bound));
        e.named.forEach((n) => walk(n.value, bound));
        return;
      case "Property":
        walk(e.object, bound);
        return;
      case "Subscript":
        walk(e.object, bound);
        e.items.forEach((a) => walk(a, bound));
        return;
      default:
        return;
    }
  };
  walk(lambda.body, new Set(lambda.params.map((p) => p.name)));
  return out;
}
