"use client";
/// The named-object shelf: every object of the session with its type and one-line
/// summary (and, for an imported copy, where it came from). Clicking a name inserts it
/// into the input; rename and delete ask first; Share opens the object's sharing dialog.
import { useState } from "react";
import type { NamedObject, ObjectOrigin } from "@/lib/wire/reading";
import { Modal } from "./modal";
import { typeWords } from "../render/type-words";
import { buttonPrimary, buttonQuiet, buttonSecondary, focusRing, panelHeading, textInput } from "./styles";

export interface ShelfProps {
  readonly objects: readonly NamedObject[] | undefined;
  readonly canEdit: boolean;
  readonly onInsert: (name: string) => void;
  readonly onRename: (o: NamedObject, name: string) => Promise<string | null>;
  readonly onDelete: (o: NamedObject) => Promise<string | null>;
  /// present when I may share the session's objects (its owner or a lead of its team)
  readonly onShare?: (o: NamedObject) => void;
  /// present when I am signed in: opens the objects others shared with me
  readonly onOpenShared?: () => void;
  /// opens the library: my named objects across sessions, and those shared with me
  readonly onOpenLibrary?: () => void;
}

/// "from Ada's session “Harbour ideals” (b)": where an imported copy came from.
function originLine(origin: ObjectOrigin): string {
  if (origin.kind === "object") {
    const whose = origin.ownerName ? `${origin.ownerName}'s session` : "the session";
    return `from ${whose} “${origin.sessionTitle ?? ""}”${origin.name ? ` (${origin.name})` : ""}`;
  }
  return `from an imported export${origin.sessionTitle ? ` of “${origin.sessionTitle}”` : ""}`;
}

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

/// The shelf of named objects.
export function Shelf({ objects, canEdit, onInsert, onRename, onDelete, onShare, onOpenShared, onOpenLibrary }: ShelfProps) {
  const [renaming, setRenaming] = useState<NamedObject | null>(null);
  const [deleting, setDeleting] = useState<NamedObject | null>(null);
  const [newName, setNewName] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const close = () => {
    setRenaming(null);
    setDeleting(null);
    setProblem(null);
    setBusy(false);
  };

  const confirmRename = async () => {
    if (!renaming) return;
    if (!NAME.test(newName)) {
      setProblem("A name starts with a letter and has only letters, digits, _ and '.");
      return;
    }
    setBusy(true);
    const err = await onRename(renaming, newName);
    if (err) {
      setProblem(err);
      setBusy(false);
    } else close();
  };

  const confirmDelete = async () => {
    if (!deleting) return;
    setBusy(true);
    const err = await onDelete(deleting);
    if (err) {
      setProblem(err);
      setBusy(false);
    } else close();
  };

  return (
    <section aria-label="Shelf" className="flex min-h-0 flex-1 flex-col gap-2">
      <div className="flex items-center justify-between">
        <h2 className={panelHeading}>Named objects</h2>
        <span className="flex flex-wrap gap-0.5">
          {onOpenLibrary && (
            <button
              type="button"
              className={buttonQuiet}
              onClick={onOpenLibrary}
              title="Your named objects across sessions, and those shared with you"
            >
              Library
            </button>
          )}
          {onOpenShared && (
            <button type="button" className={buttonQuiet} onClick={onOpenShared} title="Objects others shared with you">
              Shared with me
            </button>
          )}
        </span>
      </div>
      {objects && objects.length === 0 && (
        <p className="text-sm text-ink/60 dark:text-paper/60">
          Nothing yet. <code className="font-mono">name := …</code> puts a value here.
        </p>
      )}
      <ul id="rs-shelf" className="flex min-h-0 flex-col gap-1 overflow-y-auto">
        {objects?.map((o) => (
          <li key={o.id} className="group rounded px-1 py-0.5 hover:bg-ink/5 dark:hover:bg-paper/5" data-object-name={o.name}>
            {/* wraps instead of clipping: a long name or a narrow panel moves the buttons to a line of their own */}
            <div className="flex flex-wrap items-center gap-x-2 gap-y-0.5">
              <button
                type="button"
                onClick={() => onInsert(o.name)}
                title={`Insert ${o.name} into the input`}
                className={`min-w-0 max-w-full truncate rounded px-1 font-mono text-sm font-semibold ${focusRing}`}
              >
                {o.name}
              </button>
              <span className="shrink-0 rounded bg-ink/10 px-1.5 text-[0.7rem] text-ink-soft dark:bg-paper/10 dark:text-paper/70">
                {typeWords(o.type)}
              </span>
              {(canEdit || onShare) && (
                <span className="ml-auto flex shrink-0 flex-wrap gap-0.5">
                  {onShare && (
                    <button type="button" className={buttonQuiet} aria-label={`Share ${o.name}`} onClick={() => onShare(o)}>
                      Share
                    </button>
                  )}
                  {canEdit && (
                    <button
                      type="button"
                      className={buttonQuiet}
                      aria-label={`Rename ${o.name}`}
                      onClick={() => {
                        setNewName(o.name);
                        setRenaming(o);
                      }}
                    >
                      Rename
                    </button>
                  )}
                  {canEdit && (
                    <button type="button" className={buttonQuiet} aria-label={`Delete ${o.name}`} onClick={() => setDeleting(o)}>
                      Delete
                    </button>
                  )}
                </span>
              )}
            </div>
            <p className="truncate pl-1 font-mono text-xs text-ink/60 dark:text-paper/60" title={o.summary}>
              {o.summary}
            </p>
            {o.origin && (
              <p
                className="truncate pl-1 text-[0.7rem] italic text-ink-soft dark:text-signal-soft"
                data-testid="object-origin"
                title={originLine(o.origin)}
              >
                {originLine(o.origin)}
              </p>
            )}
          </li>
        ))}
      </ul>

      <Modal open={renaming !== null} title={`Rename ${renaming?.name ?? ""}`} onClose={close}>
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            void confirmRename();
          }}
        >
          <label className="text-sm">
            New name
            <input autoFocus className={textInput} value={newName} onChange={(e) => setNewName(e.target.value)} />
          </label>
          <p className="text-xs text-ink/60 dark:text-paper/60">Earlier cells keep their text; later cells use the new name.</p>
          {problem && (
            <p role="alert" className="text-sm text-red-700 dark:text-red-300">
              {problem}
            </p>
          )}
          <div className="flex justify-end gap-2">
            <button type="button" className={buttonSecondary} onClick={close}>
              Keep the name
            </button>
            <button type="submit" className={buttonPrimary} disabled={busy}>
              Rename
            </button>
          </div>
        </form>
      </Modal>

      <Modal open={deleting !== null} title={`Delete ${deleting?.name ?? ""}?`} onClose={close}>
        <p className="text-sm">
          <span className="font-mono">{deleting?.name}</span> ({deleting?.type}) leaves the shelf; cells that use the name will no longer
          find it.
        </p>
        {problem && (
          <p role="alert" className="text-sm text-red-700 dark:text-red-300">
            {problem}
          </p>
        )}
        <div className="flex justify-end gap-2">
          <button type="button" className={buttonSecondary} onClick={close} autoFocus>
            Keep it
          </button>
          <button type="button" className={buttonPrimary} disabled={busy} onClick={() => void confirmDelete()}>
            Delete
          </button>
        </div>
      </Modal>
    </section>
  );
}
