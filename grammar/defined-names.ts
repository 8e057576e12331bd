/// The names a program's top-level definitions bind (`name := …`), found by parsing alone:
/// cheap and never throwing, for the server's check that a cell would not replace names
/// someone else defined (lib/sessions/redefine-guard.ts).
import { parse } from "./parser";

export function definedNames(source: string): string[] {
  const names = new Set<string>();
  for (const s of parse(source).program.statements) if (s.kind === "Define") names.add(s.name.name);
  return [...names];
}
