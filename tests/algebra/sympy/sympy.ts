import { spawnSync } from "node:child_process";
import path from "node:path";

/// One SymPy system: variables, generators in our text syntax, SymPy's order name, modulus.
export interface SympySystem {
  vars: string[];
  gens: string[];
  order: "grevlex" | "lex" | "grlex";
  modulus: number | null;
}

/// A system for the product order lex on the first variable, then grevlex on the others
/// (groebner_batch.py): on forms of one degree, Lazard's order for a local degree order.
export type LazardSystem = Omit<SympySystem, "order"> & { order: "lazard" };

export type SympyTerm = [string, string, number[]];
export type SympyResult = { basis: SympyTerm[][]; seconds: number } | { error: string };

export const sympyPython = (): string => process.env.RINGSIDE_SYMPY_PYTHON || "/usr/bin/python3";

/// Fails with a clear message when Python or SymPy is missing.
export function assertSympyAvailable(): void {
  const py = sympyPython();
  const r = spawnSync(py, ["-c", "import sympy; print(sympy.__version__)"], { encoding: "utf8" });
  if (r.status !== 0) {
    throw new Error(
      `SymPy is required for this cross-check but "${py} -c 'import sympy'" failed ` +
        `(${(r.stderr || String(r.error ?? "")).trim()}). Install Debian's python3-sympy ` +
        `(apt-get install -y python3-sympy) or set RINGSIDE_SYMPY_PYTHON.`,
    );
  }
}

/// Runs the whole batch through one Python process.
export function runSympyBatch(systems: (SympySystem | LazardSystem)[], timeoutMs = 300_000): SympyResult[] {
  const script = path.join(__dirname, "groebner_batch.py");
  const r = spawnSync(sympyPython(), [script], {
    input: JSON.stringify(systems),
    encoding: "utf8",
    timeout: timeoutMs,
    maxBuffer: 256 * 1024 * 1024,
  });
  if (r.status !== 0) throw new Error(`SymPy batch failed (status ${r.status}): ${r.stderr || r.error}`);
  return JSON.parse(r.stdout) as SympyResult[];
}
