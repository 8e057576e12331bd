import { latestAuditEntries } from "@/lib/auth/audit-log";
import { requireSiteRole } from "@/lib/auth/current-user";
import { route } from "@/lib/http/errors";

/// The latest audit entries, for site admins.
export const GET = route(async (req) => {
  await requireSiteRole("admin");
  const requested = Number(new URL(req.url).searchParams.get("limit") ?? 100);
  const limit = Number.isInteger(requested) && requested > 0 ? Math.min(requested, 1000) : 100;
  const entries = await latestAuditEntries(limit);
  return Response.json({ entries });
});
