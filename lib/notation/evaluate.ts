/// Evaluation of one cell: a pure function of (source, bindings, options) that a worker
/// thread, the CLI or a test can run. The program is checked as a whole first; then its
/// statements run one by one, each reported through `onEvent` as it finishes.
import type { Lambda, Span, Statement } from "../../grammar/ast";
import type { Analysis, Env } from "../../grammar/analysis";
import { analyze, parse } from "../../grammar/index";
import { typeToString, type Type } from "../../grammar/types";
import type { ComputeOptions, ProgressInfo } from "../algebra/index";
import { EvalError, asEvalError, errorJson, spanJson } from "./errors";
import { DecodeError, decodeValue, encodeValue, type ErrorJson, type FunctionJson, type SpanJson, type ValueJson } from "./json";
import type { Frame, Session } from "./context";
import { Interpreter } from "./interpreter";
import { DEFAULT_LIMITS, type EvalLimits } from "./limits";
import { RingRegistry } from "./rings";
import { Scope } from "./scope";
import { valueType } from "./value-type";
import type { FunctionValue, RingValue, Value } from "./values";

/// A named object saved by an earlier cell, as stored: its §9 JSON value.
export interface Binding {
  readonly name: string;
  readonly value: unknown;
}

export interface EvaluateOptions {
  readonly signal?: AbortSignal;
  readonly onEvent?: (event: EvalEvent) => void;
  /// the name of the binding that is the current ring when the cell starts
  readonly currentRing?: string | null;
  readonly limits?: Partial<EvalLimits>;
  /// bounds passed to the engine's long computations
  readonly engineLimits?: ComputeOptions["limits"];
  /// set by the server only: lets `sweep` hand a sweep to a background experiment
  readonly experiments?: Session["experiments"];
}

/// A binding made by this cell: what the database saves as a named object.
export interface NamedObject {
  readonly name: string;
  /// the checker's type, e.g. "Ring", "List<Int>"
  readonly type: string;
  readonly value: ValueJson;
  /// the source text of the defining statement
  readonly source: string;
  readonly statement: number;
}

export type EvalEvent =
  | { readonly event: "checked"; readonly statements: number; readonly errors: readonly ErrorJson[] }
  | ({ readonly event: "progress"; readonly index: number } & ProgressInfo)
  | { readonly event: "partial"; readonly index: number; readonly item: number; readonly value: ValueJson }
  | {
      readonly event: "result";
      readonly index: number;
      readonly span: SpanJson;
      readonly value: ValueJson;
      /// the name bound, for a definition
      readonly name: string | null;
    }
  | { readonly event: "error"; readonly index: number | null; readonly error: ErrorJson };

export interface EvalOutcome {
  readonly status: "ok" | "error" | "cancelled";
  readonly results: readonly Extract<EvalEvent, { event: "result" }>[];
  /// bindings made by this cell, the last definition of each name
  readonly objects: readonly NamedObject[];
  readonly error: ErrorJson | null;
  /// every problem the checker found (empty when the program checked)
  readonly diagnostics: readonly ErrorJson[];
  /// the current ring's binding name after the cell
  readonly currentRing: string | null;
}

const START: Span = { from: { line: 1, col: 1, offset: 0 }, to: { line: 1, col: 1, offset: 0 } };

/// Rebuilds a restored closure by parsing its source.
function lambdaOf(json: FunctionJson): Lambda {
  const { program, errors } = parse(json.text);
  const stmt = program.statements[0];
  if (errors.length > 0 || program.statements.length !== 1 || stmt.kind !== "ExprStatement" || stmt.expr.kind !== "Lambda") {
    throw new DecodeError(`Function: "${json.text}" is not the source of a function`);
  }
  return stmt.expr;
}

