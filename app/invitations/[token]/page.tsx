import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { AcceptInvitation } from "./accept";

export const metadata: Metadata = { title: "Invitation · Ringside", referrer: "no-referrer" };

/// The page an invitation mail links to: shows the team and role, and accepts for the
/// signed-in account when its e-mail address is the invited one.
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/invitations/${token}`)}`);
  return <AcceptInvitation token={token} email={user.email} />;
}
