import { NextResponse } from "next/server";
import { z } from "zod";
import { atMost } from "@/lib/limits";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/errors";
import { createSession, listSessions } from "@/lib/sessions/store";

/// Without a title the session is named by its first definition (lib/sessions/store).
const NewSession = z
  .object({
    title: z
      .string()
      .trim()
      .min(1, "give the session a title")
      .max(...atMost("titleChars"))
      .optional(),
  })
  .strict();

export const POST = route(async (req) => {
  const user = await requireUser();
  const { title } = await readJson(req, NewSession);
  const session = await createSession(user, title);
  return NextResponse.json({ id: session.id, title: session.title }, { status: 201 });
});

/// `?q=` keeps the sessions whose title or content (cell sources, object names and values) contains it.
export const GET = route(async (req) => {
  const user = await requireUser();
  const q = new URL(req.url).searchParams.get("q")?.slice(0, 200) ?? undefined;
  return NextResponse.json({ sessions: await listSessions(user, q) });
});
