import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { unshareObject } from "@/lib/sharing/shares";

type Context = { params: Promise<{ objectId: string; shareId: string }> };

export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { objectId, shareId } = await params;
  await unshareObject(user, objectId, shareId, clientAddress(req.headers), linkToken(req));
  return NextResponse.json({ deleted: true });
});
