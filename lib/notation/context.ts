/// The types every part of the evaluator shares: the session, where evaluation is, and what
/// a built-in function or an operator may ask of the evaluator. They live apart from
/// interpreter.ts so that builtins and operators, which the interpreter calls, need not
/// import it back (the evaluator's import graph stays acyclic).
import type { Span } from "../../grammar/ast";
import type { Analysis } from "../../grammar/analysis";
import type { ComputeOptions } from "../algebra/index";
import type { EvalLimits } from "./limits";
import type { RingRegistry } from "./rings";
import type { Scope } from "./scope";
import type { FamilyValue, FunctionValue, RingValue, Value } from "./values";

/// Everything one evaluation shares: rings, session bindings, the current ring, the
/// engine's compute options (signal, progress) and the limits.
export interface Session {
  readonly rings: RingRegistry;
  readonly globals: Map<string, Value>;
  current: RingValue | null;
  readonly compute: ComputeOptions;
  readonly limits: EvalLimits;
  /// null for code that was not checked in this evaluation (a restored lambda)
  analysis: Analysis | null;
  /// streams a piece of the running statement's value (e.g. one finished Betti column)
  readonly partial?: (value: Value) => void;
  /// present when sweeps may become background experiments (set by the server, never by
  /// the CLI): families longer than inlineMax, or `background = true`, go to `start`
  readonly experiments?: {
    readonly inlineMax: number;
    start(family: FamilyValue, probe: FunctionValue, span: Span): Value;
  };
}

/// Where evaluation is: the scope of locals and the ring literals are read in.
export interface Frame {
  readonly scope: Scope;
  readonly ring: RingValue | null;
  readonly depth: number;
  /// the text the AST's offsets refer to (the cell, or a restored lambda's source)
  readonly source: string;
}

/// What built-in functions and operators use of the evaluator (the Interpreter implements it).
export interface Evaluator {
  readonly session: Session;
  /// the i-th variable of a ring as a Poly value
  variable(ring: RingValue, i: number): Value;
  /// calls a Function value
  applyFunction(fn: Value, args: Value[], span: Span, f: Frame): Value;
  /// the notation's equality of two values
  equal(a: Value, b: Value, span: Span): boolean;
  /// The span of the call being evaluated when its value is read only for Betti numbers
  /// (resolve(…).betti, .ranks, .length, .complete): such a resolve keeps no differentials.
  readonly bettiOnlyCall?: Span | null;
}

/// A call of a built-in function, method or property.
export interface CallContext {
  readonly interp: Evaluator;
  readonly frame: Frame;
  readonly span: Span;
  readonly argSpans: readonly Span[];
  readonly named: ReadonlyMap<string, Value>;
}

/// An application of an operator.
export interface OpContext {
  readonly interp: Evaluator;
  readonly frame: Frame;
  readonly span: Span;
  /// spans of the operands (the left one absent for prefix operators)
  readonly leftSpan: Span;
  readonly rightSpan: Span;
}
