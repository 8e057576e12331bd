import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { TeamView } from "./team-view";

export const metadata: Metadata = { title: "Team · Ringside" };

/// One team: members and roles, the invite form (leads), sessions shared with the team.
export default async function TeamPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=/teams/${id}`);
  return <TeamView teamId={id} userId={user.id} />;
}
