"use client";
/// The console's state and commands in one hook: which session is open (and the read-only
/// link that opened it), its documents, the running cell, the notice line, the open dialog,
/// and every command the views, the palette and the shortcuts call. The views only draw
/// what this returns.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { mutate } from "swr";
import { ApiError, messageOf } from "@/app/_client/fetch";
import { envFromObjects } from "@/lib/editor/notation-env";
import type { GuidedExample } from "@/lib/examples/tour";
import type { NamedObject } from "@/lib/wire/reading";
import { cancelCell, createSession, deleteObject, keys, renameObject, type ExportFormat } from "./api/client";
import { runCell } from "./api/cell-stream";
import { importSession } from "./api/sharing";
import type { EditorHandle } from "./input-editor";
import { applyCellEvent, startedCell, type RunningCell } from "./state/running-cell";
import { downloadTranscript } from "./transcript-export";
import { useSessionData } from "./use-session-data";

export type DialogName = "history" | "tour" | "help" | "share" | "transfer" | "shared-objects" | "library" | "export" | null;

/// A cell the server held back because it would replace names someone else defined: the
/// console asks, then runs it with `redefine` or gives the source back to the input.
export interface PendingRedefinition {
  readonly source: string;
  readonly message: string;
}

/// Keeps the open session in the address (?session=…), so a reload reopens it; the link
/// token stays only while its own session is open.
function rememberSession(id: string, link: string | null) {
  const url = new URL(window.location.href);
  url.searchParams.set("session", id);
  if (link) url.searchParams.set("link", link);
  else url.searchParams.delete("link");
  window.history.replaceState(null, "", url);
}

export interface ConsoleOptions {
  /// the session named in the address (?session=)
  readonly initialSessionId: string | null;
  /// the read-only link's token from the address (?link=), for `initialSessionId` only
  readonly linkToken: string | null;
  /// false for a signed-out visitor who came with a link
  readonly signedIn: boolean;
}

