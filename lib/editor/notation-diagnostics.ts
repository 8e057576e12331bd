/// Live diagnostics from the parser and checker: every error of `analyze` underlined,
/// with its message on hover, before anything runs.
import { linter, type Diagnostic as LintDiagnostic } from "@codemirror/lint";
import type { Extension } from "@codemirror/state";
import type { Analysis, Env } from "@/grammar/analysis";

/// What the diagnostics need: the checker and the session's environment.
export interface NotationDiagnosticsOptions {
  readonly analyze: (source: string, env: Env) => Analysis;
  readonly env: () => Env;
}

/// The lint diagnostics of a source text, clamped to the document.
export function diagnose(options: NotationDiagnosticsOptions, source: string): LintDiagnostic[] {
  if (source.trim() === "") return [];
  const analysis = options.analyze(source, options.env());
  return analysis.errors.map((e) => {
    const from = Math.min(Math.max(e.span.from.offset, 0), source.length);
    const to = Math.min(Math.max(e.span.to.offset, from), source.length);
    return {
      from,
      to: to === from && to < source.length ? to + 1 : to,
      severity: "error",
      source: e.kind === "parse" ? "parse error" : "type error",
      message: `${e.span.from.line}:${e.span.from.col}: ${e.message}`,
    };
  });
}

/// Underlines parse and type errors as the user types.
export function notationDiagnostics(options: NotationDiagnosticsOptions): Extension {
  return linter((view) => diagnose(options, view.state.doc.toString()), { delay: 200 });
}
