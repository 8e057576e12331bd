"use client";
/// The list of sessions the user can open, with New session and Import buttons.
import type { SessionSummary } from "@/lib/wire/reading";
import { buttonQuiet, focusRing, panelHeading } from "./styles";

export interface SessionsPanelProps {
  readonly sessions: readonly SessionSummary[] | undefined;
  readonly error: string | null;
  readonly currentId: string | null;
  readonly onOpen: (id: string) => void;
  readonly onNew: () => void;
  /// opens the import of a JSON export
  readonly onImport: () => void;
}

/// Sessions, newest first as the API lists them; the current one is marked.
export function SessionsPanel({ sessions, error, currentId, onOpen, onNew, onImport }: SessionsPanelProps) {
  return (
    <section aria-label="Sessions" className="flex min-h-0 flex-1 flex-col gap-2">
      <div className="flex items-center justify-between">
        <h2 className={panelHeading}>Sessions</h2>
        <span className="flex gap-0.5">
          <button type="button" onClick={onImport} className={buttonQuiet} title="Import a session from a JSON export (Alt+E)">
            Import
          </button>
          <button type="button" onClick={onNew} className={buttonQuiet} title="New session (Alt+N)">
            + New session
          </button>
        </span>
      </div>
      {error && <p role="alert" className="text-sm text-red-700 dark:text-red-300">{error}</p>}
      {!sessions && !error && <p className="text-sm text-ink/50 dark:text-paper/50">Loading…</p>}
      {sessions && sessions.length === 0 && <p className="text-sm text-ink/60 dark:text-paper/60">No sessions yet.</p>}
      <ul id="rs-sessions" className="flex min-h-0 flex-col gap-0.5 overflow-y-auto">
        {sessions?.map((s) => (
          <li key={s.id}>
            <button
              type="button"
              onClick={() => onOpen(s.id)}
              aria-current={s.id === currentId ? "true" : undefined}
              className={`flex w-full flex-col rounded px-2 py-1 text-left text-sm hover:bg-ink/5 aria-[current=true]:bg-ink/10 dark:hover:bg-paper/5 dark:aria-[current=true]:bg-paper/10 ${focusRing}`}
            >
              <span className="truncate font-medium">{s.title}</span>
              <span className="text-xs text-ink/50 dark:text-paper/50">
                {s.ownerName} · {s.access}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
