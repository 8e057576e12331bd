/// On the sign-in and sign-up pages of someone who followed an invitation link while
/// signed out: what they were invited to, by whom, and for which address, so they know
/// why they are here and which account to use; after signing in they return to it.
/// (The pages read the invitation with lib/sharing's invitationBehind.)

export interface InvitationSummary {
  teamName: string;
  invitedBy: string | null;
  email: string;
  role: string;
  status: string;
}

export function InvitationNote({ invitation, action }: { invitation: InvitationSummary; action: "sign in" | "sign up" }) {
  return (
    <div className="mb-4 rounded-md border border-ink/10 bg-paper-deep px-3 py-2 text-sm" role="note" data-testid="invitation-note">
      <p>
        {invitation.invitedBy ?? "A team lead"} invited <strong>{invitation.email}</strong> to join <strong>{invitation.teamName}</strong>{" "}
        as {invitation.role}.
      </p>
      <p className="mt-1 text-ink-soft">
        {invitation.status === "pending"
          ? `${action === "sign in" ? "Sign in" : "Create an account"} with that address; you return to the invitation to accept it.`
          : `This invitation is ${invitation.status === "accepted" ? "already used" : invitation.status}; ask the team's lead for a new one.`}
      </p>
    </div>
  );
}
