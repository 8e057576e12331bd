/// A compact printed form of the AST for golden tests: `(op left right)` and so on,
/// so a test states the tree's shape in one line.
import type * as A from "@/grammar/ast";

export function sx(n: A.Expr | A.Statement): string {
  switch (n.kind) {
    case "Define":
      return `(:= ${n.name.name} ${sx(n.value)})`;
    case "Use":
      return `(use ${n.name.name})`;
    case "ExprStatement":
      return sx(n.expr);
    case "IntLit":
      return n.value.toString();
    case "StrLit":
      return JSON.stringify(n.value);
    case "BoolLit":
      return String(n.value);
    case "Identifier":
      return n.name;
    case "Binary":
      return `(${n.op} ${sx(n.left)} ${sx(n.right)})`;
    case "Unary":
      return `(${n.op === "-" ? "neg" : "not"} ${sx(n.operand)})`;
    case "Range":
      return `(.. ${sx(n.from)} ${sx(n.to)})`;
    case "IdealLit":
      return `(ideal${n.gens.map((g) => " " + sx(g)).join("")})`;
    case "ListLit":
      return `(list${n.items.map((g) => " " + sx(g)).join("")})`;
    case "MatrixLit":
      return `(matrix${n.rows.map((r) => ` (row${r.map((g) => " " + sx(g)).join("")})`).join("")})`;
    case "Comprehension":
      return `(for ${sx(n.element)}${n.clauses.map((c) => ` (in ${c.name.name} ${sx(c.source)})`).join("")})`;
    case "RecordLit":
      return `(record${n.fields.map((f) => ` (${f.name.name} ${sx(f.value)})`).join("")})`;
    case "Tuple":
      return `(tuple${n.items.map((g) => " " + sx(g)).join("")})`;
    case "Lambda":
      return `(fn (${n.params.map((p) => p.name).join(" ")}) ${sx(n.body)})`;
    case "If":
      return `(if ${sx(n.cond)} ${sx(n.then)} ${sx(n.else)})`;
    case "Call":
      return `(call ${sx(n.callee)}${n.args.map((a) => " " + sx(a)).join("")}${n.named.map((a) => ` (= ${a.name.name} ${sx(a.value)})`).join("")})`;
    case "Property":
      return `(. ${sx(n.object)} ${n.name.name})`;
    case "Subscript":
      return `([] ${sx(n.object)}${n.items.map((a) => " " + sx(a)).join("")}${n.options.map((a) => ` (= ${a.name.name} ${sx(a.value)})`).join("")})`;
    case "ErrorExpr":
      return "<error>";
  }
}
