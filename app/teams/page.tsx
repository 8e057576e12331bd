import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { TeamList } from "./team-list";

export const metadata: Metadata = { title: "Teams · Ringside" };

/// The caller's teams and a form to start a new one (the creator becomes its lead).
export default async function TeamsPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=/teams");
  return <TeamList />;
}
