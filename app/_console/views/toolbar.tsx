"use client";
/// The bar over the transcript: the session's title and read-only mark, the buttons that
/// open the palette and the dialogs, the theme switch; and under it the banner of a
/// read-only shared link.
import type { SessionDetail } from "@/lib/wire/reading";
import type { DialogName } from "../use-console";
import { buttonSecondary, kbd } from "./styles";

export function Toolbar(props: {
  session: SessionDetail | undefined;
  sessionId: string | null;
  signedIn: boolean;
  canShare: boolean;
  readOnlyLink: boolean;
  theme: "light" | "dark";
  onPalette: () => void;
  onDialog: (d: Exclude<DialogName, null>) => void;
  onToggleTheme: () => void;
}) {
  const { session, sessionId, signedIn, canShare, readOnlyLink, theme, onPalette, onDialog, onToggleTheme } = props;
  return (
    <>
      <div className="flex flex-wrap items-center gap-2 border-b border-ink/10 px-4 py-2 dark:border-paper/10">
        <h1 className="truncate text-sm font-semibold" data-testid="session-title">
          {session?.title ?? (sessionId ? "…" : "No session open")}
        </h1>
        {session && !session.canEdit && (
          <span
            className="rounded bg-signal-soft px-1.5 py-0.5 text-xs text-ink dark:bg-signal/30 dark:text-paper"
            data-testid="read-only-badge"
          >
            {readOnlyLink ? "read-only shared link" : "read-only"}
          </span>
        )}
        <span className="ml-auto flex flex-wrap items-center gap-1.5">
          <button type="button" className={buttonSecondary} onClick={onPalette} title="Command palette">
            Commands <kbd className={kbd}>Ctrl K</kbd>
          </button>
          <button type="button" className={buttonSecondary} onClick={() => onDialog("tour")} title="Guided first steps (Alt+G)">
            First steps
          </button>
          {canShare && (
            <button
              type="button"
              className={buttonSecondary}
              onClick={() => onDialog("share")}
              title="Share this session, publish a read-only link"
            >
              Share
            </button>
          )}
          {(sessionId || signedIn) && (
            <button
              type="button"
              className={buttonSecondary}
              onClick={() => onDialog("transfer")}
              title="Export the transcript (all cells or chosen ones) or import a session (Alt+E)"
            >
              Export
            </button>
          )}
          <button type="button" className={buttonSecondary} onClick={() => onDialog("help")} title="Keyboard help (Alt+/)">
            Keys
          </button>
          <button
            type="button"
            className={buttonSecondary}
            onClick={onToggleTheme}
            aria-pressed={theme === "dark"}
            title="Switch theme (Alt+T)"
          >
            {theme === "dark" ? "Light" : "Dark"}
          </button>
        </span>
      </div>

      {readOnlyLink && (
        <p
          role="note"
          className="border-b border-signal/30 bg-signal-soft/40 px-4 py-1.5 text-sm dark:bg-signal/15"
          data-testid="link-banner"
        >
          You are reading {session?.ownerName ? `${session.ownerName}'s session` : "this session"} through a read-only shared link: the
          transcript and named objects can be read and exported, nothing can be run.
        </p>
      )}
    </>
  );
}
