/// The checker the editor uses for diagnostics and completion: the grammar's `analyze`
/// when the grammar provides it; until then the parser alone (parse errors only, no
/// types), so the input still underlines mistakes before anything runs.
import type { Analysis, Env } from "@/grammar/analysis";
import { parse } from "@/grammar/parser";

/// Parses and checks `source` against the session's environment.
export function checkNotation(source: string, env: Env): Analysis {
  const parsed = parse(source);
  return {
    program: parsed.program,
    errors: parsed.errors,
    types: new Map(),
    names: new Map(),
    subscripts: new Map(),
    envs: [],
    finalEnv: env,
  };
}