export function useConsole({ initialSessionId, linkToken, signedIn }: ConsoleOptions) {
  const [sessionId, setSessionId] = useState<string | null>(initialSessionId);
  const link = linkToken !== null && sessionId === initialSessionId ? linkToken : null;
  const data = useSessionData(sessionId, link, signedIn);
  const [sharingObject, setSharingObject] = useState<NamedObject | null>(null);
  const [running, setRunning] = useState<RunningCell | null>(null);
  const [dialog, setDialog] = useState<DialogName>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [pendingRedefinition, setPendingRedefinition] = useState<PendingRedefinition | null>(null);
  // the session the guided steps run in, made for them on this page (never someone else's)
  const tourSession = useRef<string | null>(null);
  const editor = useRef<EditorHandle>(null);
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

  const openSession = useCallback((id: string) => {
    setSessionId(id);
    setNotice(null);
    editor.current?.focus();
  }, []);

  const newSession = useCallback(async () => {
    if (!signedIn) return;
    try {
      // no title: the server names the session by its first definition
      const created = await createSession();
      await data.refreshSessions();
      openSession(created.id);
      setNotice(`Created “${created.title}”.`);
    } catch (e) {
      setNotice(`Could not create a session: ${messageOf(e)}`);
    }
  }, [data, openSession, signedIn]);

  const run = useCallback(
    (source: string, options: { redefine?: boolean } = {}): boolean => {
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
            const created = await createSession();
            id = created.id;
            setSessionId(id);
          }
          await runCell(
            id,
            source,
            (event) => {
              if (event.event === "accepted") accepted = true;
              setRunning((c) => (c ? applyCellEvent(c, event) : c));
            },
            undefined,
            options,
          );
        } catch (e) {
          if (e instanceof ApiError && e.code === "redefines_others") {
            // nothing ran: ask first (the dialog runs it again, or gives the source back)
            setPendingRedefinition({ source, message: e.message });
          } else {
            setNotice(`The cell did not run: ${messageOf(e)}`);
            if (!accepted) editor.current?.setText(source);
          }
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

  /// Runs what the input holds and clears it (the Run button and the palette's command).
  const runInput = useCallback(() => {
    const source = editor.current?.getText() ?? "";
    if (source.trim() && run(source)) editor.current?.setText("");
  }, [run]);

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

  /// After a session was deleted: leave it when it was open (the most recent one opens).
  const sessionDeleted = useCallback(
    (id: string) => {
      setNotice("The session was deleted.");
      if (id === sessionId) setSessionId(null);
    },
    [sessionId],
  );

  /// The answer to the redefinition question: run the cell replacing the names, or not.
  const answerRedefinition = useCallback(
    (replace: boolean) => {
      const pending = pendingRedefinition;
      setPendingRedefinition(null);
      if (!pending) return;
      if (replace) run(pending.source, { redefine: true });
      else {
        editor.current?.setText(pending.source);
        setNotice("Not run: choose another name for the definition, or run it again and confirm.");
      }
    },
    [pendingRedefinition, run],
  );

  const insertName = useCallback((name: string) => editor.current?.insert(name), []);
  // The input is drawn again when another session opens; text for it waits until it is there.
  const pendingText = useRef<string | null>(null);
  const putText = useCallback((text: string) => {
    if (editor.current) editor.current.setText(text);
    else pendingText.current = text;
  }, []);
  useEffect(() => {
    if (pendingText.current !== null && editor.current) {
      editor.current.setText(pendingText.current);
      pendingText.current = null;
    }
  });
  /// The guided steps always run in the reader's own new session: an empty session of
  /// their own is used as it is; otherwise (someone else's session, or one with work in it)
  /// a new one is made for the tour once, and later steps go there too.
  const insertExample = useCallback(
    async (e: GuidedExample) => {
      setDialog(null);
      const ownEmpty = data.session?.access === "owner" && (data.cells?.length ?? 0) === 0;
      if (signedIn && sessionId !== null && !ownEmpty && tourSession.current !== sessionId) {
        try {
          const created = await createSession("Guided first steps");
          tourSession.current = created.id;
          await data.refreshSessions();
          setSessionId(created.id);
          setNotice(`The guided steps run in a new session of your own, “${created.title}”.`);
          pendingText.current = e.source;
          return;
        } catch (err) {
          setNotice(`Could not make a session for the guided steps: ${messageOf(err)}`);
          return;
        }
      }
      putText(e.source);
    },
    [data, sessionId, signedIn, putText],
  );
  const recallInput = useCallback((source: string) => {
    setDialog(null);
    editor.current?.setText(source);
  }, []);

  const exportTranscript = useCallback(
    async (format: ExportFormat) => {
      if (!sessionId) {
        setNotice("Open a session to export its transcript.");
        return;
      }
      try {
        setNotice(await downloadTranscript(sessionId, format, link));
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

  /// Changes a named object and reloads the shelf; the error's words, or null when done.
  const changeObject = useCallback(
    async (change: (sessionId: string) => Promise<unknown>): Promise<string | null> => {
      if (!sessionId) return "No session is open.";
      try {
        await change(sessionId);
        await data.refreshObjects();
        return null;
      } catch (e) {
        return messageOf(e);
      }
    },
    [sessionId, data],
  );
  const renameOne = useCallback((o: NamedObject, name: string) => changeObject((id) => renameObject(id, o.id, name)), [changeObject]);
  const deleteOne = useCallback((o: NamedObject) => changeObject((id) => deleteObject(id, o.id)), [changeObject]);

  const objectsImported = useCallback(
    (words: string) => {
      setNotice(words);
      setDialog(null);
      void data.refreshObjects();
    },
    [data],
  );

  return {
    pendingRedefinition,
    answerRedefinition,
    sessionDeleted,
    signedIn,
    sessionId,
    link,
    data,
    cells,
    objects,
    running,
    notice,
    setNotice,
    dialog,
    setDialog,
    sharingObject,
    setSharingObject,
    editor,
    canEdit,
    canShare,
    readOnlyLink,
    loadingSession,
    historyEntries,
    env,
    openSession,
    newSession,
    run,
    runInput,
    cancelRunning,
    insertName,
    insertExample,
    recallInput,
    exportTranscript,
    importFromFile,
    renameOne,
    deleteOne,
    objectsImported,
  };
}

export type ConsoleState = ReturnType<typeof useConsole>;
