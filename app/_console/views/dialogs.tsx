"use client";
/// The console's dialogs, one open at a time (plus the share dialog of one named object):
/// input history, guided first steps, sharing the session or an object, objects shared
/// with me, export and import, keyboard help.
import type { GuidedExample } from "@/lib/examples/tour";
import type { Cell, NamedObject, SessionDetail } from "@/lib/wire/reading";
import type { ExportFormat } from "../api/client";
import type { DialogName, PendingRedefinition } from "../use-console";
import { ExportPanel } from "./export-dialog";
import { LibraryPanel } from "./library-dialog";
import { HistorySearch } from "./history-search";
import { KeyboardHelp } from "./keyboard-help";
import { Modal } from "./modal";
import { ShareObjectPanel } from "./object-share-dialog";
import { ShareSessionPanel } from "./share-dialog";
import { SharedObjectsPanel } from "./shared-objects-dialog";
import { buttonPrimary, buttonSecondary, panelHeading } from "./styles";
import { TourList } from "./tour";
import { TransferPanel } from "./transfer-dialog";

export function ConsoleDialogs(props: {
  dialog: DialogName;
  onClose: () => void;
  session: SessionDetail | undefined;
  sessionId: string | null;
  signedIn: boolean;
  canEdit: boolean;
  history: readonly string[];
  sharingObject: NamedObject | null;
  onCloseSharingObject: () => void;
  onRecall: (source: string) => void;
  onInsertExample: (e: GuidedExample) => void;
  onNotice: (words: string) => void;
  onObjectsImported: (words: string) => void;
  onExport: (format: ExportFormat) => Promise<void>;
  onImport: (text: string, fileName: string) => Promise<string | null>;
  link: string | null;
  cells: readonly Cell[];
  onChooseCells: () => void;
  pendingRedefinition: PendingRedefinition | null;
  onAnswerRedefinition: (replace: boolean) => void;
  /// the tour's sweep step: run it as an experiment and open its plot (experiments room)
  onRunTourExperiment?: (e: GuidedExample) => void;
}) {
  const { dialog, onClose, session, sessionId, signedIn, canEdit, history, sharingObject } = props;
  return (
    <>
      <Modal open={dialog === "history"} title="Input history" onClose={onClose}>
        <HistorySearch entries={history} onChoose={props.onRecall} />
      </Modal>
      <Modal open={dialog === "tour"} title="Guided first steps" onClose={onClose}>
        <div className="max-h-[70vh] overflow-y-auto pr-1">
          {/* the steps run in a session of the reader's own (useConsole.insertExample), so any signed-in reader may run them */}
          <TourList onInsert={props.onInsertExample} canRun={signedIn} onRunExperiment={props.onRunTourExperiment} />
        </div>
      </Modal>
      <Modal open={dialog === "share" && sessionId !== null} title={`Share “${session?.title ?? "this session"}”`} onClose={onClose}>
        {sessionId && <ShareSessionPanel sessionId={sessionId} onChanged={props.onNotice} />}
      </Modal>
      <Modal
        open={sharingObject !== null}
        title={`Share the named object ${sharingObject?.name ?? ""}`}
        onClose={props.onCloseSharingObject}
      >
        {sharingObject && <ShareObjectPanel object={sharingObject} onChanged={props.onNotice} />}
      </Modal>
      <Modal open={dialog === "shared-objects"} title="Objects shared with me" onClose={onClose}>
        <SharedObjectsPanel targetSessionId={canEdit ? sessionId : null} onImported={props.onObjectsImported} />
      </Modal>
      <Modal open={dialog === "transfer"} title={signedIn ? "Export or import" : "Export the transcript"} onClose={onClose}>
        <TransferPanel
          canExport={sessionId !== null}
          canImport={signedIn}
          onExport={props.onExport}
          onImport={props.onImport}
          onChooseCells={props.onChooseCells}
        />
      </Modal>
      <Modal open={dialog === "library"} title="Library" onClose={onClose}>
        <LibraryPanel targetSessionId={canEdit ? sessionId : null} onInserted={props.onObjectsImported} />
      </Modal>
      <Modal open={dialog === "export" && sessionId !== null} title="Export" onClose={onClose}>
        {sessionId && <ExportPanel sessionId={sessionId} link={props.link} cells={props.cells} onDone={props.onNotice} />}
      </Modal>
      <Modal
        open={props.pendingRedefinition !== null}
        title="Replace a name someone else defined?"
        onClose={() => props.onAnswerRedefinition(false)}
      >
        <p className="text-sm" data-testid="redefine-question">
          {props.pendingRedefinition?.message}
        </p>
        <span className="flex gap-2">
          <button type="button" className={buttonPrimary} onClick={() => props.onAnswerRedefinition(true)}>
            Replace it
          </button>
          <button type="button" className={buttonSecondary} onClick={() => props.onAnswerRedefinition(false)} data-autofocus>
            Keep theirs
          </button>
        </span>
      </Modal>
      <Modal open={dialog === "help"} title="Keyboard" onClose={onClose}>
        <KeyboardHelp />
        <p className={panelHeading}>Every palette command also has a button or a shortcut.</p>
        <a href="/reference" target="_blank" rel="noreferrer" className="text-sm text-ink-soft underline dark:text-signal-soft">
          The notation reference: every function, property and option
        </a>
      </Modal>
    </>
  );
}
