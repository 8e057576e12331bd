import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { revokeInvitation } from "@/lib/sharing/invitations";

type Context = { params: Promise<{ id: string; invitationId: string }> };

/// Revokes a pending invitation: its link stops working.
export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, invitationId } = await params;
  return NextResponse.json({ invitation: await revokeInvitation(user, id, invitationId, clientAddress(req.headers)) });
});
