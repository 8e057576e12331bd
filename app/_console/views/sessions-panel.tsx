"use client";
/// The list of sessions the user can open, with New session and Import buttons, a search
/// over titles and content (cell sources, object names and values), and for the owner of
/// a session Rename and Delete (Delete asks first; the server refuses others' sessions).
import { useState } from "react";
import useSWR, { useSWRConfig } from "swr";
import { fetchJson, messageOf, send } from "@/app/_client/fetch";
import type { SessionSummary } from "@/lib/wire/reading";
import { keys } from "../api/client";
import { Modal } from "./modal";
import { buttonPrimary, buttonQuiet, buttonSecondary, focusRing, panelHeading, textInput } from "./styles";

export interface SessionsPanelProps {
  readonly sessions: readonly SessionSummary[] | undefined;
  readonly error: string | null;
  readonly currentId: string | null;
  readonly onOpen: (id: string) => void;
  readonly onNew: () => void;
  /// opens the import of a JSON export
  readonly onImport: () => void;
  /// after a session was deleted (the console leaves it when it was open)
  readonly onDeleted?: (id: string) => void;
}

type Found = SessionSummary & { readonly match?: string | null };

/// Sessions, newest first as the API lists them; the current one is marked.
export function SessionsPanel({ sessions, error, currentId, onOpen, onNew, onImport, onDeleted }: SessionsPanelProps) {
  const { mutate } = useSWRConfig();
  const [query, setQuery] = useState("");
  const q = query.trim();
  const found = useSWR<{ sessions: Found[] }>(q ? `${keys.sessions}?q=${encodeURIComponent(q)}` : null, fetchJson, {
    keepPreviousData: true,
  });
  const [renaming, setRenaming] = useState<{ id: string; title: string } | null>(null);
  const [deleting, setDeleting] = useState<SessionSummary | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const refresh = () =>
    mutate(
      (key) =>
        typeof key === "string" && (key === keys.sessions || key.startsWith(`${keys.sessions}?`) || key.startsWith(`${keys.sessions}/`)),
    );

  const rename = async () => {
    if (!renaming) return;
    const title = renaming.title.trim();
    if (title === "") return setProblem("Give the session a title.");
    setBusy(true);
    try {
      await send(`/api/sessions/${renaming.id}`, { method: "PATCH", body: JSON.stringify({ title }) });
      setRenaming(null);
      setProblem(null);
      await refresh();
    } catch (e) {
      setProblem(messageOf(e));
    } finally {
      setBusy(false);
    }
  };

  const remove = async () => {
    if (!deleting) return;
    setBusy(true);
    try {
      await send(`/api/sessions/${deleting.id}`, { method: "DELETE" });
      const id = deleting.id;
      setDeleting(null);
      setProblem(null);
      await refresh();
      if (onDeleted) onDeleted(id);
      else if (id === currentId) window.location.assign("/");
    } catch (e) {
      setProblem(messageOf(e));
      setDeleting(null);
    } finally {
      setBusy(false);
    }
  };

  const list: readonly Found[] | undefined = q ? found.data?.sessions : sessions;

  return (
    <section aria-label="Sessions" className="flex min-h-0 flex-1 flex-col gap-2">
      <div className="flex flex-wrap items-center justify-between gap-1">
        <h2 className={panelHeading}>Sessions</h2>
        <span className="flex flex-wrap gap-0.5">
          <button type="button" onClick={onImport} className={buttonQuiet} title="Import a session from a JSON export (Alt+E)">
            Import
          </button>
          <button type="button" onClick={onNew} className={buttonQuiet} title="New session (Alt+N)">
            + New session
          </button>
        </span>
      </div>
      <input
        type="search"
        aria-label="Search sessions"
        placeholder="Search titles and content…"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        className={textInput}
      />
      {(error || problem) && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem ?? error}
        </p>
      )}
      {!list && !error && <p className="text-sm text-ink/50 dark:text-paper/50">{q ? "Searching…" : "Loading…"}</p>}
      {list && list.length === 0 && (
        <p className="text-sm text-ink/60 dark:text-paper/60">{q ? "No session matches." : "No sessions yet."}</p>
      )}
      <ul id="rs-sessions" className="flex min-h-0 flex-col gap-0.5 overflow-y-auto">
        {list?.map((s) =>
          renaming?.id === s.id ? (
            <li key={s.id}>
              <form
                className="flex flex-col gap-1 rounded bg-ink/5 p-1 dark:bg-paper/5"
                onSubmit={(e) => {
                  e.preventDefault();
                  void rename();
                }}
              >
                <input
                  autoFocus
                  aria-label="New title"
                  className={textInput}
                  value={renaming.title}
                  maxLength={200}
                  onChange={(e) => setRenaming({ id: s.id, title: e.target.value })}
                  onKeyDown={(e) => {
                    if (e.key === "Escape") {
                      e.preventDefault();
                      setRenaming(null);
                    }
                  }}
                />
                <span className="flex gap-1">
                  <button type="submit" className={buttonPrimary} disabled={busy}>
                    Save
                  </button>
                  <button type="button" className={buttonSecondary} onClick={() => setRenaming(null)}>
                    Cancel
                  </button>
                </span>
              </form>
            </li>
          ) : (
            <li key={s.id} className="group flex items-start gap-0.5" data-testid="session-row">
              <button
                type="button"
                onClick={() => onOpen(s.id)}
                aria-current={s.id === currentId ? "true" : undefined}
                className={`flex min-w-0 flex-1 flex-col rounded px-2 py-1 text-left text-sm hover:bg-ink/5 aria-[current=true]:bg-ink/10 dark:hover:bg-paper/5 dark:aria-[current=true]:bg-paper/10 ${focusRing}`}
              >
                <span className="truncate font-medium">{s.title}</span>
                <span className="truncate text-xs text-ink/50 dark:text-paper/50">
                  {s.ownerName} · {s.access}
                </span>
                {s.match && <span className="truncate font-mono text-xs text-ink-soft dark:text-paper/70">{s.match}</span>}
              </button>
              {s.access === "owner" && (
                <span className="flex shrink-0 flex-col">
                  <button
                    type="button"
                    className={buttonQuiet}
                    aria-label={`Rename ${s.title}`}
                    title="Rename"
                    onClick={() => setRenaming({ id: s.id, title: s.title })}
                  >
                    Rename
                  </button>
                  <button
                    type="button"
                    className={buttonQuiet}
                    aria-label={`Delete ${s.title}`}
                    title="Delete"
                    onClick={() => setDeleting(s)}
                  >
                    Delete
                  </button>
                </span>
              )}
            </li>
          ),
        )}
      </ul>
      <Modal open={deleting !== null} title="Delete this session?" onClose={() => setDeleting(null)}>
        <p className="text-sm">
          “{deleting?.title}” and all its cells and named objects will be deleted for everyone it is shared with. This cannot be undone.
        </p>
        <span className="flex gap-2">
          <button type="button" className={buttonPrimary} disabled={busy} onClick={() => void remove()}>
            Delete the session
          </button>
          <button type="button" className={buttonSecondary} onClick={() => setDeleting(null)} data-autofocus>
            Keep it
          </button>
        </span>
      </Modal>
    </section>
  );
}
