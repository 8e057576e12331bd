import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { publicBase } from "@/lib/sharing/common";
import { publishLink, revokeLink } from "@/lib/sharing/shares";

type Context = { params: Promise<{ id: string }> };

/// Publishes the session as a read-only link (→ {url}); an existing link is returned as is.
export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  const { url, created } = await publishLink(user, id, publicBase(req), clientAddress(req.headers), linkToken(req));
  return NextResponse.json({ url }, { status: created ? 201 : 200 });
});

/// Revokes the link: its token stops working at once.
export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await revokeLink(user, id, clientAddress(req.headers), linkToken(req)));
});
