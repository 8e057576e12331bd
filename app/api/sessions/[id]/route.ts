import { NextResponse } from "next/server";
import { z } from "zod";
import { atMost } from "@/lib/limits";
import { requireUser, requireUserOrLink } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { deleteSession, renameSession } from "@/lib/sessions/manage";
import { requireSessionAccess } from "@/lib/auth/access";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { ownerName } from "@/lib/sessions/store";
import { canManageSharing } from "@/lib/sharing/shares";
import type { SessionDetail } from "@/lib/wire/sessions";

type Context = { params: Promise<{ id: string }> };

export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  const { session, role } = await requireSessionAccess(user, id, "read", { linkToken: token });
  return NextResponse.json({
    session: {
      id: session.id,
      title: session.title,
      ownerName: await ownerName(session.ownerId),
      visibility: session.visibility,
      access: role,
      canEdit: role === "owner" || role === "editor",
      canManageSharing: user !== null && (await canManageSharing(user, session)),
    } satisfies SessionDetail,
  });
});

const Rename = z
  .object({
    title: z
      .string()
      .trim()
      .min(1, "give the session a title")
      .max(...atMost("titleChars")),
  })
  .strict();

/// Renames the session (its owner only).
export const PATCH = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  const { title } = await readJson(req, Rename, { limit: "shortBodyBytes" });
  const session = await renameSession(user, id, title, linkToken(req));
  return NextResponse.json({ session: { id: session.id, title: session.title } });
});

/// Deletes the session with its cells and objects (its owner only; the console confirms first).
export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  await deleteSession(user, id, linkToken(req));
  return NextResponse.json({ deleted: true });
});
