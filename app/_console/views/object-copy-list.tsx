"use client";
/// Named objects of other sessions, each with a button that copies it into the open session
/// (the copy records where it came from): the library and "Shared with me" both draw this
/// list and differ only in their rows' words. A name already used in the session asks for
/// another before the copy is made.
import { useState } from "react";
import { importObject } from "../api/sharing";
import { afterCopyFailure, copyNameProblem } from "../state/copy-object";
import { buttonQuiet, buttonSecondary, textInput } from "./styles";

/// One object as the list shows it.
export interface CopyRow {
  readonly id: string;
  readonly name: string;
  /// the type's words, in the badge
  readonly type: string;
  /// where the object lives (session, owner), one line
  readonly where: string;
  /// its definition or summary, one truncated line
  readonly detail: string;
}

export interface ObjectCopyListProps<R extends CopyRow> {
  readonly rows: readonly R[];
  /// the list's accessible name
  readonly label: string;
  /// the button's word: "Insert" or "Import"
  readonly verb: string;
  /// the button's accessible name for a row
  readonly buttonName: (row: R) => string;
  /// the attribute that marks each row with the object's name (browser tests find rows by it)
  readonly rowAttribute: "data-library-object" | "data-shared-object";
  /// shown instead of the list when there are no rows
  readonly empty: string;
  /// the session a copy goes into, when I may edit it (null: no button)
  readonly targetSessionId: string | null;
  /// the notice after a copy, given the name the copy got
  readonly noticeFor: (row: R, copiedName: string) => string;
  readonly onCopied: (notice: string) => void;
  /// the definition or summary in the monospace font (program text)
  readonly monoDetail?: boolean;
  readonly className?: string;
}

export function ObjectCopyList<R extends CopyRow>(props: ObjectCopyListProps<R>) {
  const { rows, verb, targetSessionId } = props;
  const [renaming, setRenaming] = useState<{ id: string; name: string } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const copy = async (row: R, name?: string) => {
    if (!targetSessionId) return;
    const bad = name === undefined ? null : copyNameProblem(name);
    if (bad) return setProblem(bad);
    setProblem(null);
    try {
      const { object } = await importObject(row.id, targetSessionId, name);
      setRenaming(null);
      props.onCopied(props.noticeFor(row, object.name));
    } catch (e) {
      const next = afterCopyFailure(row.name, e);
      if (next.rename !== null) setRenaming({ id: row.id, name: next.rename });
      setProblem(next.problem);
    }
  };

  return (
    <>
      {rows.length === 0 ? (
        <p className="text-sm text-ink/60 dark:text-paper/60">{props.empty}</p>
      ) : (
        <ul
          aria-label={props.label}
          className={`divide-y divide-ink/10 rounded-md border border-ink/10 dark:divide-paper/10 dark:border-paper/10 ${props.className ?? ""}`}
        >
          {rows.map((row) => (
            <li key={row.id} className="flex flex-col gap-1 px-2 py-1.5 text-sm" {...{ [props.rowAttribute]: row.name }}>
              <div className="flex flex-wrap items-center gap-2">
                <span className="font-mono font-semibold">{row.name}</span>
                <span className="rounded bg-ink/10 px-1.5 text-[0.7rem] dark:bg-paper/10">{row.type}</span>
                <span className="min-w-0 flex-1 truncate text-xs text-ink/60 dark:text-paper/60">{row.where}</span>
                {targetSessionId && renaming?.id !== row.id && (
                  <button type="button" className={buttonQuiet} aria-label={props.buttonName(row)} onClick={() => void copy(row)}>
                    {verb}
                  </button>
                )}
              </div>
              <p className={`truncate text-xs text-ink/60 dark:text-paper/60 ${props.monoDetail ? "font-mono" : ""}`} title={row.detail}>
                {row.detail}
              </p>
              {renaming?.id === row.id && (
                <form
                  className="flex items-end gap-2"
                  onSubmit={(e) => {
                    e.preventDefault();
                    void copy(row, renaming.name);
                  }}
                >
                  <label className="min-w-0 flex-1 text-xs">
                    Name of the copy
                    <input
                      autoFocus
                      className={textInput}
                      value={renaming.name}
                      onChange={(e) => setRenaming({ id: row.id, name: e.target.value })}
                    />
                  </label>
                  <button type="submit" className={buttonSecondary}>
                    {verb} as this name
                  </button>
                </form>
              )}
            </li>
          ))}
        </ul>
      )}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
    </>
  );
}
