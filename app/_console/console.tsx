"use client";
/// The Ringside console: sessions and the named-object shelf on the left, the toolbar, the
/// transcript and the input in the middle, the command palette over all, and the dialogs.
/// The state and the commands are `useConsole`; the palette's commands are data
/// (`paletteCommands`); this component only lays the parts out. Opened with a read-only
/// link (`linkToken`), the console reads that one session with the token on every call and
/// offers nothing that changes it.
import { useCallback, useMemo, useState } from "react";
import { createFromSource } from "@/app/_experiments/api";
import { CellExperiments, useExperimentCommands } from "@/app/_experiments/console-links";
import type { GuidedExample } from "@/lib/examples/tour";
import { messageOf } from "@/app/_client/fetch";
import { createSession, detailUrl } from "./api/client";
import { paletteCommands } from "./palette-commands";
import { useTheme } from "./theme";
import { useConsole, type ConsoleOptions, type DialogName } from "./use-console";
import { useShortcuts } from "./use-shortcuts";
import { CommandPalette } from "./views/command-palette";
import { ConsoleDialogs } from "./views/dialogs";
import { InputBar } from "./views/input-bar";
import { SessionsPanel } from "./views/sessions-panel";
import { Shelf } from "./views/shelf";
import { Toolbar } from "./views/toolbar";
import { Transcript } from "./views/transcript";

export type ConsoleProps = ConsoleOptions;

const focusFirst = (selector: string) => document.querySelector<HTMLElement>(selector)?.focus();

