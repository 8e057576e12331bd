/// What every JSON body must satisfy before any schema sees it, whatever the route: bounded
/// nesting, text PostgreSQL can store, numbers that are what they say. Checked once in
/// readJson, so titles, sources, names, sign-up fields and imports all answer 400 with a
/// message naming the place, instead of a 500 from the database or a stack overflow.

import { limitValue } from "../limits";

/// Deeper nesting than any body of ours needs (an imported session's values are about ten
/// levels deep); recursive code anywhere after this point may rely on it. The limit
/// `jsonNesting` of lib/limits.ts.
export const MAX_JSON_DEPTH = limitValue("jsonNesting");

/// Largest integer a JSON number can carry exactly (2⁵³ − 1); a bigger one would be rounded
/// silently, so it is refused rather than stored as a different number.
export const MAX_EXACT_INTEGER = Number.MAX_SAFE_INTEGER;

/// PostgreSQL's `integer` column (int4) bounds, for schema fields stored in one.
export const INT4_MAX = 2_147_483_647;

/// Scans the raw text (before JSON.parse, so an absurdly deep body costs one linear pass
/// and no recursion) and reports where nesting first exceeds the limit `jsonNesting`.
export function nestingProblem(text: string, maxDepth = MAX_JSON_DEPTH): string | null {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) {
      inString = true;
    } else if (c === 0x5b || c === 0x7b) {
      depth++;
      if (depth > maxDepth)
        return `The body nests arrays and objects more than ${maxDepth} levels deep (at character ${i + 1}; limit jsonNesting).`;
    } else if (c === 0x5d || c === 0x7d) {
      depth--;
    }
  }
  return null;
}

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/// Why a string cannot be stored as text, or null.
export function textProblem(s: string): string | null {
  if (s.includes("\u0000")) return "contains a NUL character (U+0000), which text may not hold";
  if (LONE_SURROGATE.test(s)) return "contains a lone UTF-16 surrogate (not a Unicode character)";
  return null;
}

/// Walks a parsed JSON value without recursion and reports the first string (key or value)
/// or number that cannot be kept as it is: { path, message } or null.
export function valueProblem(root: unknown): { path: string; message: string } | null {
  const stack: { value: unknown; path: (string | number)[] }[] = [{ value: root, path: [] }];
  const where = (path: (string | number)[]) => (path.length > 0 ? path.join(".") : "(body)");
  while (stack.length > 0) {
    const { value, path } = stack.pop()!;
    if (typeof value === "string") {
      const why = textProblem(value);
      if (why) return { path: where(path), message: why };
    } else if (typeof value === "number") {
      if (!Number.isFinite(value)) return { path: where(path), message: "is a number too large to represent" };
      if (Number.isInteger(value) && Math.abs(value) > MAX_EXACT_INTEGER) {
        return { path: where(path), message: `is an integer beyond ±${MAX_EXACT_INTEGER}, which JSON cannot carry exactly` };
      }
    } else if (Array.isArray(value)) {
      for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], path: [...path, i] });
    } else if (value !== null && typeof value === "object") {
      for (const [k, v] of Object.entries(value)) {
        const why = textProblem(k);
        if (why) return { path: where([...path, printableKey(k)]), message: `has a key that ${why}` };
        stack.push({ value: v, path: [...path, k] });
      }
    }
  }
  return null;
}

/// A key fit to show in a message: NUL and surrogate code units become "?".
function printableKey(k: string): string {
  return Array.from(k, (c) => {
    const code = c.charCodeAt(0);
    return code === 0 || (code >= 0xd800 && code <= 0xdfff && c.length === 1) ? "?" : c;
  }).join("");
}
