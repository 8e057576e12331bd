import Link from "next/link";
import { redirect } from "next/navigation";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, teams } from "@/db/schema";
import { currentUser } from "@/lib/auth/current-user";
import { Console } from "./_console/console";

// Badges past this many would push the header wider than the window.
const TEAMS_SHOWN = 2;

/// The console page: the header, then the console (sessions, shelf, transcript, input);
/// `?session=<id>` opens that session.
export default async function ConsolePage({ searchParams }: { searchParams: Promise<{ session?: string | string[] }> }) {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  const { session } = await searchParams;
  const teamRows = await db()
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, user.id))
    .orderBy(teams.name);

  return (
    <div className="flex h-screen flex-col">
      <header className="flex items-center justify-between border-b border-ink/10 bg-white px-5 py-3 dark:border-paper/10 dark:bg-night-panel dark:text-paper">
        <p className="font-mono text-lg font-semibold tracking-tight">
          Ringside<span className="text-signal">.</span>
        </p>
        <nav className="flex items-center gap-4 text-sm">
          {teamRows.slice(0, TEAMS_SHOWN).map((t) => (
            <span key={t.id} className="whitespace-nowrap rounded-full bg-paper-deep px-2 py-0.5 text-ink-soft">
              {t.name} · {t.role}
            </span>
          ))}
          {teamRows.length > TEAMS_SHOWN && (
            <span className="whitespace-nowrap text-ink-soft" title={teamRows.map((t) => `${t.name} · ${t.role}`).join("\n")}>
              +{teamRows.length - TEAMS_SHOWN} more teams
            </span>
          )}
          {user.siteRole === "admin" && (
            <Link href="/mailbox" className="text-ink-soft underline">
              Mailbox
            </Link>
          )}
          <span className="font-medium" data-testid="user-name">
            {user.displayName}
          </span>
          <Link href="/sign-out" className="text-ink-soft underline">
            Sign out
          </Link>
        </nav>
      </header>
      <Console initialSessionId={typeof session === "string" ? session : null} />
    </div>
  );
}
