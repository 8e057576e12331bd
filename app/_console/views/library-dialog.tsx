"use client";
/// The library: every named object I may reach across sessions — mine, those in sessions
/// shared with me, those shared with me one by one — searchable by name, type and content;
/// "Insert" copies one into the open session (ObjectCopyList, shared with "Shared with me").
import { useState } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { typeWords } from "../render/type-words";
import { ObjectCopyList } from "./object-copy-list";
import { textInput } from "./styles";

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
      {list.data && (
        <ObjectCopyList
          rows={objects.map((o) => ({
            id: o.id,
            sessionTitle: o.sessionTitle,
            name: o.name,
            type: typeWords(o.type),
            where: `in “${o.sessionTitle}”${o.mine ? "" : ` · by ${o.definedByName}`} · ${o.via}`,
            detail: o.source || o.summary,
          }))}
          label="Library"
          verb="Insert"
          buttonName={(row) => `Insert ${row.name} from ${row.sessionTitle}`}
          rowAttribute="data-library-object"
          empty="No object in your other sessions matches."
          targetSessionId={targetSessionId}
          noticeFor={(row, copied) => `Inserted ${copied}, a copy of ${row.name} from “${row.sessionTitle}”.`}
          onCopied={onInserted}
          monoDetail
          className="min-h-0 overflow-y-auto"
        />
      )}
    </div>
  );
}