function restore(bindings: readonly Binding[], interp: Interpreter): Map<string, Value> {
  const out = new Map<string, Value>();
  const ctx = {
    rings: interp.session.rings,
    makeFunction: (json: FunctionJson, captures: Map<string, Value>, ring: RingValue | null): FunctionValue =>
      interp.closure(lambdaOf(json), captures, ring, json.text, json.text),
  };
  for (const b of bindings) {
    try {
      out.set(b.name, decodeValue(b.value, ctx));
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      throw new EvalError("runtime", `the saved object ${b.name} cannot be restored: ${why}`, START);
    }
  }
  return out;
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function evaluate(source: string, bindings: readonly Binding[], options: EvaluateOptions = {}): Promise<EvalOutcome> {
  const emit = options.onEvent ?? (() => {});
  let index = 0;
  let partialItem = 0;
  const compute: ComputeOptions = {
    ...(options.signal ? { signal: options.signal } : {}),
    ...(options.engineLimits ? { limits: options.engineLimits } : {}),
    progress: (p) => emit({ event: "progress", index, ...p }),
  };
  const session: Session = {
    rings: new RingRegistry(),
    globals: new Map(),
    current: null,
    compute,
    limits: { ...DEFAULT_LIMITS, ...options.limits },
    analysis: null,
    partial: (value) => emit({ event: "partial", index, item: partialItem++, value: encodeValue(value) }),
    ...(options.experiments ? { experiments: options.experiments } : {}),
  };
  const interp = new Interpreter(session);
  const results: Extract<EvalEvent, { event: "result" }>[] = [];
  const objects = new Map<string, NamedObject>();
  let currentName: string | null = null;

  const fail = (e: EvalError, at: number | null, diagnostics: readonly ErrorJson[] = []): EvalOutcome => {
    const error = errorJson(e.kind, e.message, e.span);
    emit({ event: "error", index: at, error });
    return {
      status: e.kind === "cancelled" ? "cancelled" : "error",
      results,
      objects: [...objects.values()],
      error,
      diagnostics,
      currentRing: currentName,
    };
  };

  let restored: Map<string, Value>;
  try {
    restored = restore(bindings, interp);
  } catch (e) {
    return fail(asEvalError(e, START), null);
  }
  for (const [k, v] of restored) session.globals.set(k, v);
  const start = options.currentRing ?? null;
  if (start !== null && restored.get(start)?.type === "Ring") {
    session.current = restored.get(start) as RingValue;
    currentName = start;
  }

  const types: Record<string, Type> = {};
  for (const [k, v] of restored) types[k] = valueType(v);
  const env: Env = { bindings: types, currentRing: currentName };
  const analysis: Analysis = analyze(source, env);
  session.analysis = analysis;
  const diagnostics = analysis.errors.map((d) => errorJson(d.kind, d.message, d.span));
  emit({ event: "checked", statements: analysis.program.statements.length, errors: diagnostics });
  if (analysis.errors.length > 0) {
    const first = analysis.errors[0];
    return fail(new EvalError(first.kind, first.message, first.span), null, diagnostics);
  }

  const frame = (): Frame => ({ scope: Scope.EMPTY, ring: session.current, depth: 0, source });
  for (const stmt of analysis.program.statements) {
    await nextTurn();
    try {
      if (options.signal?.aborted) throw new EvalError("cancelled", "evaluation cancelled", stmt.span);
      const { value, name } = run(stmt);
      const encoded = encodeValue(value);
      if (name !== null) {
        objects.set(name, {
          name,
          type: typeToString(valueType(value)),
          value: encoded,
          source: source.slice(stmt.span.from.offset, stmt.span.to.offset),
          statement: index,
        });
      }
      const result = { event: "result" as const, index, span: spanJson(stmt.span), value: encoded, name };
      results.push(result);
      emit(result);
    } catch (e) {
      const err = asEvalError(e, stmt.span);
      return fail(options.signal?.aborted ? new EvalError("cancelled", "evaluation cancelled", err.span) : err, index);
    }
    index++;
  }
  return { status: "ok", results, objects: [...objects.values()], error: null, diagnostics: [], currentRing: currentName };

  function run(stmt: Statement): { value: Value; name: string | null } {
    switch (stmt.kind) {
      case "Define": {
        const value = interp.eval(stmt.value, frame());
        session.globals.set(stmt.name.name, value);
        if (value.type === "Ring") {
          session.current = value;
          currentName = stmt.name.name;
        } else if (currentName === stmt.name.name) {
          currentName = null;
        }
        return { value, name: stmt.name.name };
      }
      case "Use": {
        const value = session.globals.get(stmt.name.name);
        if (value?.type !== "Ring") throw new EvalError("runtime", `${stmt.name.name} is not a ring`, stmt.name.span);
        session.current = value;
        currentName = stmt.name.name;
        return { value, name: null };
      }
      case "ExprStatement": {
        const e = stmt.expr;
        if (e.kind === "Comprehension") {
          const items = interp.comprehension(e, frame(), (v, item) => emit({ event: "partial", index, item, value: encodeValue(v) }));
          return { value: { type: "List", items }, name: null };
        }
        return { value: interp.eval(e, frame()), name: null };
      }
    }
  }
}
