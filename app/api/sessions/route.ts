import { NextResponse } from "next/server";
import { z } from "zod";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/errors";
import { createSession, listSessions } from "@/lib/sessions/store";

const NewSession = z.object({ title: z.string().trim().min(1, "give the session a title").max(200) }).strict();

export const POST = route(async (req) => {
  const user = await requireUser();
  const { title } = await readJson(req, NewSession);
  const session = await createSession(user, title);
  return NextResponse.json({ id: session.id, title: session.title }, { status: 201 });
});

export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json({ sessions: await listSessions(user) });
});
