import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { granteeOf, NewShare } from "@/lib/sharing/bodies";
import { publicBase } from "@/lib/sharing/common";
import { listSessionShares, shareSession } from "@/lib/sharing/shares";

type Context = { params: Promise<{ id: string }> };

/// The session's shares and its read-only link, for those who may change them.
export const GET = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await listSessionShares(user, id, publicBase(req), linkToken(req)));
});

/// Shares the session with a user (by e-mail) or a team; sharing again changes the role.
export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  const body = await readJson(req, NewShare, { limit: "shortBodyBytes" });
  const { share, created } = await shareSession(user, id, granteeOf(body), body.role, clientAddress(req.headers), linkToken(req));
  return NextResponse.json({ share }, { status: created ? 201 : 200 });
});
