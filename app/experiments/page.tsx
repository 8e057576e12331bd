import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { ExperimentsList } from "../_experiments/experiments-list";
import { ExperimentsFrame } from "../_experiments/frame";
import { UploadPanel } from "../_experiments/upload-panel";

export const metadata = { title: "Experiments · Ringside" };

/// The experiments I can read, and sweeping a family file.
export default async function ExperimentsPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=%2Fexperiments");
  return (
    <ExperimentsFrame userName={user.displayName}>
      <div className="mx-auto flex w-full max-w-[96rem] min-w-0 flex-col gap-6 px-5 py-4">
        <ExperimentsList />
        <UploadPanel />
      </div>
    </ExperimentsFrame>
  );
}
