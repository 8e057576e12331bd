/// The notation's front end: lexing, parsing and type checking, for the evaluator,
/// the CLI and the editor. Import from here.
import type { Analysis, Env } from "./analysis";
import { EMPTY_ENV } from "./analysis";
import { check as checkParsed } from "./checker";
import { tokenizeWith, type HighlightToken } from "./lexer";
import { parse } from "./parser";
import { makeLocator } from "./positions";
import { lookupFunction } from "./signatures";

/// Parses and checks a program against an environment. Fast enough for every
/// keystroke; never throws (an internal failure comes back as an error covering the
/// whole source).
export function analyze(source: string, env: Env = EMPTY_ENV): Analysis {
  try {
    return checkParsed(parse(source), env, source);
  } catch (err) {
    const loc = makeLocator(source);
    const span = { from: loc.at(0), to: loc.at(source.length) };
    return {
      program: { kind: "Program", statements: [], span },
      errors: [
        {
          kind: "type",
          message: `Ringside could not check this cell (a defect of Ringside, not of your input: ${String(err).replace(/^\w+: /, "")}); please report it`,
          span,
        },
      ],
      types: new Map(),
      names: new Map(),
      subscripts: new Map(),
      envs: [],
      finalEnv: env,
    };
  }
}

/// What the evaluator calls before running anything: the analysis, and whether the
/// program may run (no errors at all).
export function check(source: string, env: Env = EMPTY_ENV): Analysis & { ok: boolean } {
  const a = analyze(source, env);
  return { ...a, ok: a.errors.length === 0 };
}

/// The highlighter's tokens (same lexer as the parser).
export function tokenize(source: string): HighlightToken[] {
  return tokenizeWith(source, (name) => lookupFunction(name) !== undefined);
}

export { parse } from "./parser";
export { formatError, formatSpan } from "./positions";
export { constValue, MAX_LITERAL_EXPONENT } from "./checker";
export { ringLiteralInfo, MAX_VARIABLES } from "./ring-literal";
export * from "./analysis";
export * from "./signatures";
export * from "./types";
export type * from "./ast";
export { KEYWORD_NAMES } from "./lexer";
export type { HighlightToken, TokenCategory } from "./lexer";
