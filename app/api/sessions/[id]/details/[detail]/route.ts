import { createReadStream, statSync } from "node:fs";
import { Readable } from "node:stream";
import { requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { notFound, route } from "@/lib/http/errors";
import { detailPath } from "@/lib/compute/large-values";
import { linkToken } from "@/lib/sessions/link-token";
import { sessionHoldsDetail } from "@/lib/sessions/store";

type Context = { params: Promise<{ id: string; detail: string }> };

export const dynamic = "force-dynamic";

/// The whole of a value stored as a summary (its `detail.id`), streamed from disk so the server
/// never holds it; anyone who may read the session that holds the value.
export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id, detail } = await params;
  await requireSessionAccess(user, id, "read", { linkToken: token });
  const file = detailPath(detail);
  if (!file || !(await sessionHoldsDetail(id, detail))) throw notFound("The value's detail");
  let size: number;
  try {
    size = statSync(file).size;
  } catch {
    throw notFound("The value's detail");
  }
  const body = Readable.toWeb(createReadStream(file)) as ReadableStream<Uint8Array>;
  return new Response(body, {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-length": String(size),
      "cache-control": "private, max-age=3600",
    },
  });
});
