import { requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { HttpError, route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { exportJson, exportText, type ExportSelection } from "@/lib/sharing/transfer";

type Context = { params: Promise<{ id: string }> };

const TYPES = {
  latex: { type: "application/x-latex; charset=utf-8", ext: "tex" },
  markdown: { type: "text/markdown; charset=utf-8", ext: "md" },
  json: { type: "application/json; charset=utf-8", ext: "json" },
} as const;

/// Reads `?cells=0,2,5` (cell positions; absent: every cell) and `?skipErrors=1`.
function selectionOf(params: URLSearchParams): ExportSelection {
  const cells = params.get("cells");
  let positions: number[] | null = null;
  if (cells !== null && cells.trim() !== "") {
    const parts = cells.split(",").map((p) => p.trim());
    if (parts.length > 5000 || !parts.every((p) => /^\d{1,6}$/.test(p))) {
      throw new HttpError(400, "invalid_cells", "cells= takes cell positions separated by commas, such as cells=0,2,5.");
    }
    positions = parts.map(Number);
  }
  const skip = params.get("skipErrors");
  return { positions, skipErrors: skip === "1" || skip === "true" };
}

/// The transcript as LaTeX, Markdown or our JSON (lib/export/README.md); anyone who may
/// read the session, link holders included. `cells=` and `skipErrors=` choose the cells.
export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  const query = new URL(req.url).searchParams;
  const format = query.get("format") ?? "json";
  const selection = selectionOf(query);
  if (!Object.hasOwn(TYPES, format)) {
    throw new HttpError(400, "invalid_format", "Choose format=latex, format=markdown or format=json.");
  }
  const { session } = await requireSessionAccess(user, id, "read", { linkToken: token });
  const f = format as keyof typeof TYPES;
  const body = f === "json" ? JSON.stringify(await exportJson(session, selection), null, 2) : await exportText(session, f, selection);
  const filename = `${
    session.title
      .replace(/[^A-Za-z0-9._-]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 60) || "session"
  }.${TYPES[f].ext}`;
  return new Response(body, {
    status: 200,
    headers: { "Content-Type": TYPES[f].type, "Content-Disposition": `attachment; filename="${filename}"`, "Cache-Control": "no-store" },
  });
});
