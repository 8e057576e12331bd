"use client";
/// The console's keyboard: Ctrl+K / ⌘K toggles the palette, Alt+<key> runs a command
/// (the list the keyboard help shows). Keys are matched by `code`, so they work whatever
/// character the layout puts on them.
import { useEffect } from "react";

export function useShortcuts(togglePalette: () => void, altActions: Readonly<Record<string, () => void>>) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && !e.altKey && e.key.toLowerCase() === "k") {
        e.preventDefault();
        togglePalette();
        return;
      }
      if (!e.altKey || e.ctrlKey || e.metaKey) return;
      const action = altActions[e.code];
      if (action) {
        e.preventDefault();
        action();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [togglePalette, altActions]);
}
