"use client";
/// The command palette (Ctrl+K / ⌘K): every console command, searchable, grouped.
/// Each command is also reachable without it (a button or a shortcut, shown beside it).
import { Command } from "cmdk";
import { useEffect, useRef } from "react";
import { paletteScore } from "../render/palette-rank";
import { kbd } from "./styles";

/// cmdk's filter: items carry their label as the first keyword (see below), so the label is
/// ranked on its own (word starts above scattered letters) and the rest as extra words.
function filter(_value: string, search: string, keywords: string[] = []): number {
  const [label = "", ...rest] = keywords;
  return paletteScore(label, search, rest);
}

/// One command the palette offers.
export interface PaletteCommand {
  readonly id: string;
  readonly group: string;
  readonly label: string;
  readonly shortcut?: string;
  readonly keywords?: readonly string[];
  readonly run: () => void;
}

const itemClass =
  "flex cursor-pointer items-center justify-between gap-3 rounded px-2 py-1.5 text-sm data-[selected=true]:bg-ink data-[selected=true]:text-paper dark:data-[selected=true]:bg-signal dark:data-[selected=true]:text-night";

/// The palette as a modal dialog; choosing a command closes it and runs the command.
export function CommandPalette({
  open,
  onOpenChange,
  commands,
}: {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  commands: readonly PaletteCommand[];
}) {
  const groups = [...new Set(commands.map((c) => c.group))];
  // The chosen command runs once the dialog has closed and given focus back to where it
  // was (its own timer, set while closing); so a command that focuses the input keeps it.
  const chosen = useRef<(() => void) | null>(null);
  useEffect(() => {
    if (open || !chosen.current) return;
    const run = chosen.current;
    chosen.current = null;
    window.setTimeout(run, 0);
  }, [open]);
  return (
    <Command.Dialog
      open={open}
      onOpenChange={onOpenChange}
      label="Command palette"
      filter={filter}
      overlayClassName="fixed inset-0 z-40 bg-ink/40"
      contentClassName="fixed left-1/2 top-[12vh] z-50 w-[min(40rem,92vw)] -translate-x-1/2 rounded-lg border border-ink/20 bg-paper text-ink shadow-2xl dark:border-paper/20 dark:bg-night-panel dark:text-paper"
    >
      <Command.Input
        placeholder="Type a command…"
        className="w-full rounded-t-lg border-b border-ink/10 bg-transparent px-4 py-3 text-base outline-none dark:border-paper/10"
      />
      <Command.List className="max-h-[60vh] overflow-y-auto p-2">
        <Command.Empty className="px-2 py-2 text-sm text-ink/60 dark:text-paper/60">No command matches.</Command.Empty>
        {groups.map((g) => (
          <Command.Group
            key={g}
            heading={g}
            className="[&_[cmdk-group-heading]]:px-2 [&_[cmdk-group-heading]]:pb-1 [&_[cmdk-group-heading]]:pt-2 [&_[cmdk-group-heading]]:text-xs [&_[cmdk-group-heading]]:font-semibold [&_[cmdk-group-heading]]:uppercase [&_[cmdk-group-heading]]:tracking-wide [&_[cmdk-group-heading]]:text-ink-soft dark:[&_[cmdk-group-heading]]:text-paper/60"
          >
            {commands
              .filter((c) => c.group === g)
              .map((c) => (
                <Command.Item
                  key={c.id}
                  value={c.id}
                  keywords={[c.label, c.group, ...(c.keywords ?? [])]}
                  onSelect={() => {
                    chosen.current = c.run;
                    onOpenChange(false);
                  }}
                  className={itemClass}
                >
                  <span className="truncate">{c.label}</span>
                  {c.shortcut && <kbd className={`${kbd} shrink-0`}>{c.shortcut}</kbd>}
                </Command.Item>
              ))}
          </Command.Group>
        ))}
      </Command.List>
    </Command.Dialog>
  );
}
