/// The notation's syntax tree, produced by `parse` (grammar/parser.ts) and read by the
/// checker and the evaluator. Every node carries its source span.

/// A place in the source: 1-based line and column (columns count UTF-16 code units),
/// 0-based offset.
export interface Position {
  readonly line: number;
  readonly col: number;
  readonly offset: number;
}

/// A source range; `to` is the position just after the last character (exclusive),
/// so `x` alone at the start of a line spans 1:1-1:2.
export interface Span {
  readonly from: Position;
  readonly to: Position;
}

/// A name at a binding or naming site (definition, `use`, lambda parameter,
/// comprehension variable, record field, property, named argument).
export interface Name {
  readonly kind: "Name";
  readonly name: string;
  readonly span: Span;
}

export interface Program {
  readonly kind: "Program";
  readonly statements: readonly Statement[];
  readonly span: Span;
}

export type Statement = Define | Use | ExprStatement;

/// `name := value`
export interface Define {
  readonly kind: "Define";
  readonly name: Name;
  readonly value: Expr;
  readonly span: Span;
}

/// `use R`
export interface Use {
  readonly kind: "Use";
  readonly name: Name;
  readonly span: Span;
}

/// An expression statement: evaluated and shown.
export interface ExprStatement {
  readonly kind: "ExprStatement";
  readonly expr: Expr;
  readonly span: Span;
}

export type Expr =
  | IntLit
  | StrLit
  | BoolLit
  | Identifier
  | Binary
  | Unary
  | Range
  | IdealLit
  | ListLit
  | MatrixLit
  | Comprehension
  | RecordLit
  | Tuple
  | Lambda
  | If
  | Call
  | Property
  | Subscript
  | ErrorExpr;

export type ExprKind = Expr["kind"];

/// An integer literal, exact. (Rationals are written with `/`: `3/4` is a Binary.)
export interface IntLit {
  readonly kind: "IntLit";
  readonly value: bigint;
  readonly span: Span;
}

/// A string literal; `value` has the escapes `\"` and `\\` resolved.
export interface StrLit {
  readonly kind: "StrLit";
  readonly value: string;
  readonly span: Span;
}

export interface BoolLit {
  readonly kind: "BoolLit";
  readonly value: boolean;
  readonly span: Span;
}

/// A name in an expression: a local (lambda parameter, comprehension variable), a
/// variable of the current ring, a session binding or a predefined name (`Q`, `none`).
/// Which one it is, the checker records in `Analysis.names`.
export interface Identifier {
  readonly kind: "Identifier";
  readonly name: string;
  readonly span: Span;
}

/// Binary operators, after Unicode aliases are mapped (`∩` → `&`, `⊆` → `<=`, `∈` → `in`).
export type BinaryOp = "+" | "-" | "*" | "/" | "^" | "&" | ":" | "==" | "!=" | "<" | "<=" | ">" | ">=" | "in" | "and" | "or";

export interface Binary {
  readonly kind: "Binary";
  readonly op: BinaryOp;
  readonly left: Expr;
  readonly right: Expr;
  /// The operator token's span.
  readonly opSpan: Span;
  readonly span: Span;
}

export type UnaryOp = "-" | "not";

export interface Unary {
  readonly kind: "Unary";
  readonly op: UnaryOp;
  readonly operand: Expr;
  readonly span: Span;
}

/// `a..b`: an inclusive range of integers, or, inside ring brackets, of variable names
/// (`x1..x6`, `a..e`).
export interface Range {
  readonly kind: "Range";
  readonly from: Expr;
  readonly to: Expr;
  readonly span: Span;
}

/// `<f, g, …>` or `⟨f, g, …⟩`, read in the current ring.
export interface IdealLit {
  readonly kind: "IdealLit";
  readonly gens: readonly Expr[];
  readonly span: Span;
}

/// `[a, b, c]`
export interface ListLit {
  readonly kind: "ListLit";
  readonly items: readonly Expr[];
  readonly span: Span;
}

/// `[a, b; c, d]`: rows separated by `;`, read in the current ring.
export interface MatrixLit {
  readonly kind: "MatrixLit";
  readonly rows: readonly (readonly Expr[])[];
  readonly span: Span;
}

/// One `for name in source` clause of a comprehension.
export interface ForClause {
  readonly kind: "ForClause";
  readonly name: Name;
  readonly source: Expr;
  readonly span: Span;
}

/// `[element for p in source]`; several clauses nest left to right.
export interface Comprehension {
  readonly kind: "Comprehension";
  readonly element: Expr;
  readonly clauses: readonly ForClause[];
  readonly span: Span;
}

export interface RecordField {
  readonly kind: "RecordField";
  readonly name: Name;
  readonly value: Expr;
  readonly span: Span;
}

/// `{a: 1, b: x}`
export interface RecordLit {
  readonly kind: "RecordLit";
  readonly fields: readonly RecordField[];
  readonly span: Span;
}

/// `(a, b, …)` with at least two items: only valid as a named option's value
/// (`degrees = (1, 2)`); as lambda parameters it becomes a Lambda.
export interface Tuple {
  readonly kind: "Tuple";
  readonly items: readonly Expr[];
  readonly span: Span;
}

/// `I -> S / I`, `(a, b) -> a + b`, `() -> 1`
export interface Lambda {
  readonly kind: "Lambda";
  readonly params: readonly Name[];
  readonly body: Expr;
  readonly span: Span;
}

/// `if cond then a else b`
export interface If {
  readonly kind: "If";
  readonly cond: Expr;
  readonly then: Expr;
  readonly else: Expr;
  readonly span: Span;
}

/// `name = value` inside a call or after `;` in ring brackets.
export interface NamedArg {
  readonly kind: "NamedArg";
  readonly name: Name;
  readonly value: Expr;
  readonly span: Span;
}

/// `f(a, b, name = v)`. The callee is an Identifier for a built-in function or a
/// function-valued name, a Property for a method (`C.map(i)`, `H.at(d)`), or any
/// other function-valued expression.
export interface Call {
  readonly kind: "Call";
  readonly callee: Expr;
  readonly args: readonly Expr[];
  readonly named: readonly NamedArg[];
  readonly span: Span;
}

/// `object.name`: a property (`R.vars`) or a record field (`r.index`).
export interface Property {
  readonly kind: "Property";
  readonly object: Expr;
  readonly name: Name;
  readonly span: Span;
}

/// `object[items; options]`. When `object` has type Field it is a ring literal
/// (`Q[x, y; order = lex]`: items are variable names or ranges of them); otherwise it
/// is indexing (`xs[i]`, exactly one item, no options). The checker decides from the
/// type of `object` and records it in `Analysis.subscripts`.
export interface Subscript {
  readonly kind: "Subscript";
  readonly object: Expr;
  readonly items: readonly Expr[];
  readonly options: readonly NamedArg[];
  readonly span: Span;
}

/// Stands in for a piece of source the parser could not read (its error is reported).
export interface ErrorExpr {
  readonly kind: "ErrorExpr";
  readonly span: Span;
}

export type Node = Program | Statement | Expr | Name | NamedArg | RecordField | ForClause;
