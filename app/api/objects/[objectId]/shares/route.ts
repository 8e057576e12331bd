import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { granteeOf, NewShare } from "@/lib/sharing/bodies";
import { listObjectShares, shareObject } from "@/lib/sharing/shares";

type Context = { params: Promise<{ objectId: string }> };

export const GET = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { objectId } = await params;
  return NextResponse.json({ shares: await listObjectShares(user, objectId, linkToken(req)) });
});

export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { objectId } = await params;
  const body = await readJson(req, NewShare, { limit: "shortBodyBytes" });
  const { share, created } = await shareObject(user, objectId, granteeOf(body), body.role, clientAddress(req.headers), linkToken(req));
  return NextResponse.json({ share }, { status: created ? 201 : 200 });
});
