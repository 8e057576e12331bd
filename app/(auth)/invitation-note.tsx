/// On the sign-in and sign-up pages of someone who followed an invitation link while
/// signed out: what they were invited to, by whom, and for which address, so they know
/// why they are here and which account to use; after signing in they return to it.
import { inspectInvitation } from "@/lib/sharing/invitations";

const INVITATION_PATH = /^\/invitations\/([A-Za-z0-9_-]{20,100})$/;

export interface InvitationSummary {
  teamName: string;
  invitedBy: string | null;
  email: string;
  role: string;
  status: string;
}

/// The invitation a callback address points at, or null (not an invitation, or unknown).
export async function invitationFor(callbackUrl: string): Promise<InvitationSummary | null> {
  const m = INVITATION_PATH.exec(callbackUrl);
  if (!m) return null;
  try {
    const { invitation } = await inspectInvitation(m[1]!);
    return invitation;
  } catch {
    return null;
  }
}

export function InvitationNote({ invitation, action }: { invitation: InvitationSummary; action: "sign in" | "sign up" }) {
  return (
    <div className="mb-4 rounded-md border border-ink/10 bg-paper-deep px-3 py-2 text-sm" role="note" data-testid="invitation-note">
      <p>
        {invitation.invitedBy ?? "A team lead"} invited <strong>{invitation.email}</strong> to join{" "}
        <strong>{invitation.teamName}</strong> as {invitation.role}.
      </p>
      <p className="mt-1 text-ink-soft">
        {invitation.status === "pending"
          ? `${action === "sign in" ? "Sign in" : "Create an account"} with that address; you return to the invitation to accept it.`
          : `This invitation is ${invitation.status === "accepted" ? "already used" : invitation.status}; ask the team's lead for a new one.`}
      </p>
    </div>
  );
}
