"use client";
/// Accepting an invitation: what it offers, who it is for, and one button.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { api, buttonClass, Notice, PageFrame } from "../../teams/ui";

interface Invitation {
  teamId: string;
  teamName: string;
  invitedBy: string | null;
  email: string;
  role: "member" | "guest" | "lead";
  status: "pending" | "accepted" | "revoked" | "expired";
  expiresAt: string;
}

const STATUS_TEXT: Record<Exclude<Invitation["status"], "pending">, string> = {
  accepted: "This invitation has already been used.",
  revoked: "This invitation was withdrawn by the team's lead.",
  expired: "This invitation has expired; ask the team's lead for a new one.",
};

export function AcceptInvitation({ token, email }: { token: string; email: string }) {
  const [invitation, setInvitation] = useState<Invitation | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [joined, setJoined] = useState<{ teamId: string; role: string; sessionId: string } | null>(null);
  const router = useRouter();
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    api<{ invitation: Invitation }>(`/api/invitations/${encodeURIComponent(token)}`)
      .then((d) => setInvitation(d.invitation))
      .catch((e: Error) => setError(e.message));
  }, [token]);

  async function accept() {
    setBusy(true);
    setError(null);
    try {
      const { membership } = await api<{ membership: { teamId: string; role: string; sessionId: string } }>(
        `/api/invitations/${encodeURIComponent(token)}/accept`,
        { method: "POST" },
      );
      setJoined(membership);
      // The invitee starts working in a session of their own (the server chose or made it).
      router.push(`/?session=${encodeURIComponent(membership.sessionId)}`);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <PageFrame title="Team invitation">
      <Notice text={error} tone="error" />
      {invitation && !joined && (
        <div className="mt-6 rounded-lg border border-ink/10 bg-white p-5 dark:bg-night-panel">
          <p>
            {invitation.invitedBy ?? "A lead"} invites <strong>{invitation.email}</strong> to join <strong>{invitation.teamName}</strong> as{" "}
            <strong>{invitation.role}</strong>.
          </p>
          {invitation.status !== "pending" ? (
            <p className="mt-3 text-ink-soft" role="alert">
              {STATUS_TEXT[invitation.status]}
            </p>
          ) : invitation.email !== email ? (
            <p className="mt-3 text-ink-soft" role="alert">
              You are signed in as {email}. Sign out and sign in (or sign up) as {invitation.email} to accept.
            </p>
          ) : (
            <button type="button" className={`${buttonClass} mt-4`} onClick={accept} disabled={busy}>
              Accept invitation
            </button>
          )}
        </div>
      )}
      {joined && (
        <p className="mt-6" role="status">
          You joined {invitation?.teamName} as {joined.role}.{" "}
          <Link href={`/?session=${encodeURIComponent(joined.sessionId)}`} className="underline">
            Open your session
          </Link>{" "}
          ·{" "}
          <Link href={`/teams/${joined.teamId}`} className="underline">
            Open the team
          </Link>
        </p>
      )}
    </PageFrame>
  );
}
