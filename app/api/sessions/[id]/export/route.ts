import { requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { HttpError, route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { exportJson, exportText } from "@/lib/sharing/transfer";

type Context = { params: Promise<{ id: string }> };

const TYPES = {
  latex: { type: "application/x-latex; charset=utf-8", ext: "tex" },
  markdown: { type: "text/markdown; charset=utf-8", ext: "md" },
  json: { type: "application/json; charset=utf-8", ext: "json" },
} as const;

/// The transcript as LaTeX, Markdown or our JSON (lib/export/README.md); anyone who may
/// read the session, link holders included.
export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  const format = new URL(req.url).searchParams.get("format") ?? "json";
  if (!Object.hasOwn(TYPES, format)) {
    throw new HttpError(400, "invalid_format", "Choose format=latex, format=markdown or format=json.");
  }
  const { session } = await requireSessionAccess(user, id, "read", { linkToken: token });
  const f = format as keyof typeof TYPES;
  const body = f === "json" ? JSON.stringify(await exportJson(session), null, 2) : await exportText(session, f);
  const filename = `${session.title.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "session"}.${TYPES[f].ext}`;
  return new Response(body, {
    status: 200,
    headers: { "Content-Type": TYPES[f].type, "Content-Disposition": `attachment; filename="${filename}"`, "Cache-Control": "no-store" },
  });
});
