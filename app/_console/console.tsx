"use client";
/// The Ringside console: sessions and the named-object shelf on the left, the
/// transcript in the middle, the input at the bottom, the command palette over all.
/// The session state lives here; the views under ./views only draw it.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { mutate } from "swr";
import { envFromObjects } from "@/lib/editor/notation-env";
import { GUIDED_TOUR, type GuidedExample } from "@/lib/examples/tour";
import { ApiError, cancelCell, createSession, deleteObject, exportUrl, keys, renameObject } from "./api/client";
import { runCell } from "./api/cell-stream";
import type { NamedObject } from "./api/types";
import { InputEditor, type EditorHandle } from "./input-editor";
import { applyCellEvent, startedCell, type RunningCell } from "./state/running-cell";
import { useTheme } from "./theme";
import { useSessionData } from "./use-session-data";
import { CellView, RunningCellView } from "./views/cell-view";
import { CommandPalette, type PaletteCommand } from "./views/command-palette";
import { HistorySearch } from "./views/history-search";
import { KeyboardHelp } from "./views/keyboard-help";
import { Modal } from "./views/modal";
import { SessionsPanel } from "./views/sessions-panel";
import { Shelf } from "./views/shelf";
import { buttonPrimary, buttonSecondary, focusRing, kbd, panelHeading } from "./views/styles";
import { EmptySessionWelcome, TourList } from "./views/tour";

type DialogName = "history" | "tour" | "help" | null;

const messageOf = (e: unknown) => (e instanceof ApiError ? e.message : e instanceof Error ? e.message : String(e));

/// Keeps the open session in the address (?session=…), so a reload reopens it.
function rememberSession(id: string) {
  const url = new URL(window.location.href);
  url.searchParams.set("session", id);
  window.history.replaceState(null, "", url);
}

