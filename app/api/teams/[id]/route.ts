import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { teamDetail } from "@/lib/sharing/teams";

type Context = { params: Promise<{ id: string }> };

export const GET = route(async (_req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await teamDetail(user, id));
});
