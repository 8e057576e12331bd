/// What the checker takes and gives: the environment of bindings and the analysis of
/// a program (AST, errors, the type of every expression, how each name resolved).
import type { Expr, Identifier, Program, Span, Subscript } from "./ast";
import type { Type } from "./types";

/// Bindings visible to a program: names from earlier cells (restored by the evaluator)
/// with their types, and the name of the current ring (a binding of type Ring whose
/// `vars` are known), or null when there is none.
export interface Env {
  readonly bindings: Readonly<Record<string, Type>>;
  readonly currentRing: string | null;
}

export const EMPTY_ENV: Env = { bindings: {}, currentRing: null };

/// A reported problem. Spans are 1-based line:col ranges, `to` exclusive.
export interface Diagnostic {
  readonly kind: "parse" | "type";
  readonly message: string;
  readonly span: Span;
}

/// How an Identifier in an expression was resolved. Lookup order: locals (lambda
/// parameters, comprehension variables), then variables of the current ring, then
/// session bindings, then predefined constants.
export type NameResolution =
  | { readonly kind: "local" }
  | { readonly kind: "variable"; readonly ring: string; readonly index: number }
  | { readonly kind: "binding" }
  | { readonly kind: "constant" }
  | { readonly kind: "function" }
  | { readonly kind: "unknown" };

/// A ring literal `K[x1..x3, y; …]` resolved: the variable names after expanding
/// ranges, the order and the degrees (null when not given).
export interface RingLiteralInfo {
  readonly kind: "ring";
  readonly vars: readonly string[];
  readonly order:
    | { readonly kind: "grevlex" }
    | { readonly kind: "lex" }
    | { readonly kind: "glex" }
    | { readonly kind: "weights"; readonly weights: readonly number[] };
  readonly degrees: readonly number[] | null;
}

export type SubscriptInfo = RingLiteralInfo | { readonly kind: "index" };

export interface Analysis {
  readonly program: Program;
  /// Parse errors first, then type errors, each group in source order.
  readonly errors: readonly Diagnostic[];
  /// The checked type of every expression node.
  readonly types: ReadonlyMap<Expr, Type>;
  readonly names: ReadonlyMap<Identifier, NameResolution>;
  readonly subscripts: ReadonlyMap<Subscript, SubscriptInfo>;
  /// The environment before each statement (index-aligned with program.statements)
  /// and after the last one.
  readonly envs: readonly Env[];
  readonly finalEnv: Env;
}
