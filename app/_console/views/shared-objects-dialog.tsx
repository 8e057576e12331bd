"use client";
/// Named objects others have shared with me, each with "Import" into the open session
/// (ObjectCopyList, shared with the library: a copy that records where it came from).
import useSWR from "swr";
import { keys } from "../api/client";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import type { SharedObject } from "../api/sharing";
import { typeWords } from "../render/type-words";
import { ObjectCopyList } from "./object-copy-list";

export interface SharedObjectsProps {
  /// the session the copy goes into, when I may edit it (null: import is not offered)
  readonly targetSessionId: string | null;
  readonly onImported: (notice: string) => void;
}

/// The list of objects shared with me (rendered inside a Modal).
export function SharedObjectsPanel({ targetSessionId, onImported }: SharedObjectsProps) {
  const list = useSWR<{ objects: SharedObject[] }>(keys.sharedObjects, fetchJson);
  if (list.error)
    return (
      <p role="alert" className="text-sm text-red-700 dark:text-red-300">
        {messageOf(list.error)}
      </p>
    );
  if (!list.data) return <p className="text-sm text-ink/50 dark:text-paper/50">Loading…</p>;
  return (
    <div className="flex max-h-[60vh] flex-col gap-2 overflow-y-auto">
      {!targetSessionId && <p className="text-sm text-ink-soft dark:text-paper/70">Open a session you may edit to import into it.</p>}
      <ObjectCopyList
        rows={list.data.objects.map((o) => ({
          id: o.id,
          name: o.name,
          ownerName: o.ownerName,
          sessionTitle: o.sessionTitle,
          type: typeWords(o.type),
          where: `from ${o.ownerName} · “${o.sessionTitle}”`,
          detail: o.summary,
        }))}
        label="Objects shared with me"
        verb="Import"
        buttonName={(row) => `Import ${row.name}`}
        rowAttribute="data-shared-object"
        empty="Nobody has shared a named object with you yet."
        targetSessionId={targetSessionId}
        noticeFor={(row, copied) => `Imported ${copied} from ${row.ownerName}'s session “${row.sessionTitle}”.`}
        onCopied={onImported}
      />
    </div>
  );
}
