/// How well a command's label matches what was typed in the palette, in [0, 1]: each typed
/// word must match; a match at the start of a word of the label ranks first ("sh" → "Share
/// session"), then the initials of consecutive words ("ss" → "Share session"), then a run
/// of letters inside a word, and last the typed letters scattered through the label in
/// order. Extra words (keywords, the group) match too, at a lower rank.

/// The starts of the words of `text` (after a space or punctuation, or a lower → upper case step).
function wordStarts(text: string): number[] {
  const starts: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    const prev = i === 0 ? " " : text[i - 1]!;
    const isWordChar = /[\p{L}\p{N}]/u.test(c);
    if (!isWordChar) continue;
    if (!/[\p{L}\p{N}]/u.test(prev) || (/\p{Ll}/u.test(prev) && /\p{Lu}/u.test(c))) starts.push(i);
  }
  return starts;
}

function isSubsequence(needle: string, hay: string): boolean {
  let k = 0;
  for (let i = 0; i < hay.length && k < needle.length; i++) if (hay[i] === needle[k]) k++;
  return k === needle.length;
}

/// The score of one typed word against one text.
function wordScore(token: string, text: string): number {
  const lower = text.toLowerCase();
  const starts = wordStarts(text);
  if (starts.some((s) => lower.startsWith(token, s))) return starts[0] !== undefined && lower.startsWith(token, starts[0]) ? 1 : 0.9;
  const initials = starts.map((s) => lower[s]).join("");
  if (token.length > 1 && initials.includes(token)) return 0.75;
  if (lower.includes(token)) return 0.5;
  if (isSubsequence(token, lower)) return 0.2;
  return 0;
}

/// The score of `search` against a command: its label first, then its other words.
export function paletteScore(label: string, search: string, extra: readonly string[] = []): number {
  const tokens = search
    .toLowerCase()
    .trim()
    .split(/\s+/)
    .filter((t) => t !== "");
  if (tokens.length === 0) return 1;
  let total = 0;
  for (const t of tokens) {
    const best = Math.max(wordScore(t, label), ...extra.map((x) => 0.6 * wordScore(t, x)));
    if (best === 0) return 0;
    total += best;
  }
  // a shorter label with the same matches is the more specific command
  return (total / tokens.length) * (1 - Math.min(label.length, 200) / 2000);
}
