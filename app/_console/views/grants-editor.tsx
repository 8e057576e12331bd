"use client";
/// Who holds a role on a session or a named object: the form that grants one (once my teams
/// are known) and the list of current shares with Revoke. Both dialogs use it; they differ
/// only in the calls and in the words of their notices.
import useSWR from "swr";
import { keys } from "../api/client";
import { ApiError, fetchJson, messageOf } from "@/app/_client/fetch";
import type { GranteeInput, Share, ShareRole, TeamSummary } from "../api/sharing";
import { ShareForm, type ShareProblem } from "./share-form";
import { ShareList } from "./share-list";

export interface GrantsEditorProps {
  readonly shares: readonly Share[] | undefined;
  /// grants the role; returns the notice to show
  readonly grant: (grantee: GranteeInput, role: ShareRole) => Promise<string>;
  /// revokes the share; returns the notice to show
  readonly revoke: (share: Share) => Promise<string>;
  /// called after a change, with its notice (the caller refreshes what it shows)
  readonly onChanged: (notice: string) => Promise<void> | void;
}

/// Runs a change and reports it; the server's refusal comes back as the form's message.
async function attempt(change: () => Promise<string>, onChanged: GrantsEditorProps["onChanged"]): Promise<string | null> {
  try {
    await onChanged(await change());
    return null;
  } catch (e) {
    return messageOf(e);
  }
}

/// Like attempt, but an address without an account comes back as such (the form offers an invitation).
async function attemptShare(change: () => Promise<string>, onChanged: GrantsEditorProps["onChanged"]): Promise<ShareProblem | null> {
  try {
    await onChanged(await change());
    return null;
  } catch (e) {
    return { message: messageOf(e), noAccount: e instanceof ApiError && e.code === "no_account" };
  }
}

export function GrantsEditor({ shares, grant, revoke, onChanged }: GrantsEditorProps) {
  const teams = useSWR<{ teams: TeamSummary[] }>(keys.teams, fetchJson);
  return (
    <>
      {teams.data || teams.error ? (
        <ShareForm
          // guests cannot share with their team
          teams={(teams.data?.teams ?? []).filter((t) => t.role !== "guest")}
          // every team, for the invitation offer (only a lead's teams can invite)
          allTeams={teams.data?.teams ?? []}
          onShare={(grantee, role) => attemptShare(() => grant(grantee, role), onChanged)}
        />
      ) : (
        <p className="text-sm text-ink/50 dark:text-paper/50">Loading your teams…</p>
      )}
      <ShareList shares={shares} onRevoke={(s) => attempt(() => revoke(s), onChanged)} />
    </>
  );
}
