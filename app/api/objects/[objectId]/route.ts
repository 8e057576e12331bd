import { NextResponse } from "next/server";
import { requireUserOrLink } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { objectView } from "@/lib/sessions/views";
import { requireObjectAccess } from "@/lib/sharing/shares";

type Context = { params: Promise<{ objectId: string }> };

/// One named object, for anyone who may read it (its session's readers, its shares).
export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { objectId } = await params;
  const { object, session, role } = await requireObjectAccess(user, objectId, { linkToken: token });
  return NextResponse.json({
    object: { ...objectView(object), origin: object.origin ?? null },
    session: { id: session.id, title: session.title },
    access: role,
  });
});
