"use client";
/// The Ringside console: sessions and the named-object shelf on the left, the
/// transcript in the middle, the input at the bottom, the command palette over all, and
/// the sharing, export and import dialogs. The session state lives here; the views under
/// ./views only draw it. Opened with a read-only link (`linkToken`), the console reads
/// that one session with the token on every call and offers nothing that changes it.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { mutate } from "swr";
import { envFromObjects } from "@/lib/editor/notation-env";
import { CellExperiments, useExperimentCommands } from "@/app/_experiments/console-links";
import { createFromSource } from "@/app/_experiments/api";
import { GUIDED_TOUR, type GuidedExample } from "@/lib/examples/tour";
import { cancelCell, createSession, deleteObject, errorOf, exportUrl, keys, messageOf, renameObject, type ExportFormat } from "./api/client";
import { importSession } from "./api/sharing";
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
import { ShareObjectPanel } from "./views/object-share-dialog";
import { ShareSessionPanel } from "./views/share-dialog";
import { SharedObjectsPanel } from "./views/shared-objects-dialog";
import { TransferPanel } from "./views/transfer-dialog";
import { SessionsPanel } from "./views/sessions-panel";
import { Shelf } from "./views/shelf";
import { buttonPrimary, buttonSecondary, focusRing, kbd, panelHeading } from "./views/styles";
import { EmptySessionWelcome, TourList } from "./views/tour";

type DialogName = "history" | "tour" | "help" | "share" | "transfer" | "shared-objects" | null;


/// Keeps the open session in the address (?session=…), so a reload reopens it; the link
/// token stays only while its own session is open.
function rememberSession(id: string, link: string | null) {
  const url = new URL(window.location.href);
  url.searchParams.set("session", id);
  if (link) url.searchParams.set("link", link);
  else url.searchParams.delete("link");
  window.history.replaceState(null, "", url);
}

/// The file name the server proposes (Content-Disposition), else `fallback`.
function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get("content-disposition") ?? "");
  return m?.[1] ?? fallback;
}

const EXPORT_LABEL: Record<ExportFormat, string> = { latex: "LaTeX", markdown: "Markdown", json: "JSON" };
const EXPORT_EXT: Record<ExportFormat, string> = { latex: "tex", markdown: "md", json: "json" };

export interface ConsoleProps {
  /// the session named in the address (?session=)
  readonly initialSessionId: string | null;
  /// the read-only link's token from the address (?link=), for `initialSessionId` only
  readonly linkToken: string | null;
  /// false for a signed-out visitor who came with a link
  readonly signedIn: boolean;
}

