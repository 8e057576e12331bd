import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { searchHistory } from "@/lib/sessions/history";

/// The caller's input history across all their sessions, each source once, newest first;
/// `?q=` keeps the sources containing it.
export const GET = route(async (req) => {
  const user = await requireUser();
  const q = new URL(req.url).searchParams.get("q")?.slice(0, 200) ?? undefined;
  return NextResponse.json({ entries: await searchHistory(user, q) });
});
