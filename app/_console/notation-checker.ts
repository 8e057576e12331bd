/// The checker the editor uses for diagnostics and completion: the grammar's own
/// `analyze` (parser and type checker), run in the browser on every change.
import { analyze } from "@/grammar";
import type { Analysis, Env } from "@/grammar/analysis";

/// Parses and checks `source` against the session's environment.
export function checkNotation(source: string, env: Env): Analysis {
  return analyze(source, env);
}
