import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, teams } from "@/db/schema";
import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";

export const GET = route(async () => {
  const user = await requireUser();
  const teamRows = await db()
    .select({ id: teams.id, slug: teams.slug, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, user.id));
  return Response.json({
    user: { id: user.id, email: user.email, name: user.displayName, siteRole: user.siteRole, teams: teamRows },
  });
});
