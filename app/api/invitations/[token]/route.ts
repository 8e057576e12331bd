import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { inspectInvitation } from "@/lib/sharing/invitations";

type Context = { params: Promise<{ token: string }> };

/// What the accept page shows: team, role, the invited address and the invitation's state.
export const GET = route(async (_req, { params }: Context) => {
  await requireUser();
  const { token } = await params;
  return NextResponse.json(await inspectInvitation(token));
});
