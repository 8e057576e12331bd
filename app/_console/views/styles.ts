/// Shared Tailwind class lists of the console's controls, for both themes; focus is
/// always visible (keyboard-first).
export const focusRing = "focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-signal";

export const buttonPrimary = `inline-flex items-center gap-1 rounded-md bg-ink px-3 py-1.5 text-sm font-medium text-paper hover:bg-ink-soft disabled:cursor-not-allowed disabled:opacity-50 dark:bg-signal dark:text-night dark:hover:bg-signal-soft ${focusRing}`;

export const buttonSecondary = `inline-flex items-center gap-1 rounded-md border border-ink/20 bg-white px-3 py-1.5 text-sm text-ink hover:bg-paper-deep disabled:cursor-not-allowed disabled:opacity-50 dark:border-paper/20 dark:bg-night-panel dark:text-paper dark:hover:bg-night-line ${focusRing}`;

export const buttonQuiet = `inline-flex items-center rounded px-1.5 py-0.5 text-xs text-ink-soft hover:bg-ink/10 dark:text-paper/70 dark:hover:bg-paper/10 ${focusRing}`;

export const panelHeading = "text-xs font-semibold uppercase tracking-wide text-ink-soft dark:text-paper/60";

export const textInput = `w-full rounded-md border border-ink/20 bg-white px-2 py-1.5 text-sm text-ink dark:border-paper/20 dark:bg-night dark:text-paper ${focusRing}`;

/// A key's badge keeps its own colours, so it stays readable on a highlighted row of either
/// theme (the row's text colour is not inherited).
export const kbd =
  "rounded border border-ink/20 bg-paper-deep px-1 font-mono text-[0.7rem] text-ink dark:border-paper/20 dark:bg-night-line dark:text-paper";
