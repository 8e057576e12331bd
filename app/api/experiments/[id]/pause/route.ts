import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { requireExperimentAccess } from "@/lib/experiments/access";
import { act } from "@/lib/experiments/service";
import { progressOf } from "@/lib/experiments/store";
import { experimentView } from "@/lib/experiments/views";

type Context = { params: Promise<{ id: string }> };

/// POST /api/experiments/:id/pause (editors; 409 when the experiment's status does not allow it).
export const POST = experimentRoute(async (req, { params }: Context) => {
  const { id } = await params;
  const { experiment } = await requireExperimentAccess(req, id, "edit");
  const e = await act(experiment.id, "pause");
  return NextResponse.json({ experiment: experimentView(e, await progressOf(e)) });
});
