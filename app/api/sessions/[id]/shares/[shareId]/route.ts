import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { unshareSession } from "@/lib/sharing/shares";

type Context = { params: Promise<{ id: string; shareId: string }> };

export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, shareId } = await params;
  await unshareSession(user, id, shareId, clientAddress(req.headers), linkToken(req));
  return NextResponse.json({ deleted: true });
});
