"use client";
/// The Ringside input: a CodeMirror 6 editor with the notation's highlighting,
/// completion, live diagnostics, hover documentation and the console's keys. The page drives it through a
/// handle (insert a name, replace the text, focus).
import { closeBrackets } from "@codemirror/autocomplete";
import { defaultKeymap, history, historyKeymap } from "@codemirror/commands";
import { forceLinting } from "@codemirror/lint";
import { EditorState } from "@codemirror/state";
import { EditorView, keymap, placeholder } from "@codemirror/view";
import { useEffect, useImperativeHandle, useRef, type Ref } from "react";
import type { Env } from "@/grammar/analysis";
import { consoleKeymap } from "@/lib/editor/console-keymap";
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
          consoleKeymap({ run: (s) => runRef.current(s), history: () => historyRef.current }),
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

  return <div ref={host} className="rs-input min-h-[3rem] flex-1" />;
}
