"use client";
/// The searchable history of inputs (this session's cells, newest first): typing
/// filters, Enter puts the chosen input back into the editor.
import { Command } from "cmdk";

const itemClass =
  "cursor-pointer rounded px-2 py-1 font-mono text-sm data-[selected=true]:bg-ink data-[selected=true]:text-paper dark:data-[selected=true]:bg-signal dark:data-[selected=true]:text-night";

/// A filterable list of earlier inputs.
export function HistorySearch({ entries, onChoose }: { entries: readonly string[]; onChoose: (source: string) => void }) {
  const newestFirst = [...entries].reverse();
  return (
    <Command label="Input history" className="flex flex-col gap-2">
      <Command.Input
        autoFocus
        placeholder="Search earlier inputs…"
        className="w-full rounded-md border border-ink/20 bg-white px-2 py-1.5 text-sm dark:border-paper/20 dark:bg-night"
      />
      <Command.List className="max-h-80 overflow-y-auto">
        <Command.Empty className="px-2 py-1 text-sm text-ink/60 dark:text-paper/60">No earlier input matches.</Command.Empty>
        {newestFirst.map((source, i) => (
          <Command.Item key={i} value={`${i} ${source}`} onSelect={() => onChoose(source)} className={itemClass}>
            <span className="line-clamp-2 whitespace-pre-wrap">{source}</span>
          </Command.Item>
        ))}
      </Command.List>
    </Command>
  );
}