/// The console page body; `initialSessionId` comes from the address.
export function Console({ initialSessionId }: { initialSessionId: string | null }) {
  const [sessionId, setSessionId] = useState<string | null>(initialSessionId);
  const data = useSessionData(sessionId);
  const { theme, toggle: toggleTheme } = useTheme();
  const [running, setRunning] = useState<RunningCell | null>(null);
  const [paletteOpen, setPaletteOpen] = useState(false);
  const [dialog, setDialog] = useState<DialogName>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const editor = useRef<EditorHandle>(null);
  const transcriptEnd = useRef<HTMLDivElement>(null);
  const runningRef = useRef<RunningCell | null>(null);
  runningRef.current = running;

  // With no session in the address, open the most recent one.
  useEffect(() => {
    if (sessionId === null && data.sessions && data.sessions.length > 0) setSessionId(data.sessions[0].id);
  }, [sessionId, data.sessions]);
  useEffect(() => {
    if (sessionId) rememberSession(sessionId);
  }, [sessionId]);

  // Running is offered only once the server has said this user may edit the session
  // (a guest never sees it); with no session yet, the first run creates one.
  const canEdit = sessionId === null ? true : data.session?.canEdit === true;
  const loadingSession = sessionId !== null && !data.session && !data.sessionError;
  const cells = data.cells;
  const objects = data.objects;
  const historyEntries = useMemo(() => (cells ?? []).map((c) => c.source), [cells]);
  const env = useMemo(() => envFromObjects(objects ?? []), [objects]);

  useEffect(() => {
    transcriptEnd.current?.scrollIntoView({ block: "end" });
  }, [cells?.length, running?.results.length, running?.status, running?.partialBetti.length]);

  const openSession = useCallback((id: string) => {
    setSessionId(id);
    setNotice(null);
    editor.current?.focus();
  }, []);

  const newSession = useCallback(async () => {
    try {
      const title = `Session of ${new Date().toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" })}`;
      const created = await createSession(title);
      await data.refreshSessions();
      openSession(created.id);
      setNotice(`Created “${created.title}”.`);
    } catch (e) {
      setNotice(`Could not create a session: ${messageOf(e)}`);
    }
  }, [data, openSession]);

  const run = useCallback(
    (source: string): boolean => {
      if (!canEdit || runningRef.current) {
        setNotice(runningRef.current ? "A cell is still running: wait for it or cancel it (Alt+X)." : "This session is read-only for you.");
        return false;
      }
      const started = startedCell(source);
      runningRef.current = started;
      setRunning(started);
      setNotice(null);
      void (async () => {
        let id = sessionId;
        let accepted = false;
        try {
          if (!id) {
            const created = await createSession("First session");
            id = created.id;
            setSessionId(id);
          }
          await runCell(id, source, (event) => {
            if (event.event === "accepted") accepted = true;
            setRunning((c) => (c ? applyCellEvent(c, event) : c));
          });
        } catch (e) {
          setNotice(`The cell did not run: ${messageOf(e)}`);
          if (!accepted) editor.current?.setText(source);
        } finally {
          // By key, not through the hook: the first run may have created the session.
          if (id) await Promise.all([mutate(keys.cells(id)), mutate(keys.objects(id)), mutate(keys.sessions)]);
          runningRef.current = null;
          setRunning(null);
        }
      })();
      return true;
    },
    [canEdit, sessionId],
  );

  const cancelRunning = useCallback(async () => {
    const c = runningRef.current;
    if (!c || !sessionId) return;
    if (!c.cellId) {
      setNotice("The cell has not been accepted yet; try again in a moment.");
      return;
    }
    setRunning((r) => (r ? { ...r, cancelRequested: true } : r));
    try {
      const stopped = await cancelCell(sessionId, c.cellId);
      if (!stopped) setNotice("The cell had already finished.");
    } catch (e) {
      setNotice(`Could not cancel: ${messageOf(e)}`);
      setRunning((r) => (r ? { ...r, cancelRequested: false } : r));
    }
  }, [sessionId]);

  const insertName = useCallback((name: string) => editor.current?.insert(name), []);
  const insertExample = useCallback((e: GuidedExample) => {
    setDialog(null);
    editor.current?.setText(e.source);
  }, []);

  const exportTranscript = useCallback(async () => {
    if (!sessionId) {
      setNotice("Open a session to export its transcript.");
      return;
    }
    try {
      const res = await fetch(exportUrl(sessionId));
      if (res.status === 404) {
        setNotice("Export is not available yet: the server has no transcript export for this session (404).");
        return;
      }
      if (!res.ok) {
        setNotice(`Export failed: the server answered ${res.status}.`);
        return;
      }
      const blob = await res.blob();
      const a = document.createElement("a");
      a.href = URL.createObjectURL(blob);
      a.download = `${(data.session?.title ?? "transcript").replace(/[^\w.-]+/g, "-")}.md`;
      a.click();
      URL.revokeObjectURL(a.href);
      setNotice("Transcript exported as Markdown.");
    } catch (e) {
      setNotice(`Export failed: ${messageOf(e)}`);
    }
  }, [sessionId, data.session?.title]);

  const renameOne = useCallback(
    async (o: NamedObject, name: string) => {
      if (!sessionId) return "No session is open.";
      try {
        await renameObject(sessionId, o.id, name);
        await data.refreshObjects();
        return null;
      } catch (e) {
        return messageOf(e);
      }
    },
    [sessionId, data],
  );
  const deleteOne = useCallback(
    async (o: NamedObject) => {
      if (!sessionId) return "No session is open.";
      try {
        await deleteObject(sessionId, o.id);
        await data.refreshObjects();
        return null;
      } catch (e) {
        return messageOf(e);
      }
    },
    [sessionId, data],
  );

  const focusFirst = (selector: string) => document.querySelector<HTMLElement>(selector)?.focus();

  const commands = useMemo((): PaletteCommand[] => {
    const list: PaletteCommand[] = [
      { id: "new-session", group: "Session", label: "New session", shortcut: "Alt+N", run: () => void newSession() },
      { id: "export", group: "Session", label: "Export the transcript (Markdown)", shortcut: "Alt+E", run: () => void exportTranscript() },
      { id: "history", group: "Input", label: "Search the input history", shortcut: "Alt+R", run: () => setDialog("history") },
      { id: "tour", group: "Help", label: "Guided first steps", shortcut: "Alt+G", keywords: ["examples", "tour"], run: () => setDialog("tour") },
      { id: "help", group: "Help", label: "Keyboard help", shortcut: "Alt+/", keywords: ["shortcuts", "keys"], run: () => setDialog("help") },
      { id: "reference", group: "Help", label: "Open the notation reference", keywords: ["functions", "properties"], run: () => window.open("/reference", "_blank") },
      { id: "theme", group: "View", label: theme === "dark" ? "Switch to the light theme" : "Switch to the dark theme", shortcut: "Alt+T", run: toggleTheme },
    ];
    if (canEdit) {
      list.splice(2, 0, {
        id: "run",
        group: "Input",
        label: "Run the input",
        shortcut: "Enter",
        run: () => {
          const source = editor.current?.getText() ?? "";
          if (source.trim() && run(source)) editor.current?.setText("");
        },
      });
      if (running) list.splice(3, 0, { id: "cancel", group: "Input", label: "Cancel the running cell", shortcut: "Alt+X", run: () => void cancelRunning() });
      for (const e of GUIDED_TOUR) {
        list.push({ id: `example-${e.id}`, group: "Insert a guided example", label: `Insert example: ${e.title}`, keywords: [e.computes], run: () => insertExample(e) });
      }
    }
    for (const s of data.sessions ?? []) {
      list.push({ id: `open-${s.id}`, group: "Open session", label: `Open session: ${s.title}`, keywords: [s.ownerName], run: () => openSession(s.id) });
    }
    for (const o of objects ?? []) {
      list.push({ id: `object-${o.id}`, group: "Recall a named object", label: `Insert name: ${o.name} (${o.type})`, keywords: [o.summary], run: () => insertName(o.name) });
    }
    return list;
  }, [theme, toggleTheme, canEdit, running, data.sessions, objects, newSession, exportTranscript, run, cancelRunning, insertExample, openSession, insertName]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && !e.altKey && e.key.toLowerCase() === "k") {
        e.preventDefault();
        setPaletteOpen((o) => !o);
        return;
      }
      if (!e.altKey || e.ctrlKey || e.metaKey) return;
      const actions: Record<string, () => void> = {
        KeyN: () => void newSession(),
        KeyO: () => focusFirst("#rs-sessions button[aria-current=true], #rs-sessions button"),
        KeyS: () => focusFirst("#rs-shelf button"),
        KeyI: () => editor.current?.focus(),
        KeyR: () => setDialog("history"),
        KeyX: () => void cancelRunning(),
        KeyG: () => setDialog("tour"),
        KeyE: () => void exportTranscript(),
        KeyT: toggleTheme,
        Slash: () => setDialog("help"),
      };
      const action = actions[e.code];
      if (action) {
        e.preventDefault();
        action();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [newSession, cancelRunning, exportTranscript, toggleTheme]);

  const shownCells = (cells ?? []).filter((c) => !(running && c.id === running.cellId));
  const empty = cells !== undefined && cells.length === 0 && !running;

  return (
    <div className="grid min-h-0 flex-1 grid-cols-[17rem_minmax(0,1fr)] bg-paper text-ink dark:bg-night dark:text-paper">
      <aside className="flex min-h-0 flex-col gap-4 border-r border-ink/10 bg-paper-deep/40 p-3 dark:border-paper/10 dark:bg-night-panel">
        <SessionsPanel
          sessions={data.sessions}
          error={data.sessionsError}
          currentId={sessionId}
          onOpen={openSession}
          onNew={() => void newSession()}
        />
        <Shelf objects={objects} canEdit={canEdit} onInsert={insertName} onRename={renameOne} onDelete={deleteOne} />
      </aside>

      <main className="flex min-h-0 min-w-0 flex-col">
        <div className="flex items-center gap-2 border-b border-ink/10 px-4 py-2 dark:border-paper/10">
          <h1 className="truncate text-sm font-semibold" data-testid="session-title">
            {data.session?.title ?? (sessionId ? "…" : "No session open")}
          </h1>
          {data.session && !data.session.canEdit && (
            <span className="rounded bg-signal-soft px-1.5 py-0.5 text-xs text-ink dark:bg-signal/30 dark:text-paper">read-only</span>
          )}
          <span className="ml-auto flex items-center gap-1.5">
            <button type="button" className={buttonSecondary} onClick={() => setPaletteOpen(true)} title="Command palette">
              Commands <kbd className={kbd}>Ctrl K</kbd>
            </button>
            <button type="button" className={buttonSecondary} onClick={() => setDialog("tour")} title="Guided first steps (Alt+G)">
              First steps
            </button>
            {sessionId && (
              <a
                href={exportUrl(sessionId)}
                className={buttonSecondary}
                title="Export the transcript as Markdown (Alt+E)"
                onClick={(e) => {
                  e.preventDefault();
                  void exportTranscript();
                }}
              >
                Export
              </a>
            )}
            <button type="button" className={buttonSecondary} onClick={() => setDialog("help")} title="Keyboard help (Alt+/)">
              Keys
            </button>
            <button type="button" className={buttonSecondary} onClick={toggleTheme} aria-pressed={theme === "dark"} title="Switch theme (Alt+T)">
              {theme === "dark" ? "Light" : "Dark"}
            </button>
          </span>
        </div>

        <section aria-label="Transcript" tabIndex={0} className={`min-h-0 flex-1 overflow-y-auto px-4 ${focusRing}`}>
          {data.sessionError && <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">{data.sessionError}</p>}
          {data.cellsError && !data.sessionError && <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">{data.cellsError}</p>}
          {empty && <EmptySessionWelcome onInsert={insertExample} onOpenTour={() => setDialog("tour")} canRun={canEdit} />}
          {sessionId === null && data.sessions?.length === 0 && (
            <EmptySessionWelcome onInsert={insertExample} onOpenTour={() => setDialog("tour")} canRun />
          )}
          {shownCells.map((c) => (
            <CellView key={c.id} cell={c} />
          ))}
          {running && <RunningCellView cell={running} onCancel={() => void cancelRunning()} />}
          <div ref={transcriptEnd} />
        </section>

        <p role="status" aria-live="polite" className="min-h-[1.25rem] px-4 text-sm text-ink-soft dark:text-signal-soft" data-testid="console-notice">
          {notice}
        </p>

        <section aria-label="Input" className="border-t border-ink/10 bg-white px-3 py-2 dark:border-paper/10 dark:bg-night-panel">
          {loadingSession ? (
            <p className="py-2 text-sm text-ink/50 dark:text-paper/50">Opening the session…</p>
          ) : canEdit ? (
            <div className="flex items-end gap-2">
              <div className="min-w-0 flex-1 rounded-md border border-ink/20 focus-within:border-signal focus-within:ring-2 focus-within:ring-signal-soft dark:border-paper/20">
                <InputEditor env={env} history={historyEntries} onRun={run} handle={editor} />
              </div>
              <div className="flex flex-col gap-1">
                {running ? (
                  <button type="button" className={buttonSecondary} onClick={() => void cancelRunning()} title="Cancel the running cell (Alt+X)">
                    Cancel
                  </button>
                ) : (
                  <button
                    type="button"
                    className={buttonPrimary}
                    title="Run the input (Enter)"
                    onClick={() => {
                      const source = editor.current?.getText() ?? "";
                      if (source.trim() && run(source)) editor.current?.setText("");
                    }}
                  >
                    Run
                  </button>
                )}
                <button type="button" className={buttonSecondary} onClick={() => setDialog("history")} title="Search earlier inputs (Alt+R)">
                  History
                </button>
              </div>
            </div>
          ) : (
            <p className="py-2 text-sm text-ink-soft dark:text-paper/70">
              You can read this session; running cells needs edit access, which its owner can give you.
            </p>
          )}
        </section>
      </main>

      <CommandPalette open={paletteOpen} onOpenChange={setPaletteOpen} commands={commands} />
      <Modal open={dialog === "history"} title="Input history" onClose={() => setDialog(null)}>
        <HistorySearch
          entries={historyEntries}
          onChoose={(source) => {
            setDialog(null);
            editor.current?.setText(source);
          }}
        />
      </Modal>
      <Modal open={dialog === "tour"} title="Guided first steps" onClose={() => setDialog(null)}>
        <div className="max-h-[70vh] overflow-y-auto pr-1">
          <TourList onInsert={insertExample} canRun={canEdit} />
        </div>
      </Modal>
      <Modal open={dialog === "help"} title="Keyboard" onClose={() => setDialog(null)}>
        <KeyboardHelp />
        <p className={panelHeading}>Every palette command also has a button or a shortcut.</p>
        <a href="/reference" target="_blank" rel="noreferrer" className="text-sm text-ink-soft underline dark:text-signal-soft">
          The notation reference: every function, property and option
        </a>
      </Modal>
    </div>
  );
}
