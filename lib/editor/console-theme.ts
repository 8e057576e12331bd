/// The look of the Ringside input: the console's mono font, no gutter, a focus ring from
/// the palette's signal colour; colours come from Tailwind classes, so the page's light
/// or dark class decides them.
import type { Extension } from "@codemirror/state";
import { EditorView } from "@codemirror/view";

/// Base styling of the input editor for both themes.
export function consoleTheme(): Extension {
  return EditorView.theme({
    "&": { fontSize: "0.95rem", backgroundColor: "transparent", color: "inherit" },
    "&.cm-focused": { outline: "none" },
    ".cm-content": { fontFamily: "var(--font-mono), ui-monospace, monospace", padding: "0.5rem 0", caretColor: "currentColor" },
    ".cm-line": { padding: "0 0.75rem" },
    ".cm-scroller": { maxHeight: "12rem", overflow: "auto" },
    ".cm-cursor": { borderLeftColor: "currentColor" },
    ".cm-tooltip": { fontFamily: "var(--font-sans), system-ui, sans-serif", fontSize: "0.85rem" },
    ".cm-tooltip-autocomplete > ul > li": { fontFamily: "var(--font-mono), ui-monospace, monospace" },
    ".cm-completionDetail": { marginLeft: "0.75rem", opacity: "0.7", fontStyle: "normal" },
    ".cm-completionInfo": { maxWidth: "26rem", whiteSpace: "pre-wrap" },
    ".rs-hover": { maxWidth: "32rem", padding: "0.35rem 0.6rem", display: "flex", flexDirection: "column", gap: "0.2rem" },
    ".rs-hover-signature": { fontFamily: "var(--font-mono), ui-monospace, monospace", fontSize: "0.8rem" },
    ".rs-hover p": { margin: "0" },
  });
}
