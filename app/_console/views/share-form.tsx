"use client";
/// The form that grants a role: to a person by e-mail or to one of my teams, as a reader
/// (viewer) or as someone who may run cells (editor). Used for sessions and named objects.
import { useId, useState } from "react";
import { messageOf, send } from "@/app/_client/fetch";
import type { GranteeInput, ShareRole, TeamSummary } from "../api/sharing";
import { buttonPrimary, textInput } from "./styles";

export interface ShareFormProps {
  /// teams I may share with (lead or member; guests cannot share with their team), loaded
  /// before the form is drawn
  readonly teams: readonly TeamSummary[];
  /// all my teams with my role in each: those I lead can invite an address without an account
  readonly allTeams?: readonly TeamSummary[];
  readonly onShare: (grantee: GranteeInput, role: ShareRole) => Promise<ShareProblem | null>;
}

/// A refused share: the server's words, and whether the address has no account yet.
export interface ShareProblem {
  readonly message: string;
  readonly noAccount: boolean;
}

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/// Grantee and role, then "Share"; the server's refusal is shown under the form.
export function ShareForm({ teams, allTeams = [], onShare }: ShareFormProps) {
  // A team when I have one. The form is drawn once my teams are known, so this never
  // changes under the user's hands.
  const [kind, setKind] = useState<"user" | "team">(teams.length > 0 ? "team" : "user");
  const [email, setEmail] = useState("");
  const [chosenTeam, setTeamId] = useState("");
  const teamId = teams.some((t) => t.id === chosenTeam) ? chosenTeam : (teams[0]?.id ?? "");
  const id = useId();
  const [role, setRole] = useState<ShareRole>("viewer");
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  // an address that has no account yet: the form offers to invite it to a team I lead
  const [invitable, setInvitable] = useState<string | null>(null);
  const [inviteNotice, setInviteNotice] = useState<string | null>(null);
  const ledTeams = allTeams.filter((t) => t.role === "lead");
  const [inviteTeam, setInviteTeam] = useState("");
  const inviteTeamId = ledTeams.some((t) => t.id === inviteTeam) ? inviteTeam : (ledTeams[0]?.id ?? "");

  const invite = async () => {
    if (!invitable || !inviteTeamId) return;
    setBusy(true);
    try {
      await send(`/api/teams/${inviteTeamId}/invitations`, { method: "POST", body: JSON.stringify({ email: invitable, role: "member" }) });
      const team = ledTeams.find((t) => t.id === inviteTeamId)?.name ?? "the team";
      setInviteNotice(`Invitation sent to ${invitable} for ${team}. The share reaches them once their address is confirmed.`);
      setProblem(null);
      setInvitable(null);
    } catch (e) {
      setProblem(messageOf(e));
    } finally {
      setBusy(false);
    }
  };

  const submit = async () => {
    if (kind === "user" && !EMAIL.test(email.trim())) return setProblem("Type the e-mail address of a Ringside account.");
    if (kind === "team" && !teamId) return setProblem("Choose one of your teams.");
    setBusy(true);
    setProblem(null);
    setInviteNotice(null);
    const err = await onShare(kind === "user" ? { email: email.trim() } : { teamId }, role);
    setBusy(false);
    if (err) {
      setProblem(err.message);
      setInvitable(err.noAccount ? email.trim().toLowerCase() : null);
    } else {
      // The answer does not say whether the address has an account (so sharing reveals
      // none); a share to an address without one waits for it. Offer the invitation anyway.
      setEmail("");
      setInvitable(kind === "user" ? email.trim().toLowerCase() : null);
    }
  };

  return (
    <form
      aria-label="Share with"
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <fieldset className="flex gap-4 text-sm">
        <legend className="sr-only">Share with a person or a team</legend>
        <label className="flex items-center gap-1">
          <input type="radio" name="grantee-kind" checked={kind === "user"} onChange={() => setKind("user")} /> A person
        </label>
        <label className="flex items-center gap-1">
          <input
            type="radio"
            name="grantee-kind"
            checked={kind === "team"}
            disabled={teams.length === 0}
            onChange={() => setKind("team")}
          />{" "}
          A team
        </label>
      </fieldset>
      <div className="flex items-end gap-2">
        {kind === "user" ? (
          <div className="min-w-0 flex-1 text-sm">
            <label htmlFor={`${id}-email`}>E-mail address</label>
            <input
              id={`${id}-email`}
              className={textInput}
              type="email"
              value={email}
              onChange={(e) => setEmail(e.target.value)}
              placeholder="name@example.org"
            />
          </div>
        ) : (
          <div className="min-w-0 flex-1 text-sm">
            <label htmlFor={`${id}-team`}>Team</label>
            <select id={`${id}-team`} className={textInput} value={teamId} onChange={(e) => setTeamId(e.target.value)}>
              {teams.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          </div>
        )}
        <div className="text-sm">
          <label htmlFor={`${id}-role`}>Role</label>
          <select id={`${id}-role`} className={textInput} value={role} onChange={(e) => setRole(e.target.value as ShareRole)}>
            <option value="viewer">viewer — reads</option>
            <option value="editor">editor — also changes it</option>
          </select>
        </div>
        <button type="submit" className={buttonPrimary} disabled={busy}>
          Share
        </button>
      </div>
      {teams.length === 0 && (
        <p className="text-xs text-ink/60 dark:text-paper/60">You lead or belong to no team yet; share with a person by e-mail.</p>
      )}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
      {invitable &&
        (ledTeams.length > 0 ? (
          <div className="flex flex-wrap items-end gap-2 text-sm" data-testid="invite-offer">
            <label className="flex flex-col">
              If they have no account yet, invite {invitable} to
              <select className={textInput} value={inviteTeamId} onChange={(e) => setInviteTeam(e.target.value)}>
                {ledTeams.map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.name}
                  </option>
                ))}
              </select>
            </label>
            <button type="button" className={buttonPrimary} disabled={busy} onClick={() => void invite()}>
              Send invitation
            </button>
          </div>
        ) : (
          <p className="text-sm" data-testid="invite-offer">
            If {invitable} has no Ringside account yet, a lead of one of your teams can invite them; the share waits for their confirmed
            address.
          </p>
        ))}
      {inviteNotice && (
        <p role="status" className="text-sm">
          {inviteNotice}
        </p>
      )}
    </form>
  );
}
