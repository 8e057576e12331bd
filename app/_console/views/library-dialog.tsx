"use client";
/// The library: every named object I may reach across sessions — mine, those in sessions
/// shared with me, those shared with me one by one — searchable by name, type and content;
/// "Insert" copies one into the open session (the copy records where it came from). A name
/// already used in the session asks for another.
import { useState } from "react";
import useSWR from "swr";
import { ApiError, fetchJson, messageOf } from "@/app/_client/fetch";
import { importObject } from "../api/sharing";
import { typeWords } from "../render/type-words";
import { buttonQuiet, buttonSecondary, textInput } from "./styles";

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

/// The types a user looks for most, in the filter (any other is found by typing its name).
const TYPES = [
  "Ideal",
  "Ring",
  "Module",
  "Complex",
  "Matrix",
  "Poly",
  "HilbertSeries",
  "BettiTable",
  "List",
  "Record",
  "Function",
] as const;

export interface LibraryEntry {
  readonly id: string;
  readonly name: string;
  readonly type: string;
  readonly summary: string;
  readonly source: string;
  readonly sessionId: string;
  readonly sessionTitle: string;
  readonly definedByName: string;
  readonly mine: boolean;
  readonly via: "own session" | "shared session" | "shared object";
  readonly updatedAt: string;
}

export interface LibraryProps {
  /// the session a copy goes into, when I may edit it (null: insert is not offered)
  readonly targetSessionId: string | null;
  readonly onInserted: (notice: string) => void;
}

export function LibraryPanel({ targetSessionId, onInserted }: LibraryProps) {
  const [query, setQuery] = useState("");
  const [type, setType] = useState("");
  const params = new URLSearchParams();
  if (query.trim()) params.set("q", query.trim());
  if (type) params.set("type", type);
  const list = useSWR<{ objects: LibraryEntry[] }>(`/api/library${params.size ? `?${params}` : ""}`, fetchJson, { keepPreviousData: true });
  const [renaming, setRenaming] = useState<{ id: string; name: string } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const insert = async (o: LibraryEntry, name?: string) => {
    if (!targetSessionId) return;
    if (name !== undefined && !NAME.test(name)) return setProblem("A name starts with a letter and has only letters, digits, _ and '.");
    setProblem(null);
    try {
      const { object } = await importObject(o.id, targetSessionId, name);
      setRenaming(null);
      onInserted(`Inserted ${object.name}, a copy of ${o.name} from “${o.sessionTitle}”.`);
    } catch (e) {
      if (e instanceof ApiError && e.code === "name_taken") {
        setRenaming({ id: o.id, name: `${o.name}_copy` });
        setProblem(e.message);
      } else setProblem(messageOf(e));
    }
  };

  // the objects of the open session itself are already on its shelf
  const objects = (list.data?.objects ?? []).filter((o) => o.sessionId !== targetSessionId);
  return (
    <div className="flex max-h-[70vh] flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        <input
          data-autofocus
          type="search"
          aria-label="Search the library"
          placeholder="Name, type or content…"
          className={`${textInput} min-w-0 flex-1`}
          value={query}
          onChange={(e) => setQuery(e.target.value)}
        />
        <select aria-label="Type" className={`${textInput} w-auto`} value={type} onChange={(e) => setType(e.target.value)}>
          <option value="">any type</option>
          {TYPES.map((t) => (
            <option key={t} value={t}>
              {typeWords(t)}
            </option>
          ))}
        </select>
      </div>
      {!targetSessionId && <p className="text-sm text-ink-soft dark:text-paper/70">Open a session you may edit to insert into it.</p>}
      {list.error && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {messageOf(list.error)}
        </p>
      )}
      {!list.data && !list.error && <p className="text-sm text-ink/50 dark:text-paper/50">Loading…</p>}
      {list.data && objects.length === 0 && (
        <p className="text-sm text-ink/60 dark:text-paper/60">No object in your other sessions matches.</p>
      )}
      <ul
        aria-label="Library"
        className="min-h-0 divide-y divide-ink/10 overflow-y-auto rounded-md border border-ink/10 dark:divide-paper/10 dark:border-paper/10"
      >
        {objects.map((o) => (
          <li key={o.id} className="flex flex-col gap-1 px-2 py-1.5 text-sm" data-library-object={o.name}>
            <div className="flex flex-wrap items-center gap-2">
              <span className="font-mono font-semibold">{o.name}</span>
              <span className="rounded bg-ink/10 px-1.5 text-[0.7rem] dark:bg-paper/10">{typeWords(o.type)}</span>
              <span className="min-w-0 flex-1 truncate text-xs text-ink/60 dark:text-paper/60">
                in “{o.sessionTitle}”{o.mine ? "" : ` · by ${o.definedByName}`} · {o.via}
              </span>
              {targetSessionId && renaming?.id !== o.id && (
                <button
                  type="button"
                  className={buttonQuiet}
                  aria-label={`Insert ${o.name} from ${o.sessionTitle}`}
                  onClick={() => void insert(o)}
                >
                  Insert
                </button>
              )}
            </div>
            <p className="truncate font-mono text-xs text-ink/60 dark:text-paper/60" title={o.source || o.summary}>
              {o.source || o.summary}
            </p>
            {renaming?.id === o.id && (
              <form
                className="flex items-end gap-2"
                onSubmit={(e) => {
                  e.preventDefault();
                  void insert(o, renaming.name);
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
                  Insert as this name
                </button>
              </form>
            )}
          </li>
        ))}
      </ul>
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
    </div>
  );
}
