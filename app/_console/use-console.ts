"use client";
/// The console's state and commands in one hook: which session is open (and the read-only
/// link that opened it), its documents, the running cell, the notice line, the open dialog,
/// and every command the views, the palette and the shortcuts call. The views only draw
/// what this returns.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { mutate } from "swr";
import { messageOf } from "@/app/_client/fetch";
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

export type DialogName = "history" | "tour" | "help" | "share" | "transfer" | "shared-objects" | null;

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

  const insertName = useCallback((name: string) => editor.current?.insert(name), []);
  const insertExample = useCallback((e: GuidedExample) => {
    setDialog(null);
    editor.current?.setText(e.source);
  }, []);
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