/// The console page body.
export function Console({ initialSessionId, linkToken, signedIn }: ConsoleProps) {
  const [sessionId, setSessionId] = useState<string | null>(initialSessionId);
  const link = linkToken !== null && sessionId === initialSessionId ? linkToken : null;
  const data = useSessionData(sessionId, link, signedIn);
  const [sharingObject, setSharingObject] = useState<NamedObject | null>(null);
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
    if (sessionId) rememberSession(sessionId, link);
  }, [sessionId, link]);

  // Running is offered only once the server has said this user may edit the session
  // (a guest or a link holder never sees it); with no session yet, the first run creates one.
  const canEdit = sessionId === null ? signedIn : data.session?.canEdit === true;
  const canShare = signedIn && data.session?.canManageSharing === true;
  const readOnlyLink = link !== null && data.session !== undefined && !data.session.canEdit;
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
    if (!signedIn) return;
    try {
      const title = `Session of ${new Date().toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" })}`;
      const created = await createSession(title);
      await data.refreshSessions();
      openSession(created.id);
      setNotice(`Created “${created.title}”.`);
    } catch (e) {
      setNotice(`Could not create a session: ${messageOf(e)}`);
    }
  }, [data, openSession, signedIn]);

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
          if (id) await Promise.all([mutate(keys.cells(id, link)), mutate(keys.objects(id, link)), mutate(keys.sessions)]);
          runningRef.current = null;
          setRunning(null);
        }
      })();
      return true;
    },
    [canEdit, sessionId, link],
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

  const exportTranscript = useCallback(
    async (format: ExportFormat) => {
      if (!sessionId) {
        setNotice("Open a session to export its transcript.");
        return;
      }
      try {
        const res = await fetch(exportUrl(sessionId, format, link));
        if (!res.ok) {
          setNotice(`Export failed: ${(await errorOf(res)).message}`);
          return;
        }
        const blob = await res.blob();
        const a = document.createElement("a");
        a.href = URL.createObjectURL(blob);
        a.download = fileNameOf(res, `transcript.${EXPORT_EXT[format]}`);
        a.click();
        URL.revokeObjectURL(a.href);
        setNotice(`Transcript exported as ${EXPORT_LABEL[format]} (${a.download}).`);
      } catch (e) {
        setNotice(`Export failed: ${messageOf(e)}`);
      }
    },
    [sessionId, link],
  );

  const importFromFile = useCallback(
    async (text: string, fileName: string): Promise<string | null> => {
      try {
        const { session } = await importSession(text);
        await data.refreshSessions();
        setDialog(null);
        openSession(session.id);
        setNotice(`Imported “${session.title}” from ${fileName}: ${session.cells} cells, ${session.objects} named objects.`);
        return null;
      } catch (e) {
        return `Could not import ${fileName}: ${messageOf(e)}`;
      }
    },
    [data, openSession],
  );

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

  const experimentCommands = useExperimentCommands(sessionId, cells, canEdit, signedIn, setNotice);
  // The tour's sweep step: run it as an experiment in this session (made first if none) and open its plot.
  const runTourExperiment = useCallback(
    async (e: GuidedExample) => {
      try {
        let id = sessionId;
        if (!id) {
          id = (await createSession("First session")).id;
          setSessionId(id);
        }
        const { experiment } = await createFromSource(id, e.source);
        window.location.assign(`/experiments/${experiment.id}?view=plots&plot=heat`);
      } catch (err) {
        setDialog(null);
        setNotice(`The experiment did not start: ${messageOf(err)}`);
      }
    },
    [sessionId],
  );

  const focusFirst = (selector: string) => document.querySelector<HTMLElement>(selector)?.focus();

  const commands = useMemo((): PaletteCommand[] => {
    const list: PaletteCommand[] = [
      // a signed-out link visitor has no sessions of their own: the command sends them to sign in
      { id: "new-session", group: "Session", label: signedIn ? "New session" : "New session (sign in first)", shortcut: "Alt+N", run: () => (signedIn ? void newSession() : window.location.assign("/sign-in")) },
      { id: "transfer", group: "Session", label: signedIn ? "Export or import…" : "Export the transcript…", shortcut: "Alt+E", run: () => setDialog("transfer") },
      { id: "history", group: "Input", label: "Search the input history", shortcut: "Alt+R", run: () => setDialog("history") },
      { id: "tour", group: "Help", label: "Guided first steps", shortcut: "Alt+G", keywords: ["examples", "tour"], run: () => setDialog("tour") },
      { id: "help", group: "Help", label: "Keyboard help", shortcut: "Alt+/", keywords: ["shortcuts", "keys"], run: () => setDialog("help") },
      { id: "reference", group: "Help", label: "Open the notation reference", keywords: ["functions", "properties"], run: () => window.open("/reference", "_blank") },
      { id: "theme", group: "View", label: theme === "dark" ? "Switch to the light theme" : "Switch to the dark theme", shortcut: "Alt+T", run: toggleTheme },
    ];
    if (sessionId) {
      for (const format of ["latex", "markdown", "json"] as const) {
        list.push({ id: `export-${format}`, group: "Export", label: `Export the transcript as ${EXPORT_LABEL[format]}`, keywords: ["download"], run: () => void exportTranscript(format) });
      }
    }
    if (signedIn) {
      list.push(
        { id: "import-session", group: "Session", label: "Import a session from a JSON export…", keywords: ["upload", "file"], run: () => setDialog("transfer") },
        { id: "shared-objects", group: "Sharing", label: "Objects shared with me…", keywords: ["import", "copy"], run: () => setDialog("shared-objects") },
        { id: "teams", group: "Sharing", label: "Open the Teams page", keywords: ["group", "members", "invite"], run: () => window.location.assign("/teams") },
      );
    }
    if (canShare) {
      list.push(
        { id: "share", group: "Sharing", label: "Share this session…", keywords: ["team", "viewer", "editor"], run: () => setDialog("share") },
        { id: "link", group: "Sharing", label: "Publish or revoke the read-only link…", keywords: ["url", "public"], run: () => setDialog("share") },
      );
      for (const o of objects ?? []) {
        list.push({ id: `share-object-${o.id}`, group: "Sharing", label: `Share named object: ${o.name}`, run: () => setSharingObject(o) });
      }
    }
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
    list.push(...experimentCommands);
    return list;
  }, [experimentCommands, theme, toggleTheme, canEdit, canShare, signedIn, sessionId, running, data.sessions, objects, newSession, exportTranscript, run, cancelRunning, insertExample, openSession, insertName]);

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
        KeyE: () => setDialog("transfer"),
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
  }, [newSession, cancelRunning, toggleTheme]);

  const shownCells = (cells ?? []).filter((c) => !(running && c.id === running.cellId));
  const empty = cells !== undefined && cells.length === 0 && !running;

  return (
    <div className="grid min-h-0 flex-1 grid-cols-[17rem_minmax(0,1fr)] bg-paper text-ink dark:bg-night dark:text-paper">
      <aside className="flex min-h-0 flex-col gap-4 border-r border-ink/10 bg-paper-deep/40 p-3 dark:border-paper/10 dark:bg-night-panel">
        {signedIn ? (
          <SessionsPanel
            sessions={data.sessions}
            error={data.sessionsError}
            currentId={sessionId}
            onOpen={openSession}
            onNew={() => void newSession()}
            onImport={() => setDialog("transfer")}
          />
        ) : (
          <p className="text-sm text-ink-soft dark:text-paper/70">You are reading one session through its read-only link. Sign in to work in sessions of your own.</p>
        )}
        <Shelf
          objects={objects}
          canEdit={canEdit}
          onInsert={insertName}
          onRename={renameOne}
          onDelete={deleteOne}
          onShare={canShare ? setSharingObject : undefined}
          onOpenShared={signedIn ? () => setDialog("shared-objects") : undefined}
        />
      </aside>

      <main className="flex min-h-0 min-w-0 flex-col">
        <div className="flex items-center gap-2 border-b border-ink/10 px-4 py-2 dark:border-paper/10">
          <h1 className="truncate text-sm font-semibold" data-testid="session-title">
            {data.session?.title ?? (sessionId ? "…" : "No session open")}
          </h1>
          {data.session && !data.session.canEdit && (
            <span className="rounded bg-signal-soft px-1.5 py-0.5 text-xs text-ink dark:bg-signal/30 dark:text-paper" data-testid="read-only-badge">
              {readOnlyLink ? "read-only shared link" : "read-only"}
            </span>
          )}
          <span className="ml-auto flex items-center gap-1.5">
            <button type="button" className={buttonSecondary} onClick={() => setPaletteOpen(true)} title="Command palette">
              Commands <kbd className={kbd}>Ctrl K</kbd>
            </button>
            <button type="button" className={buttonSecondary} onClick={() => setDialog("tour")} title="Guided first steps (Alt+G)">
              First steps
            </button>
            {canShare && (
              <button type="button" className={buttonSecondary} onClick={() => setDialog("share")} title="Share this session, publish a read-only link">
                Share
              </button>
            )}
            {(sessionId || signedIn) && (
              <button type="button" className={buttonSecondary} onClick={() => setDialog("transfer")} title="Export the transcript or import a session (Alt+E)">
                Export
              </button>
            )}
            <button type="button" className={buttonSecondary} onClick={() => setDialog("help")} title="Keyboard help (Alt+/)">
              Keys
            </button>
            <button type="button" className={buttonSecondary} onClick={toggleTheme} aria-pressed={theme === "dark"} title="Switch theme (Alt+T)">
              {theme === "dark" ? "Light" : "Dark"}
            </button>
          </span>
        </div>

        {readOnlyLink && (
          <p role="note" className="border-b border-signal/30 bg-signal-soft/40 px-4 py-1.5 text-sm dark:bg-signal/15" data-testid="link-banner">
            You are reading {data.session?.ownerName ? `${data.session.ownerName}'s session` : "this session"} through a read-only shared link:
            the transcript and named objects can be read and exported, nothing can be run.
          </p>
        )}
        <section aria-label="Transcript" tabIndex={0} className={`min-h-0 flex-1 overflow-y-auto px-4 ${focusRing}`}>
          {data.sessionError && (
            <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">
              {link && data.sessionStatus === 404 ? "This read-only link does not open a session: it was revoked, or the address is incomplete." : data.sessionError}
            </p>
          )}
          {data.cellsError && !data.sessionError && <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">{data.cellsError}</p>}
          {empty && <EmptySessionWelcome onInsert={insertExample} onOpenTour={() => setDialog("tour")} canRun={canEdit} />}
          {sessionId === null && data.sessions?.length === 0 && (
            <EmptySessionWelcome onInsert={insertExample} onOpenTour={() => setDialog("tour")} canRun />
          )}
          {shownCells.map((c) => (
            <CellView key={c.id} cell={c} footer={<CellExperiments cell={c} sessionId={sessionId} canEdit={canEdit} signedIn={signedIn} />} />
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
              {readOnlyLink
                ? "This is a read-only shared link: cells cannot be run through it."
                : "You can read this session; running cells needs edit access, which its owner can give you."}
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
          <TourList onInsert={insertExample} canRun={canEdit} onRunExperiment={signedIn && (canEdit || sessionId === null) ? (e) => void runTourExperiment(e) : undefined} />
        </div>
      </Modal>
      <Modal open={dialog === "share" && sessionId !== null} title={`Share “${data.session?.title ?? "this session"}”`} onClose={() => setDialog(null)}>
        {sessionId && <ShareSessionPanel sessionId={sessionId} onChanged={setNotice} />}
      </Modal>
      <Modal open={sharingObject !== null} title={`Share the named object ${sharingObject?.name ?? ""}`} onClose={() => setSharingObject(null)}>
        {sharingObject && <ShareObjectPanel object={sharingObject} onChanged={setNotice} />}
      </Modal>
      <Modal open={dialog === "shared-objects"} title="Objects shared with me" onClose={() => setDialog(null)}>
        <SharedObjectsPanel
          targetSessionId={canEdit ? sessionId : null}
          onImported={(notice) => {
            setNotice(notice);
            setDialog(null);
            void data.refreshObjects();
          }}
        />
      </Modal>
      <Modal open={dialog === "transfer"} title={signedIn ? "Export or import" : "Export the transcript"} onClose={() => setDialog(null)}>
        <TransferPanel canExport={sessionId !== null} canImport={signedIn} onExport={exportTranscript} onImport={importFromFile} />
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
