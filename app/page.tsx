import Link from "next/link";
import { redirect } from "next/navigation";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, teams } from "@/db/schema";
import { currentUser } from "@/lib/auth/current-user";

/// The console shell: the frame the console (sessions, shelf, transcript, input) fills.
export default async function ConsolePage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  const teamRows = await db()
    .select({ name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, user.id));

  return (
    <div className="flex min-h-screen flex-col">
      <header className="flex items-center justify-between border-b border-ink/10 bg-white px-5 py-3">
        <p className="font-mono text-lg font-semibold tracking-tight">
          Ringside<span className="text-signal">.</span>
        </p>
        <nav className="flex items-center gap-4 text-sm">
          {teamRows.map((t) => (
            <span key={t.name} className="rounded-full bg-paper-deep px-2 py-0.5 text-ink-soft">
              {t.name} · {t.role}
            </span>
          ))}
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
      <div className="grid flex-1 grid-cols-[16rem_1fr] gap-4 p-4">
        <aside className="flex flex-col gap-4">
          <section aria-label="Sessions" className="placeholder-region flex-1">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Sessions</h2>
          </section>
          <section aria-label="Shelf" className="placeholder-region flex-1">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Shelf</h2>
          </section>
        </aside>
        <main className="flex flex-col gap-4">
          <section aria-label="Transcript" className="placeholder-region flex-1">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Transcript</h2>
          </section>
          <section aria-label="Input" className="placeholder-region font-mono">
            <h2 className="font-sans text-sm font-semibold uppercase tracking-wide text-ink-soft">Input</h2>
          </section>
        </main>
      </div>
    </div>
  );
}
