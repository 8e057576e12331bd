import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { NewInvitation } from "@/lib/sharing/bodies";
import { publicBase } from "@/lib/sharing/common";
import { createInvitation, listInvitations } from "@/lib/sharing/invitations";

type Context = { params: Promise<{ id: string }> };

export const GET = route(async (_req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json({ invitations: await listInvitations(user, id) });
});

export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  const body = await readJson(req, NewInvitation, { limit: "shortBodyBytes" });
  const invitation = await createInvitation(user, id, body, publicBase(req), clientAddress(req.headers));
  return NextResponse.json({ invitation }, { status: 201 });
});