/// The console page body.
export function Console(props: ConsoleProps) {
  const c = useConsole(props);
  const { signedIn, sessionId, data, objects, running, editor, setDialog, setSharingObject, newSession, cancelRunning } = c;
  const { canEdit, canShare, exportTranscript, runInput, insertExample, openSession, insertName } = c;
  const { theme, toggle: toggleTheme } = useTheme();
  const [paletteOpen, setPaletteOpen] = useState(false);
  const openDialog = useCallback((d: Exclude<DialogName, null>) => setDialog(d), [setDialog]);
  const closeDialog = useCallback(() => setDialog(null), [setDialog]);

  // the experiments room: palette commands, a cell's links, the tour's sweep step
  const experimentCommands = useExperimentCommands(sessionId, c.cells, canEdit, signedIn, c.link, c.setNotice);
  const runTourExperiment = useCallback(
    async (e: GuidedExample) => {
      try {
        const id = sessionId ?? (await createSession("First session")).id;
        const { experiment } = await createFromSource(id, e.source);
        window.location.assign(`/experiments/${experiment.id}?view=plots&plot=heat`);
      } catch (err) {
        setDialog(null);
        c.setNotice(`The experiment did not start: ${messageOf(err)}`);
      }
    },
    [sessionId, setDialog, c],
  );
  const cellFooter = useCallback(
    (cell: Parameters<typeof CellExperiments>[0]["cell"]) => (
      <CellExperiments cell={cell} sessionId={sessionId} canEdit={canEdit} signedIn={signedIn} link={c.link} />
    ),
    [sessionId, canEdit, signedIn, c.link],
  );

  // The whole of a value stored as a summary, from the open session (with its link token).
  const link = c.link;
  const detailAddress = useMemo(
    () => (sessionId ? (detailId: string) => detailUrl(sessionId, detailId, link) : undefined),
    [sessionId, link],
  );

  const commands = useMemo(
    () => [
      ...paletteCommands({
        signedIn,
        canEdit,
        canShare,
        sessionId,
        running: running !== null,
        theme,
        sessions: data.sessions ?? [],
        objects: objects ?? [],
        actions: {
          newSession: () => void newSession(),
          openDialog,
          toggleTheme,
          exportTranscript: (format) => void exportTranscript(format),
          shareObject: setSharingObject,
          runInput,
          cancelRunning: () => void cancelRunning(),
          insertExample,
          openSession,
          insertName,
          goTo: (path) => window.location.assign(path),
          openInNewTab: (path) => void window.open(path, "_blank"),
        },
      }),
      ...experimentCommands,
    ],
    [
      experimentCommands,
      signedIn,
      canEdit,
      canShare,
      sessionId,
      running,
      theme,
      data.sessions,
      objects,
      newSession,
      openDialog,
      toggleTheme,
      exportTranscript,
      setSharingObject,
      runInput,
      cancelRunning,
      insertExample,
      openSession,
      insertName,
    ],
  );

  const togglePalette = useCallback(() => setPaletteOpen((o) => !o), []);
  const altActions = useMemo(
    (): Record<string, () => void> => ({
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
    }),
    [newSession, cancelRunning, toggleTheme, editor, setDialog],
  );
  useShortcuts(togglePalette, altActions);

  const sessionError =
    data.sessionError && c.link && data.sessionStatus === 404
      ? "This read-only link does not open a session: it was revoked, or the address is incomplete."
      : data.sessionError;

  return (
    // From md (768 px) up: sessions and shelf beside the transcript. Narrower (a phone, read-only
    // use): one column, the transcript first and the panels under it, nothing wider than the screen.
    <div className="flex min-h-0 min-w-0 flex-1 flex-col bg-paper text-ink md:grid md:grid-cols-[17rem_minmax(0,1fr)] dark:bg-night dark:text-paper">
      <aside className="order-2 flex min-h-0 min-w-0 flex-col gap-4 border-t border-ink/10 bg-paper-deep/40 p-3 md:order-none md:border-r md:border-t-0 dark:border-paper/10 dark:bg-night-panel">
        {signedIn ? (
          <SessionsPanel
            sessions={data.sessions}
            error={data.sessionsError}
            currentId={sessionId}
            onOpen={c.openSession}
            onNew={() => void newSession()}
            onImport={() => setDialog("transfer")}
            onDeleted={c.sessionDeleted}
          />
        ) : (
          <p className="text-sm text-ink-soft dark:text-paper/70">
            You are reading one session through its read-only link. Sign in to work in sessions of your own.
          </p>
        )}
        <Shelf
          objects={objects}
          canEdit={c.canEdit}
          onInsert={c.insertName}
          onRename={c.renameOne}
          onDelete={c.deleteOne}
          onShare={c.canShare ? setSharingObject : undefined}
          onOpenShared={signedIn ? () => setDialog("shared-objects") : undefined}
          onOpenLibrary={signedIn ? () => setDialog("library") : undefined}
        />
      </aside>

      <main className="order-1 flex min-h-[70vh] min-w-0 flex-col md:order-none md:min-h-0">
        <Toolbar
          session={data.session}
          sessionId={sessionId}
          signedIn={signedIn}
          canShare={c.canShare}
          readOnlyLink={c.readOnlyLink}
          theme={theme}
          onPalette={() => setPaletteOpen(true)}
          onDialog={openDialog}
          onToggleTheme={toggleTheme}
        />
        <Transcript
          objects={objects}
          cells={c.cells}
          running={running}
          noSessions={sessionId === null && data.sessions?.length === 0}
          canEdit={c.canEdit}
          sessionError={sessionError}
          cellsError={data.cellsError}
          onInsertExample={c.insertExample}
          onOpenTour={() => setDialog("tour")}
          onCancel={() => void cancelRunning()}
          cellFooter={cellFooter}
          detailAddress={detailAddress}
        />
        <p
          role="status"
          aria-live="polite"
          className="min-h-[1.25rem] px-4 text-sm text-ink-soft dark:text-signal-soft"
          data-testid="console-notice"
        >
          {c.notice}
        </p>
        <InputBar
          loading={c.loadingSession}
          canEdit={c.canEdit}
          readOnlyLink={c.readOnlyLink}
          running={running !== null}
          env={c.env}
          history={c.historyEntries}
          editor={editor}
          onRun={c.run}
          onRunInput={c.runInput}
          onCancel={() => void cancelRunning()}
          onHistory={() => setDialog("history")}
        />
      </main>

      <CommandPalette open={paletteOpen} onOpenChange={setPaletteOpen} commands={commands} />
      <ConsoleDialogs
        dialog={c.dialog}
        onClose={closeDialog}
        session={data.session}
        sessionId={sessionId}
        signedIn={signedIn}
        canEdit={c.canEdit}
        history={c.historyEntries}
        sharingObject={c.sharingObject}
        onCloseSharingObject={() => setSharingObject(null)}
        onRecall={c.recallInput}
        onInsertExample={c.insertExample}
        onNotice={c.setNotice}
        onObjectsImported={c.objectsImported}
        onExport={c.exportTranscript}
        onImport={c.importFromFile}
        link={c.link}
        cells={c.cells ?? []}
        onChooseCells={() => setDialog("export")}
        pendingRedefinition={c.pendingRedefinition}
        onAnswerRedefinition={c.answerRedefinition}
        onRunTourExperiment={signedIn && (canEdit || sessionId === null) ? (e) => void runTourExperiment(e) : undefined}
      />
    </div>
  );
}
