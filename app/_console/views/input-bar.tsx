"use client";
/// The input at the bottom: the notation editor with Run (or Cancel while a cell runs) and
/// History; for a reader without edit access, a line saying why there is no input.
import type { Ref } from "react";
import type { Env } from "@/grammar/analysis";
import { InputEditor, type EditorHandle } from "../input-editor";
import { buttonPrimary, buttonSecondary } from "./styles";

export function InputBar(props: {
  loading: boolean;
  canEdit: boolean;
  readOnlyLink: boolean;
  running: boolean;
  env: Env;
  history: readonly string[];
  editor: Ref<EditorHandle>;
  onRun: (source: string) => boolean;
  onRunInput: () => void;
  onCancel: () => void;
  onHistory: () => void;
}) {
  const { loading, canEdit, readOnlyLink, running, env, history, editor, onRun, onRunInput, onCancel, onHistory } = props;
  return (
    <section aria-label="Input" className="border-t border-ink/10 bg-white px-3 py-2 dark:border-paper/10 dark:bg-night-panel">
      {loading ? (
        <p className="py-2 text-sm text-ink/50 dark:text-paper/50">Opening the session…</p>
      ) : canEdit ? (
        <div className="flex items-end gap-2">
          <div className="min-w-0 flex-1 rounded-md border border-ink/20 focus-within:border-signal focus-within:ring-2 focus-within:ring-signal-soft dark:border-paper/20">
            <InputEditor env={env} history={history} onRun={onRun} handle={editor} />
          </div>
          <div className="flex flex-col gap-1">
            {running ? (
              <button type="button" className={buttonSecondary} onClick={onCancel} title="Cancel the running cell (Alt+X)">
                Cancel
              </button>
            ) : (
              <button type="button" className={buttonPrimary} title="Run the input (Enter)" onClick={onRunInput}>
                Run
              </button>
            )}
            <button type="button" className={buttonSecondary} onClick={onHistory} title="Search earlier inputs (Alt+R)">
              History
            </button>
          </div>
        </div>
      ) : (
        <p className="py-2 text-sm text-ink-soft dark:text-paper/70">
          {readOnlyLink
            ? "This is a read-only shared link: cells cannot be run through it."
            : "You can read this session; running cells needs edit access, which its owner can give you."}
        </p>
      )}
    </section>
  );
}
