"use client";
/// The Ringside input: a CodeMirror 6 editor with the notation's highlighting,
/// completion, live diagnostics, hover documentation and the console's keys. The page drives it through a
/// handle (insert a name, replace the text, focus).
import { closeBrackets } from "@codemirror/autocomplete";
import { defaultKeymap, history, historyKeymap } from "@codemirror/commands";
import { forceLinting } from "@codemirror/lint";
import { EditorState } from "@codemirror/state";
import { EditorView, keymap, placeholder } from "@codemirror/view";
import { useEffect, useImperativeHandle, useRef, useState, type Ref } from "react";
import type { Env } from "@/grammar/analysis";
import { consoleKeymap } from "@/lib/editor/console-keymap";

/// How the run-anyway shortcut (Mod-Shift-Enter) is written for the reader's keyboard.
const RUN_ANYWAY_LABEL = typeof navigator !== "undefined" && /Mac|iPhone|iPad/.test(navigator.platform) ? "⌘⇧Enter" : "Ctrl+Shift+Enter";
import { consoleTheme } from "@/lib/editor/console-theme";
import { notationCompletion } from "@/lib/editor/notation-completion";
import { notationDiagnostics } from "@/lib/editor/notation-diagnostics";
import { notationHighlight } from "@/lib/editor/notation-highlight";
import { notationHover } from "@/lib/editor/notation-hover";
import { checkNotation } from "./notation-checker";

/// What the page may do with the input.
export interface EditorHandle {
  /// Inserts text at the cursor (replacing the selection) and focuses the input.
  insert(text: string): void;
  /// Replaces the whole input.
  setText(text: string): void;
  getText(): string;
  focus(): void;
}

export interface InputEditorProps {
  readonly env: Env;
  /// Earlier inputs, oldest first.
  readonly history: readonly string[];
  /// Runs the source; false when it cannot run now (nothing is cleared then).
  readonly onRun: (source: string) => boolean;
  readonly handle: Ref<EditorHandle>;
}

/// The input editor, labelled "Ringside input" for assistive technology and tests.
export function InputEditor({ env, history: past, onRun, handle }: InputEditorProps) {
  const host = useRef<HTMLDivElement>(null);
  const view = useRef<EditorView | null>(null);
  const envRef = useRef(env);
  const historyRef = useRef(past);
  const runRef = useRef(onRun);
  historyRef.current = past;
  runRef.current = onRun;
  // the checker's problems that kept Enter from running the input, shown under it
  const [held, setHeld] = useState<readonly string[]>([]);

  useEffect(() => {
    envRef.current = env;
    if (view.current) forceLinting(view.current);
  }, [env]);

  useEffect(() => {
    if (!host.current) return;
    const language = { analyze: checkNotation, env: () => envRef.current };
    const v = new EditorView({
      parent: host.current,
      state: EditorState.create({
        doc: "",
        extensions: [
          consoleKeymap({
            run: (s) => runRef.current(s),
            history: () => historyRef.current,
            problems: (s) => checkNotation(s, envRef.current).errors.map((e) => `${e.span.from.line}:${e.span.from.col}: ${e.message}`),
            onHeld: (p) => setHeld((old) => (old.length === 0 && p.length === 0 ? old : p)),
          }),
          history(),
          closeBrackets(),
          notationHighlight(),
          notationCompletion(language),
          notationDiagnostics(language),
          notationHover(language),
          consoleTheme(),
          placeholder("Type a program — Enter runs, Shift+Enter adds a line, Ctrl+K for commands"),
          EditorView.lineWrapping,
          EditorView.contentAttributes.of({ "aria-label": "Ringside input", "aria-multiline": "true" }),
          keymap.of([...defaultKeymap, ...historyKeymap]),
        ],
      }),
    });
    view.current = v;
    return () => {
      v.destroy();
      view.current = null;
    };
  }, []);

  useImperativeHandle(
    handle,
    () => ({
      insert(text: string) {
        const v = view.current;
        if (!v) return;
        const sel = v.state.selection.main;
        v.dispatch({ changes: { from: sel.from, to: sel.to, insert: text }, selection: { anchor: sel.from + text.length } });
        v.focus();
      },
      setText(text: string) {
        const v = view.current;
        if (!v) return;
        v.dispatch({ changes: { from: 0, to: v.state.doc.length, insert: text }, selection: { anchor: text.length } });
        v.focus();
      },
      getText: () => view.current?.state.doc.toString() ?? "",
      focus: () => view.current?.focus(),
    }),
    [],
  );

  return (
    <div className="flex min-w-0 flex-1 flex-col">
      <div ref={host} className="rs-input min-h-[3rem] flex-1" />
      {held.length > 0 && (
        <p role="alert" className="mt-1 text-sm text-red-700 dark:text-red-300" data-testid="input-held">
          Not run — {held[0]}
          {held.length > 1 ? ` (and ${held.length - 1} more)` : ""}. Fix it, or press {RUN_ANYWAY_LABEL} to run anyway.
        </p>
      )}
    </div>
  );
}
