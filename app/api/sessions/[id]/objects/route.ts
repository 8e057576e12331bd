import { NextResponse } from "next/server";
import { requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { listObjects } from "@/lib/sessions/store";
import { objectView } from "@/lib/sessions/views";

type Context = { params: Promise<{ id: string }> };

export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  await requireSessionAccess(user, id, "read", { linkToken: token });
  return NextResponse.json({ objects: (await listObjects(id)).map(objectView) });
});
