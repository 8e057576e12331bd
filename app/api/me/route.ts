import { requireUser } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";
import { listTeams } from "@/lib/sharing/teams";

export const GET = route(async () => {
  const user = await requireUser();
  const teams = (await listTeams(user)).map(({ id, slug, name, role }) => ({ id, slug, name, role }));
  return Response.json({
    user: { id: user.id, email: user.email, name: user.displayName, siteRole: user.siteRole, teams },
  });
});
