/// The console's keys: Enter runs the input — unless the checker already finds a problem
/// in it: then nothing runs and the problem is shown (Mod-Shift-Enter, a deliberate
/// choice, runs it anyway) — Shift+Enter adds a line, ↑ on the first line and ↓ on the
/// last recall earlier inputs. While the completion list is open, Enter and the arrows
/// belong to it.
import { closeCompletion, completionStatus, selectedCompletion } from "@codemirror/autocomplete";
import { insertNewlineAndIndent } from "@codemirror/commands";
import { Prec, type Extension } from "@codemirror/state";
import { EditorView, keymap } from "@codemirror/view";
import { FRESH_CURSOR, recallNewer, recallOlder, type HistoryCursor } from "./input-history";

/// What the keymap needs from the page.
export interface ConsoleKeymapOptions {
  /// Runs the current input; true when it was sent (the input is then cleared), false
  /// when running is not possible now (the input stays).
  readonly run: (source: string) => boolean;
  /// Earlier inputs of the session, oldest first.
  readonly history: () => readonly string[];
  /// The problems the checker finds in a source before running (none: it may run).
  readonly problems?: (source: string) => readonly string[];
  /// Told when Enter did not run because of `problems` (an empty list: the input changed or ran).
  readonly onHeld?: (problems: readonly string[]) => void;
}

/// The shortcut that runs an input even when the checker objects (for a stale check, or
/// to see the server's own words).
export const RUN_ANYWAY_KEY = "Mod-Shift-Enter";

/// Shows a recalled input; going back leaves the cursor on its first line (so ↑ goes on
/// recalling), going forward at its end (so ↓ goes on).
function replaceDoc(view: EditorView, text: string, cursorAtEnd: boolean) {
  const firstLineEnd = text.indexOf("\n") === -1 ? text.length : text.indexOf("\n");
  view.dispatch({
    changes: { from: 0, to: view.state.doc.length, insert: text },
    selection: { anchor: cursorAtEnd ? text.length : firstLineEnd },
    scrollIntoView: true,
    userEvent: "input.recall",
  });
}

/// Whether the word before the cursor is exactly the highlighted completion.
function typedInFull(view: EditorView): boolean {
  const chosen = selectedCompletion(view.state);
  if (!chosen) return true;
  const head = view.state.selection.main.head;
  const line = view.state.doc.lineAt(head);
  const word = /[A-Za-z0-9_']*$/.exec(line.text.slice(0, head - line.from))?.[0] ?? "";
  return word === chosen.label;
}

/// Enter / Shift+Enter / ↑ / ↓ as the console wants them.
export function consoleKeymap(options: ConsoleKeymapOptions): Extension {
  let cursor: HistoryCursor = FRESH_CURSOR;
  const completing = (view: EditorView) => completionStatus(view.state) !== null;
  const resetOnEdit = EditorView.updateListener.of((u) => {
    if (u.docChanged && !u.transactions.some((t) => t.isUserEvent("input.recall"))) cursor = FRESH_CURSOR;
    if (u.docChanged) options.onHeld?.([]);
  });
  const runNow = (view: EditorView, source: string): boolean => {
    if (options.run(source)) {
      cursor = FRESH_CURSOR;
      view.dispatch({ changes: { from: 0, to: view.state.doc.length, insert: "" } });
    }
    return true;
  };
  return [
    resetOnEdit,
    Prec.highest(
      keymap.of([
        {
          key: "Enter",
          run: (view) => {
            if (completing(view)) {
              // Enter picks the highlighted completion, unless the word is already typed
              // out in full: then the user meant to run.
              if (!typedInFull(view)) return false;
              closeCompletion(view);
            }
            const source = view.state.doc.toString();
            if (source.trim() === "") return true;
            const problems = options.problems?.(source) ?? [];
            if (problems.length > 0) {
              options.onHeld?.(problems);
              return true;
            }
            return runNow(view, source);
          },
        },
        {
          key: RUN_ANYWAY_KEY,
          run: (view) => {
            const source = view.state.doc.toString();
            if (source.trim() === "") return true;
            return runNow(view, source);
          },
        },
        { key: "Shift-Enter", run: insertNewlineAndIndent },
        {
          key: "ArrowUp",
          run: (view) => {
            const sel = view.state.selection.main;
            if (completing(view) || !sel.empty || view.state.doc.lineAt(sel.head).number !== 1) return false;
            const step = recallOlder(options.history(), cursor, view.state.doc.toString());
            if (!step) return false;
            cursor = step.cursor;
            replaceDoc(view, step.text, false);
            return true;
          },
        },
        {
          key: "ArrowDown",
          run: (view) => {
            const sel = view.state.selection.main;
            const doc = view.state.doc;
            if (completing(view) || !sel.empty || doc.lineAt(sel.head).number !== doc.lines) return false;
            const step = recallNewer(options.history(), cursor);
            if (!step) return false;
            cursor = step.cursor;
            replaceDoc(view, step.text, true);
            return true;
          },
        },
      ]),
    ),
  ];
}
