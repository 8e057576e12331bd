/// Recall of earlier inputs with ↑/↓, as a small pure state machine: the list of past
/// sources (oldest first), a cursor into it, and the draft typed before recall began,
/// which ↓ past the newest entry brings back.

export interface HistoryCursor {
  /// Index into `entries` currently shown, or null when the draft is shown.
  readonly index: number | null;
  readonly draft: string;
}

/// The starting cursor: showing the draft.
export const FRESH_CURSOR: HistoryCursor = { index: null, draft: "" };

/// One step back (older). `current` is the editor's text, kept as the draft when recall
/// starts. Returns null when there is nothing older.
export function recallOlder(
  entries: readonly string[],
  cursor: HistoryCursor,
  current: string,
): { cursor: HistoryCursor; text: string } | null {
  if (entries.length === 0) return null;
  if (cursor.index === null) {
    const index = entries.length - 1;
    return { cursor: { index, draft: current }, text: entries[index] };
  }
  if (cursor.index === 0) return null;
  const index = cursor.index - 1;
  return { cursor: { index, draft: cursor.draft }, text: entries[index] };
}

/// One step forward (newer); past the newest entry the draft returns. Null when the
/// draft is already shown.
export function recallNewer(entries: readonly string[], cursor: HistoryCursor): { cursor: HistoryCursor; text: string } | null {
  if (cursor.index === null) return null;
  if (cursor.index >= entries.length - 1) return { cursor: { index: null, draft: "" }, text: cursor.draft };
  const index = cursor.index + 1;
  return { cursor: { index, draft: cursor.draft }, text: entries[index] };
}
