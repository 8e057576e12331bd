"use client";
/// The searchable history of inputs: this session's inputs and, for a signed-in user,
/// everything they ran in any of their sessions (GET /api/history), each source once,
/// newest first. The search box has the focus when the dialog opens; typing filters,
/// ↑/↓ move the highlight, Enter puts the highlighted input back into the editor.
import { useEffect, useId, useMemo, useState } from "react";
import { fetchJson } from "@/app/_client/fetch";

interface HistoryEntry {
  readonly source: string;
  readonly sessionTitle?: string;
}

const itemClass =
  "cursor-pointer rounded px-2 py-1 font-mono text-sm aria-selected:bg-ink aria-selected:text-paper dark:aria-selected:bg-signal dark:aria-selected:text-night";

/// A filterable list of earlier inputs. `entries` are this session's, oldest first.
export function HistorySearch({
  entries,
  onChoose,
  acrossSessions = true,
}: {
  entries: readonly string[];
  onChoose: (source: string) => void;
  acrossSessions?: boolean;
}) {
  const [query, setQuery] = useState("");
  const [remote, setRemote] = useState<readonly HistoryEntry[]>([]);
  const [highlight, setHighlight] = useState(0);
  const listId = useId();

  useEffect(() => {
    if (!acrossSessions) return;
    let live = true;
    // a short pause so that typing does not send a request per key
    const timer = window.setTimeout(() => {
      fetchJson<{ entries: HistoryEntry[] }>(`/api/history${query.trim() ? `?q=${encodeURIComponent(query.trim())}` : ""}`)
        .then((d) => live && setRemote(d.entries))
        .catch(() => live && setRemote([]));
    }, 120);
    return () => {
      live = false;
      window.clearTimeout(timer);
    };
  }, [query, acrossSessions]);

  const shown = useMemo(() => {
    const needle = query.trim().toLowerCase();
    const seen = new Set<string>();
    const out: HistoryEntry[] = [];
    const add = (e: HistoryEntry) => {
      const key = e.source.trim();
      if (key === "" || seen.has(key) || (needle && !key.toLowerCase().includes(needle))) return;
      seen.add(key);
      out.push(e);
    };
    [...entries].reverse().forEach((source) => add({ source }));
    remote.forEach(add);
    return out.slice(0, 200);
  }, [entries, remote, query]);

  useEffect(() => setHighlight(0), [query]);
  const current = Math.min(highlight, Math.max(shown.length - 1, 0));

  return (
    <div className="flex flex-col gap-2">
      <input
        data-autofocus
        type="search"
        role="combobox"
        aria-expanded="true"
        aria-controls={listId}
        aria-activedescendant={shown.length ? `${listId}-${current}` : undefined}
        aria-label="Search earlier inputs"
        placeholder="Search earlier inputs…"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        onKeyDown={(e) => {
          if (e.key === "ArrowDown") {
            e.preventDefault();
            setHighlight(Math.min(current + 1, shown.length - 1));
          } else if (e.key === "ArrowUp") {
            e.preventDefault();
            setHighlight(Math.max(current - 1, 0));
          } else if (e.key === "Enter") {
            e.preventDefault();
            const chosen = shown[current];
            if (chosen) onChoose(chosen.source);
          }
        }}
        className="w-full rounded-md border border-ink/20 bg-white px-2 py-1.5 text-sm dark:border-paper/20 dark:bg-night"
      />
      <ul id={listId} role="listbox" aria-label="Earlier inputs" className="max-h-80 overflow-y-auto">
        {shown.length === 0 && <li className="px-2 py-1 text-sm text-ink/60 dark:text-paper/60">No earlier input matches.</li>}
        {shown.map((e, i) => (
          <li
            key={e.source}
            id={`${listId}-${i}`}
            role="option"
            aria-selected={i === current}
            className={itemClass}
            onMouseMove={() => setHighlight(i)}
            onClick={() => onChoose(e.source)}
          >
            <span className="line-clamp-2 whitespace-pre-wrap">{e.source}</span>
            {e.sessionTitle && <span className="ml-2 font-sans text-xs opacity-70">· {e.sessionTitle}</span>}
          </li>
        ))}
      </ul>
    </div>
  );
}
