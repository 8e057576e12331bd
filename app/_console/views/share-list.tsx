"use client";
/// The current shares of a session or a named object, each with a Revoke button.
import { useState } from "react";
import type { Share } from "../api/sharing";
import { buttonQuiet } from "./styles";

/// Who holds which role; `onRevoke` answers an error message or null.
export function ShareList({ shares, onRevoke }: { shares: readonly Share[] | undefined; onRevoke: (s: Share) => Promise<string | null> }) {
  const [problem, setProblem] = useState<string | null>(null);
  if (!shares) return <p className="text-sm text-ink/50 dark:text-paper/50">Loading the shares…</p>;
  return (
    <div className="flex flex-col gap-1">
      {shares.length === 0 ? (
        <p className="text-sm text-ink/60 dark:text-paper/60">Not shared with anyone yet.</p>
      ) : (
        <ul
          aria-label="Current shares"
          className="divide-y divide-ink/10 rounded-md border border-ink/10 dark:divide-paper/10 dark:border-paper/10"
        >
          {shares.map((s) => {
            const who = s.grantee.kind === "user" ? s.grantee.email : `team ${s.grantee.name}`;
            return (
              <li key={s.id} className="flex items-center gap-2 px-2 py-1 text-sm" data-testid="share-row">
                <span className="min-w-0 flex-1 truncate">{who}</span>
                <span className="rounded bg-ink/10 px-1.5 text-[0.7rem] uppercase tracking-wide dark:bg-paper/10">{s.role}</span>
                <button
                  type="button"
                  className={buttonQuiet}
                  aria-label={`Revoke the share of ${who}`}
                  onClick={async () => setProblem(await onRevoke(s))}
                >
                  Revoke
                </button>
              </li>
            );
          })}
        </ul>
      )}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
    </div>
  );
}
