import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { requireExperimentAccess } from "@/lib/experiments/access";
import { progressOf } from "@/lib/experiments/store";
import { experimentView } from "@/lib/experiments/views";

type Context = { params: Promise<{ id: string }> };

/// GET /api/experiments/:id: the experiment, its progress and how to reproduce it.
export const GET = experimentRoute(async (req, { params }: Context) => {
  const { id } = await params;
  const { experiment, role } = await requireExperimentAccess(req, id, "read");
  return NextResponse.json({
    experiment: experimentView(experiment, await progressOf(experiment)),
    access: role,
    canEdit: role === "owner" || role === "editor",
  });
});
