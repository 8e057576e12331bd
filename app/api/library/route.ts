import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { searchLibrary } from "@/lib/sessions/library";

/// Every named object the caller may reach, across sessions: `?q=` (name, type, value,
/// source), `?type=` (an exact type). Inserting one is POST /api/objects/:id/import.
export const GET = route(async (req) => {
  const user = await requireUser();
  const params = new URL(req.url).searchParams;
  const objects = await searchLibrary(user, {
    text: params.get("q")?.slice(0, 200) ?? undefined,
    type: params.get("type")?.slice(0, 60) ?? undefined,
  });
  return NextResponse.json({ objects });
});
