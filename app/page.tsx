import Link from "next/link";
import type { ReactNode } from "react";
import { redirect } from "next/navigation";
import { sessionRole } from "@/lib/auth/access";
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
    if (!(await opens(null, session, link))) return <DeadLinkPage signedIn={false} />;
    return <LinkVisitorPage sessionId={session} link={link} />;
  }
  // A link that no longer opens the session (revoked, or mistyped) gets one message, not a
  // console that half-loads and contradicts itself.
  if (session && link && !(await opens(user, session, link))) return <DeadLinkPage signedIn />;
  const teamRows = await listTeams(user);

  return (
    <PageShell>
      <nav className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
        {teamRows.slice(0, TEAMS_SHOWN).map((t) => (
          <span key={t.id} className="hidden whitespace-nowrap rounded-full bg-paper-deep px-2 py-0.5 text-ink-soft md:inline">
            {t.name} · {t.role}
          </span>
        ))}
        {teamRows.length > TEAMS_SHOWN && (
          <span
            className="hidden whitespace-nowrap text-ink-soft md:inline"
            title={teamRows.map((t) => `${t.name} · ${t.role}`).join("\n")}
          >
            +{teamRows.length - TEAMS_SHOWN} more teams
          </span>
        )}
        <Link
          href="/reference"
          className="text-ink-soft underline"
          title="The notation reference: every function, property and option, searchable"
        >
          Notation
        </Link>
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

/// Whether the visitor (signed in or not) can read the session with this link.
async function opens(user: Awaited<ReturnType<typeof currentUser>>, sessionId: string, link: string): Promise<boolean> {
  const found = await sessionRole(user, sessionId, { linkToken: link });
  return found !== null && found.role !== null;
}

/// The one message for a read-only link that does not open its session.
function DeadLinkPage({ signedIn }: { signedIn: boolean }) {
  return (
    <div className="flex min-h-screen items-center justify-center px-4">
      <div className="max-w-md rounded-xl border border-ink/10 bg-white p-6 shadow-sm" role="alert" data-testid="dead-link">
        <h1 className="text-lg font-semibold">This read-only link does not open a session</h1>
        <p className="mt-2 text-ink-soft">
          Its owner has revoked it, or the address was cut short when it was copied. Ask the session&apos;s owner for a new link.
        </p>
        <p className="mt-4 text-sm">
          <Link href={signedIn ? "/" : "/sign-in"} className="underline">
            {signedIn ? "Go to your console" : "Sign in"}
          </Link>
        </p>
      </div>
    </div>
  );
}

/// A signed-out visitor with a read-only link: the session alone, no account controls.
function LinkVisitorPage({ sessionId, link }: { sessionId: string; link: string }) {
  const back = `/?session=${encodeURIComponent(sessionId)}&link=${encodeURIComponent(link)}`;
  return (
    <PageShell>
      <nav className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
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
    <div className="flex min-h-screen flex-col md:h-screen">
      <header className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 border-b border-ink/10 bg-white px-5 py-3 dark:border-paper/10 dark:bg-night-panel dark:text-paper">
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
