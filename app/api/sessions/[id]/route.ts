import { NextResponse } from "next/server";
import { requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { ownerName } from "@/lib/sessions/store";
import { canManageSharing } from "@/lib/sharing/shares";
import type { SessionDetail } from "@/lib/wire/sessions";

type Context = { params: Promise<{ id: string }> };

export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  const { session, role } = await requireSessionAccess(user, id, "read", { linkToken: token });
  return NextResponse.json({
    session: {
      id: session.id,
      title: session.title,
      ownerName: await ownerName(session.ownerId),
      visibility: session.visibility,
      access: role,
      canEdit: role === "owner" || role === "editor",
      canManageSharing: user !== null && (await canManageSharing(user, session)),
    } satisfies SessionDetail,
  });
});
