/// Where the cursor is, for completion: after `expr.` (a property), inside the argument
/// list of a function with named options, after `;` inside ring brackets, or at a plain
/// name. Pure text analysis, so it is unit-tested without an editor.

export type CompletionPlace =
  /// `R.va|`: `dot` is the offset of the `.`, `from` where the typed word starts.
  | { readonly kind: "property"; readonly dot: number; readonly from: number }
  /// `resolve(M, le|`: the function whose options apply.
  | { readonly kind: "option"; readonly fn: string; readonly from: number }
  /// `Q[x, y; or|`
  | { readonly kind: "ring-option"; readonly from: number }
  | { readonly kind: "name"; readonly from: number };

const WORD_CHAR = /[A-Za-z0-9_']/;
const CLOSERS: Record<string, string> = { ")": "(", "]": "[", "}": "{" };

/// Whether the `<` at `i` opens an ideal: it stands where an operand starts (after an
/// operator, an opening bracket, a comma or at the start), not after one.
function opensIdeal(source: string, i: number): boolean {
  if (source[i + 1] === "=") return false;
  let j = i;
  while (j > 0 && /\s/.test(source[j - 1])) j--;
  return j === 0 || /[([{,=/+\-*:&^;]/.test(source[j - 1]);
}

/// The innermost bracket still open before `pos` (ideal brackets included), its
/// offset, and whether a `;` appears directly inside it after it.
function enclosingOpen(source: string, pos: number): { char: string; at: number; semicolon: boolean } | null {
  const stack: string[] = [];
  let semicolon = false;
  for (let i = pos - 1; i >= 0; i--) {
    const c = source[i];
    if (c === "\n" && stack.length === 0 && !insideAnyBracket(source, i)) return null;
    if (c in CLOSERS || c === "⟩") stack.push(c === "⟩" ? "<" : CLOSERS[c]);
    else if (c === ">" && source[i - 1] !== "-" && source[i + 1] !== "=") stack.push("<");
    else if (c === "<" || c === "⟨") {
      if (stack[stack.length - 1] === "<") stack.pop();
      else if (c === "⟨" || opensIdeal(source, i)) {
        if (stack.length === 0) return { char: "<", at: i, semicolon };
      }
    } else if (c === "(" || c === "[" || c === "{") {
      if (stack.length === 0) return { char: c, at: i, semicolon };
      stack.pop();
    } else if (c === ";" && stack.length === 0) semicolon = true;
  }
  return null;
}

/// Whether offset `at` lies inside some open bracket (a newline there continues the
/// statement, notation.md §1).
function insideAnyBracket(source: string, at: number): boolean {
  let depth = 0;
  for (let i = 0; i < at; i++) {
    const c = source[i];
    if (c === "(" || c === "[" || c === "{") depth++;
    else if ((c === ")" || c === "]" || c === "}") && depth > 0) depth--;
    else if (c === "#") while (i < at && source[i] !== "\n") i++;
  }
  return depth > 0;
}

/// Classifies the cursor position `pos` in `source`.
export function completionPlace(source: string, pos: number): CompletionPlace {
  let from = pos;
  while (from > 0 && WORD_CHAR.test(source[from - 1])) from--;
  // A word must start with a letter; `2x` is not a name being typed.
  if (from < pos && !/[A-Za-z]/.test(source[from])) from = pos;
  if (source[from - 1] === "." && source[from - 2] !== ".") return { kind: "property", dot: from - 1, from };

  let before = from;
  while (before > 0 && /[ \t]/.test(source[before - 1])) before--;
  const open = enclosingOpen(source, from);
  if (open && open.char === "[" && open.semicolon) {
    const prev = source[before - 1];
    if (prev === ";" || prev === ",") return { kind: "ring-option", from };
  }
  if (open && open.char === "(") {
    const prev = source[before - 1];
    let end = open.at;
    while (end > 0 && /[ \t]/.test(source[end - 1])) end--;
    let start = end;
    while (start > 0 && WORD_CHAR.test(source[start - 1])) start--;
    const fn = source.slice(start, end);
    if ((prev === "," || prev === "(") && /^[A-Za-z]/.test(fn)) return { kind: "option", fn, from };
  }
  return { kind: "name", from };
}
