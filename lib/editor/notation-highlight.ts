/// Highlighting of the notation from the grammar's own lexer (`tokenizeWith`), so the
/// colours never disagree with what the parser reads. Each token category becomes a
/// mark with Tailwind classes for the light and the dark theme.
import { RangeSetBuilder, type Extension } from "@codemirror/state";
import { Decoration, EditorView, ViewPlugin, type DecorationSet, type ViewUpdate } from "@codemirror/view";
import { tokenizeWith, type TokenCategory } from "@/grammar/lexer";
import { lookupFunction } from "@/grammar/signatures";

const CLASSES: Record<TokenCategory, string> = {
  keyword: "text-ink font-semibold dark:text-signal-soft",
  constant: "text-signal dark:text-signal-soft",
  function: "text-ink-soft font-medium dark:text-teal-300",
  identifier: "text-ink dark:text-paper",
  number: "text-signal dark:text-amber-300",
  string: "text-emerald-700 dark:text-emerald-300",
  comment: "text-ink/50 italic dark:text-paper/50",
  operator: "text-ink-soft dark:text-paper/80",
  bracket: "text-ink-soft font-semibold dark:text-teal-200",
  punctuation: "text-ink/60 dark:text-paper/60",
  invalid: "text-red-700 underline decoration-wavy dark:text-red-300",
};

const MARKS = Object.fromEntries(
  Object.entries(CLASSES).map(([category, cls]) => [category, Decoration.mark({ class: `rs-tok-${category} ${cls}` })]),
) as Record<TokenCategory, Decoration>;

const isFunction = (name: string) => lookupFunction(name) !== undefined;

function decorate(view: EditorView): DecorationSet {
  const builder = new RangeSetBuilder<Decoration>();
  const source = view.state.doc.toString();
  let last = 0;
  for (const t of tokenizeWith(source, isFunction)) {
    // The lexer may report an unreadable character inside a token it skipped; marks
    // must not overlap, so a later token starting before the last end is dropped.
    if (t.from < last || t.to <= t.from) continue;
    builder.add(t.from, t.to, MARKS[t.category]);
    last = t.to;
  }
  return builder.finish();
}

/// Colours the input by the notation's token categories.
export function notationHighlight(): Extension {
  return ViewPlugin.fromClass(
    class {
      decorations: DecorationSet;
      constructor(view: EditorView) {
        this.decorations = decorate(view);
      }
      update(u: ViewUpdate) {
        if (u.docChanged) this.decorations = decorate(u.view);
      }
    },
    { decorations: (p) => p.decorations },
  );
}
