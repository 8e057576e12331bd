import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { NewTeam } from "@/lib/sharing/bodies";
import { createTeam, listTeams } from "@/lib/sharing/teams";

export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json({ teams: await listTeams(user) });
});

export const POST = route(async (req) => {
  const user = await requireUser();
  const body = await readJson(req, NewTeam, { limit: "shortBodyBytes" });
  const team = await createTeam(user, body, clientAddress(req.headers));
  return NextResponse.json(
    { team: { id: team.id, slug: team.slug, name: team.name, description: team.description, role: "lead" } },
    { status: 201 },
  );
});
