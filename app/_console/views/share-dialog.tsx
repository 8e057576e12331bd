"use client";
/// Sharing one session: grant a person or a team a role, see and revoke the current
/// shares, and publish, copy or revoke the read-only link. Only the owner or a lead of the
/// session's team may (the server answers 403 to anyone else, shown as it says).
import { useRef, useState } from "react";
import useSWR from "swr";
import { keys } from "../api/client";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { publishLink, revokeLink, revokeSessionShare, shareSession, type SessionSharing } from "../api/sharing";
import { GrantsEditor } from "./grants-editor";
import { buttonPrimary, buttonSecondary, panelHeading, textInput } from "./styles";

/// The dialog's body for the session `sessionId` (rendered inside a Modal).
export function ShareSessionPanel({ sessionId, onChanged }: { sessionId: string; onChanged: (notice: string) => void }) {
  const sharing = useSWR<SessionSharing>(keys.sessionShares(sessionId), fetchJson);
  const [linkProblem, setLinkProblem] = useState<string | null>(null);
  const [copied, setCopied] = useState<string | null>(null);
  const urlField = useRef<HTMLInputElement>(null);

  if (sharing.error) {
    return (
      <p role="alert" className="text-sm text-red-700 dark:text-red-300">
        {messageOf(sharing.error)}
      </p>
    );
  }
  const url = sharing.data?.link.url ?? null;

  const linkAction = async (what: () => Promise<unknown>, done: string) => {
    setLinkProblem(null);
    setCopied(null);
    try {
      await what();
      await sharing.mutate();
      onChanged(done);
    } catch (e) {
      setLinkProblem(messageOf(e));
    }
  };

  const copy = async () => {
    if (!url) return;
    try {
      await navigator.clipboard.writeText(url);
      setCopied("Copied the link.");
    } catch {
      // No clipboard permission: select the address so Ctrl+C copies it.
      urlField.current?.select();
      setCopied("Selected the link: press Ctrl+C to copy it.");
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <section aria-label="People and teams" className="flex flex-col gap-2">
        <h3 className={panelHeading}>People and teams</h3>
        <GrantsEditor
          shares={sharing.data?.shares}
          grant={async (grantee, role) => {
            const { share } = await shareSession(sessionId, grantee, role);
            return `Shared with ${share.grantee.name || ("email" in grantee ? grantee.email : "the team")} as ${share.role}.`;
          }}
          revoke={async (s) => {
            await revokeSessionShare(sessionId, s.id);
            return `Revoked the share of ${s.grantee.name}.`;
          }}
          onChanged={async (notice) => {
            await sharing.mutate();
            onChanged(notice);
          }}
        />
      </section>

      <section aria-label="Read-only link" className="flex flex-col gap-2">
        <h3 className={panelHeading}>Read-only link</h3>
        <p className="text-xs text-ink/60 dark:text-paper/60">
          Anyone holding the link reads the transcript and the named objects, signed in or not; nobody runs cells through it.
          Revoking it stops the address at once.
        </p>
        {url ? (
          <>
            <label className="text-sm">
              Link address
              <input ref={urlField} readOnly className={`${textInput} font-mono text-xs`} value={url} onFocus={(e) => e.currentTarget.select()} />
            </label>
            <div className="flex gap-2">
              <button type="button" className={buttonSecondary} onClick={() => void copy()}>
                Copy the link
              </button>
              <button type="button" className={buttonSecondary} onClick={() => void linkAction(() => revokeLink(sessionId), "The read-only link is revoked.")}>
                Revoke the link
              </button>
            </div>
          </>
        ) : (
          <div>
            <button
              type="button"
              className={buttonPrimary}
              disabled={!sharing.data}
              onClick={() => void linkAction(() => publishLink(sessionId), "Published a read-only link.")}
            >
              Publish a read-only link
            </button>
          </div>
        )}
        {copied && <p className="text-xs text-ink-soft dark:text-signal-soft">{copied}</p>}
        {linkProblem && (
          <p role="alert" className="text-sm text-red-700 dark:text-red-300">
            {linkProblem}
          </p>
        )}
      </section>
    </div>
  );
}
