import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { ExperimentsFrame } from "../../_experiments/frame";
import { ExperimentRoom } from "../../_experiments/room";

export const metadata = { title: "Experiment · Ringside" };

const one = (v: string | string[] | undefined): string | null => (typeof v === "string" && v !== "" ? v : null);

/// One experiment's room; `?link=<token>` reads it through its session's published
/// read-only link (also signed out); `?view=plots&plot=heat` opens a plot first.
export default async function ExperimentPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { id } = await params;
  const sp = await searchParams;
  const link = one(sp.link);
  const user = await currentUser();
  if (!user && !link) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/experiments/${id}`)}`);
  const view = one(sp.view);
  const plot = one(sp.plot);
  return (
    <ExperimentsFrame userName={user?.displayName ?? null}>
      <ExperimentRoom
        id={id}
        link={link}
        signedIn={user !== null}
        initialTab={view === "plots" || view === "recipe" ? view : "table"}
        initialPlot={plot === "histogram" || plot === "scatter" || plot === "series" || plot === "heat" ? plot : undefined}
      />
    </ExperimentsFrame>
  );
}
