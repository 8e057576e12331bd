"use client";
/// The caller's teams, each linking to its page, and the form that creates a team.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { api, buttonClass, inputClass, Notice, PageFrame } from "./ui";

interface TeamRow {
  id: string;
  slug: string;
  name: string;
  description: string;
  role: "lead" | "member" | "guest";
}

export function TeamList() {
  const router = useRouter();
  const [teams, setTeams] = useState<TeamRow[] | null>(null);
  const [name, setName] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    api<{ teams: TeamRow[] }>("/api/teams")
      .then((d) => setTeams(d.teams))
      .catch((e: Error) => setError(e.message));
  }, []);

  async function create(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const { team } = await api<{ team: TeamRow }>("/api/teams", { body: { name } });
      router.push(`/teams/${team.id}`);
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }

  return (
    <PageFrame title="Teams">
      <p className="mt-1 text-sm text-ink-soft">Research groups you belong to. A team&apos;s lead invites members and guests by e-mail.</p>
      <Notice text={error} tone="error" />
      {teams === null ? (
        <p className="mt-6 text-ink-soft">Loading…</p>
      ) : teams.length === 0 ? (
        <p className="mt-6 text-ink-soft">You are not in a team yet.</p>
      ) : (
        <ul className="mt-6 divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white dark:bg-night-panel" aria-label="Your teams">
          {teams.map((t) => (
            <li key={t.id} className="flex items-baseline justify-between px-4 py-3">
              <Link href={`/teams/${t.id}`} className="font-medium underline">
                {t.name}
              </Link>
              <span className="rounded-full bg-paper-deep px-2 py-0.5 text-xs text-ink-soft">{t.role}</span>
            </li>
          ))}
        </ul>
      )}
      <form onSubmit={create} className="mt-8 flex items-end gap-2">
        <label className="flex flex-col text-sm">
          New team name
          <input className={inputClass} value={name} onChange={(e) => setName(e.target.value)} required maxLength={120} />
        </label>
        <button type="submit" className={buttonClass} disabled={busy || name.trim() === ""}>
          Create team
        </button>
      </form>
    </PageFrame>
  );
}
