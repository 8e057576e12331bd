import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { requireExperimentAccess } from "@/lib/experiments/access";
import { runAgain } from "@/lib/experiments/service";
import { progressOf } from "@/lib/experiments/store";
import { experimentView } from "@/lib/experiments/views";

type Context = { params: Promise<{ id: string }> };

/// POST /api/experiments/:id/rerun: a new experiment with the same program, family (members
/// and seeds) and probe; its rerunOf names this one.
export const POST = experimentRoute(async (req, { params }: Context) => {
  const { id } = await params;
  const { experiment, user } = await requireExperimentAccess(req, id, "edit");
  const e = await runAgain(experiment, user?.id ?? null);
  return NextResponse.json({ experiment: experimentView(e, await progressOf(e)) }, { status: 201 });
});
