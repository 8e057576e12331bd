/// Test users of the test database (never the demo seed): one group with a lead, a member
/// and a guest, a site admin, and a user outside every team. Idempotent and safe to call
/// from several test files at once.
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, teams, users, type SiteRole, type TeamRole } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { CurrentUser } from "@/lib/auth/types";

export type FixtureKey = "lead" | "member" | "guest" | "admin" | "outsider";

export const TEST_ACCOUNTS: Record<
  FixtureKey,
  { email: string; name: string; password: string; siteRole: SiteRole; teamRole: TeamRole | null }
> = {
  lead: { email: "lead@harbor.test.example", name: "Lena Lead", password: "lead-pass-4821", siteRole: "member", teamRole: "lead" },
  member: {
    email: "member@harbor.test.example",
    name: "Milo Member",
    password: "member-pass-7310",
    siteRole: "member",
    teamRole: "member",
  },
  guest: { email: "guest@harbor.test.example", name: "Gus Guest", password: "guest-pass-5902", siteRole: "member", teamRole: "guest" },
  admin: { email: "admin@harbor.test.example", name: "Ada Admin", password: "admin-pass-6645", siteRole: "admin", teamRole: null },
  outsider: {
    email: "outsider@harbor.test.example",
    name: "Otto Outsider",
    password: "outsider-pass-1187",
    siteRole: "member",
    teamRole: null,
  },
};

export const TEST_TEAM_SLUG = "harbor-test-group";

export interface TestGroup {
  teamId: string;
  users: Record<FixtureKey, CurrentUser>;
}

export async function ensureTestGroup(): Promise<TestGroup> {
  const database = db();
  const keys = Object.keys(TEST_ACCOUNTS) as FixtureKey[];
  const emails = keys.map((k) => TEST_ACCOUNTS[k].email);
  const existing = new Set(
    (await database.select({ email: users.email }).from(users).where(inArray(users.email, emails))).map((r) => r.email),
  );
  const missing = keys.filter((k) => !existing.has(TEST_ACCOUNTS[k].email));
  if (missing.length > 0) {
    const rows = await Promise.all(
      missing.map(async (k) => ({
        email: TEST_ACCOUNTS[k].email,
        displayName: TEST_ACCOUNTS[k].name,
        passwordHash: await hashPassword(TEST_ACCOUNTS[k].password),
        siteRole: TEST_ACCOUNTS[k].siteRole,
      })),
    );
    await database.insert(users).values(rows).onConflictDoNothing({ target: users.email });
  }
  const rows = await database
    .select({ id: users.id, email: users.email, displayName: users.displayName, siteRole: users.siteRole })
    .from(users)
    .where(inArray(users.email, emails));
  const byEmail = new Map(rows.map((r) => [r.email, r]));
  const fixtureUsers = Object.fromEntries(keys.map((k) => [k, byEmail.get(TEST_ACCOUNTS[k].email)!])) as Record<FixtureKey, CurrentUser>;

  await database
    .insert(teams)
    .values({ slug: TEST_TEAM_SLUG, name: "Harbor test group", createdBy: fixtureUsers.lead.id })
    .onConflictDoNothing({ target: teams.slug });
  const [team] = await database.select({ id: teams.id }).from(teams).where(eq(teams.slug, TEST_TEAM_SLUG));
  await database
    .insert(memberships)
    .values(
      keys
        .filter((k) => TEST_ACCOUNTS[k].teamRole !== null)
        .map((k) => ({ teamId: team!.id, userId: fixtureUsers[k].id, role: TEST_ACCOUNTS[k].teamRole! })),
    )
    .onConflictDoNothing();
  return { teamId: team!.id, users: fixtureUsers };
}

/// A fresh e-mail address for a test that creates its own account.
export function uniqueEmail(tag: string): string {
  return `${tag}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@signup.test.example`;
}
