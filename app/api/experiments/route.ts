import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { z } from "zod";
import { requireSessionAccess } from "@/lib/auth/access";
import { requireUser, requireUserOrLink } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { HttpError } from "@/lib/http/errors";
import { createFromProgram, createFromUpload } from "@/lib/experiments/service";
import { getExperiment, listExperiments, progressOf } from "@/lib/experiments/store";
import { experimentView } from "@/lib/experiments/views";
import { linkToken } from "@/lib/sessions/link-token";
import { listSessions } from "@/lib/sessions/store";
import { CreateExperimentBody } from "@/lib/wire/experiments";

const uuid = z.string().uuid();

/// GET /api/experiments[?session=ID[&link=TOKEN]]: the experiments of one session, or of every
/// session the caller can read; newest first. With a session, its read-only link reads the
/// list as it reads each experiment (signed in or not); without one a link names nothing, so
/// the list of every readable session needs a signed-in user.
export const GET = experimentRoute(async (req) => {
  const session = new URL(req.url).searchParams.get("session");
  const token = linkToken(req);
  let ids: string[];
  if (session !== null) {
    const user = await requireUserOrLink(token);
    if (!uuid.safeParse(session).success) throw new HttpError(400, "invalid_query", "session must be a session id.");
    await requireSessionAccess(user, session, "read", { linkToken: token });
    ids = [session];
  } else {
    ids = (await listSessions(await requireUser())).map((s) => s.id);
  }
  const rows = await listExperiments(ids);
  return NextResponse.json({
    experiments: rows.map((r) => ({
      ...r,
      createdAt: new Date(r.createdAt).toISOString(),
      finishedAt: r.finishedAt === null ? null : new Date(r.finishedAt).toISOString(),
    })),
  });
});

/// POST /api/experiments: create from a program or cell, or from an upload and a probe.
export const POST = experimentRoute(async (req) => {
  const user = await requireUser();
  const body = await readJson(req, CreateExperimentBody, { limit: "experimentBodyBytes" });
  await requireSessionAccess(user, body.sessionId, "edit");
  const created =
    "uploadId" in body
      ? await createFromUpload({
          sessionId: body.sessionId,
          userId: user.id,
          uploadId: body.uploadId,
          probe: body.probe,
          ringName: body.ringName,
          title: body.title,
        })
      : await createFromProgram({
          sessionId: body.sessionId,
          userId: user.id,
          source: body.source ?? "",
          cellId: body.cellId ?? null,
          title: body.title,
        });
  const e = (await getExperiment(created.id))!;
  return NextResponse.json({ experiment: experimentView(e, await progressOf(e)) }, { status: 201 });
});
