import { NextResponse } from "next/server";
import { HttpError } from "@/lib/http/errors";
import { experimentRoute } from "@/lib/experiments/http";
import { requireExperimentAccess } from "@/lib/experiments/access";

type Context = { params: Promise<{ id: string; index: string }> };

/// GET /api/experiments/:id/members/:index: one member of the experiment's family as a §9
/// value (the row's label is cut at 120 characters; this is the whole member), with the
/// line of notation that rebuilds it in a session.
export const GET = experimentRoute(async (req, { params }: Context) => {
  const { id, index } = await params;
  const { experiment } = await requireExperimentAccess(req, id, "read");
  const k = Number(index);
  if (!/^\d+$/.test(index) || k >= experiment.total) {
    throw new HttpError(400, "invalid_query", `The member index must be 0 … ${experiment.total - 1}, got ${index}.`);
  }
  const members = (experiment.family as { members?: unknown[] }).members ?? [];
  const member = members[k];
  if (member === undefined) throw new HttpError(404, "not_found", `Member ${k} is not stored with the experiment.`);
  return NextResponse.json({
    index: k,
    label: (experiment.labels as string[])[k] ?? "",
    member,
    familyDefinition: experiment.familyDefinition,
  });
});
