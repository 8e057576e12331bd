"use client";
/// Named objects others have shared with me, each with "Import" into the open session
/// (a copy that records where it came from). A name already used asks for another.
import { useState } from "react";
import useSWR from "swr";
import { keys } from "../api/client";
import { ApiError, fetchJson } from "@/app/_client/fetch";
import { importObject, type SharedObject } from "../api/sharing";
import { buttonQuiet, buttonSecondary, textInput } from "./styles";

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

export interface SharedObjectsProps {
  /// the session the copy goes into, when I may edit it (null: import is not offered)
  readonly targetSessionId: string | null;
  readonly onImported: (notice: string) => void;
}

/// The list of objects shared with me (rendered inside a Modal).
export function SharedObjectsPanel({ targetSessionId, onImported }: SharedObjectsProps) {
  const list = useSWR<{ objects: SharedObject[] }>(keys.sharedObjects, fetchJson);
  const [renaming, setRenaming] = useState<{ id: string; name: string } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const copy = async (o: SharedObject, name?: string) => {
    if (!targetSessionId) return;
    if (name !== undefined && !NAME.test(name)) return setProblem("A name starts with a letter and has only letters, digits, _ and '.");
    setProblem(null);
    try {
      const { object } = await importObject(o.id, targetSessionId, name);
      setRenaming(null);
      onImported(`Imported ${object.name} from ${o.ownerName}'s session “${o.sessionTitle}”.`);
    } catch (e) {
      if (e instanceof ApiError && e.code === "name_taken") {
        setRenaming({ id: o.id, name: `${o.name}_copy` });
        setProblem(`${e.message}`);
      } else setProblem(e instanceof Error ? e.message : String(e));
    }
  };

  if (list.error)
    return (
      <p role="alert" className="text-sm text-red-700 dark:text-red-300">
        {list.error instanceof Error ? list.error.message : "Could not load."}
      </p>
    );
  if (!list.data) return <p className="text-sm text-ink/50 dark:text-paper/50">Loading…</p>;
  const objects = list.data.objects;
  return (
    <div className="flex max-h-[60vh] flex-col gap-2 overflow-y-auto">
      {!targetSessionId && <p className="text-sm text-ink-soft dark:text-paper/70">Open a session you may edit to import into it.</p>}
      {objects.length === 0 ? (
        <p className="text-sm text-ink/60 dark:text-paper/60">Nobody has shared a named object with you yet.</p>
      ) : (
        <ul
          aria-label="Objects shared with me"
          className="divide-y divide-ink/10 rounded-md border border-ink/10 dark:divide-paper/10 dark:border-paper/10"
        >
          {objects.map((o) => (
            <li key={o.id} className="flex flex-col gap-1 px-2 py-1.5 text-sm" data-shared-object={o.name}>
              <div className="flex items-center gap-2">
                <span className="font-mono font-semibold">{o.name}</span>
                <span className="rounded bg-ink/10 px-1.5 text-[0.7rem] uppercase tracking-wide dark:bg-paper/10">{o.type}</span>
                <span className="min-w-0 flex-1 truncate text-xs text-ink/60 dark:text-paper/60">
                  from {o.ownerName} · “{o.sessionTitle}”
                </span>
                {targetSessionId && renaming?.id !== o.id && (
                  <button type="button" className={buttonQuiet} aria-label={`Import ${o.name}`} onClick={() => void copy(o)}>
                    Import
                  </button>
                )}
              </div>
              <p className="truncate text-xs text-ink/60 dark:text-paper/60" title={o.summary}>
                {o.summary}
              </p>
              {renaming?.id === o.id && (
                <form
                  className="flex items-end gap-2"
                  onSubmit={(e) => {
                    e.preventDefault();
                    void copy(o, renaming.name);
                  }}
                >
                  <label className="min-w-0 flex-1 text-xs">
                    Name of the copy
                    <input
                      autoFocus
                      className={textInput}
                      value={renaming.name}
                      onChange={(e) => setRenaming({ id: o.id, name: e.target.value })}
                    />
                  </label>
                  <button type="submit" className={buttonSecondary}>
                    Import as this name
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
    </div>
  );
}
