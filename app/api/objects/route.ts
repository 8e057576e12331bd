import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { listSharedObjects } from "@/lib/sharing/shares";

/// Named objects shared with the caller (directly or through a team), to import.
export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json({ objects: await listSharedObjects(user) });
});
