import Link from "next/link";
import type { ReactNode } from "react";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { listTeams } from "@/lib/sharing/teams";
import { Console } from "./_console/console";
import { FinishWatcher } from "./_experiments/finish-watcher";

// Badges past this many would push the header wider than the window.
const TEAMS_SHOWN = 2;

const one = (v: string | string[] | undefined): string | null => (typeof v === "string" && v !== "" ? v : null);

/// The console page: the header, then the console (sessions, shelf, transcript, input);
/// `?session=<id>` opens that session, and `&link=<token>` reads it through a published
/// read-only link, which also works signed out (proxy.ts lets that visit through).
export default async function ConsolePage({
  searchParams,
}: {
  searchParams: Promise<{ session?: string | string[]; link?: string | string[] }>;
}) {
  const user = await currentUser();
  const params = await searchParams;
  const session = one(params.session);
  const link = one(params.link);
  if (!user) {
    if (!session || !link) redirect("/sign-in");
    return <LinkVisitorPage sessionId={session} link={link} />;
  }
  const teamRows = await listTeams(user);

  return (
    <PageShell>
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
        <Link href="/experiments" className="text-ink-soft underline">
          Experiments
        </Link>
        <Link href="/teams" className="text-ink-soft underline">
          Teams
        </Link>
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
      <Console initialSessionId={session} linkToken={link} signedIn />
      <FinishWatcher />
    </PageShell>
  );
}

/// A signed-out visitor with a read-only link: the session alone, no account controls.
function LinkVisitorPage({ sessionId, link }: { sessionId: string; link: string }) {
  const back = `/?session=${encodeURIComponent(sessionId)}&link=${encodeURIComponent(link)}`;
  return (
    <PageShell>
      <nav className="flex items-center gap-4 text-sm">
        <span className="text-ink-soft">Visiting through a read-only link</span>
        <Link href={`/sign-in?callbackUrl=${encodeURIComponent(back)}`} className="text-ink-soft underline">
          Sign in
        </Link>
      </nav>
      <Console initialSessionId={sessionId} linkToken={link} signedIn={false} />
    </PageShell>
  );
}

/// The page frame: the header with the product's name, its navigation, then the console.
function PageShell({ children }: { children: [ReactNode, ReactNode] | [ReactNode, ReactNode, ReactNode] }) {
  const [nav, body, extra] = children;
  return (
    <div className="flex h-screen flex-col">
      <header className="flex items-center justify-between border-b border-ink/10 bg-white px-5 py-3 dark:border-paper/10 dark:bg-night-panel dark:text-paper">
        <p className="font-mono text-lg font-semibold tracking-tight">
          Ringside<span className="text-signal">.</span>
        </p>
        {nav}
      </header>
      {body}
      {extra}
    </div>
  );
}
