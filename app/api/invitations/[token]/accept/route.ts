import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { acceptInvitation } from "@/lib/sharing/invitations";

type Context = { params: Promise<{ token: string }> };

export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { token } = await params;
  return NextResponse.json({ membership: await acceptInvitation(user, token, clientAddress(req.headers)) });
});
