import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { RoleChange } from "@/lib/sharing/bodies";
import { changeRole, removeMember } from "@/lib/sharing/teams";

type Context = { params: Promise<{ id: string; userId: string }> };

export const PATCH = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, userId } = await params;
  const { role } = await readJson(req, RoleChange, { limit: "shortBodyBytes" });
  return NextResponse.json({ member: await changeRole(user, id, userId, role, clientAddress(req.headers)) });
});

/// A lead removes a member; anyone removes themselves (leaves the team).
export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, userId } = await params;
  return NextResponse.json(await removeMember(user, id, userId, clientAddress(req.headers)));
});
