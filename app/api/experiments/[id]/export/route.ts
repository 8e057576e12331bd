import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { HttpError } from "@/lib/http/errors";
import { requireExperimentAccess } from "@/lib/experiments/access";
import { allRows, progressOf } from "@/lib/experiments/store";
import { experimentView, rowView, rowsCsv, rowsJson, rowsLatex } from "@/lib/experiments/views";

type Context = { params: Promise<{ id: string }> };

/// GET /api/experiments/:id/export?format=csv|json|latex: every row so far, in member order.
export const GET = experimentRoute(async (req, { params }: Context) => {
  const { id } = await params;
  const { experiment } = await requireExperimentAccess(req, id, "read");
  const format = new URL(req.url).searchParams.get("format") ?? "csv";
  const rows = (await allRows(experiment.id)).map((r) => rowView(experiment, r));
  const base = `experiment-${experiment.id.slice(0, 8)}`;
  const headers = (type: string, ext: string) => ({
    "content-type": type,
    "content-disposition": `attachment; filename="${base}.${ext}"`,
  });
  switch (format) {
    case "csv":
      return new NextResponse(rowsCsv(experiment, rows), { headers: headers("text/csv; charset=utf-8", "csv") });
    case "json":
      return NextResponse.json(rowsJson(experiment, experimentView(experiment, await progressOf(experiment)), rows), {
        headers: headers("application/json", "json"),
      });
    case "latex":
      return new NextResponse(rowsLatex(experiment, rows), { headers: headers("application/x-latex; charset=utf-8", "tex") });
    default:
      throw new HttpError(400, "invalid_query", `format must be csv, json or latex, got ${format}.`);
  }
});
