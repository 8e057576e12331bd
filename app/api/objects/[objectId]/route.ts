import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { objectView } from "@/lib/sessions/views";
import { requireObjectAccess } from "@/lib/sharing/shares";

type Context = { params: Promise<{ objectId: string }> };

/// One named object, for anyone who may read it (its session's readers, its shares).
export const GET = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { objectId } = await params;
  const { object, session, role } = await requireObjectAccess(user, objectId, { linkToken: linkToken(req) });
  return NextResponse.json({
    object: { ...objectView(object), origin: object.origin ?? null },
    session: { id: session.id, title: session.title },
    access: role,
  });
});
