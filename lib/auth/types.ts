import type { SiteRole } from "@/db/schema";

/// The signed-in user as every server-side check sees it (loaded fresh from the database).
export interface CurrentUser {
  id: string;
  email: string;
  displayName: string;
  siteRole: SiteRole;
}
