"use client";
/// A team's page: its members with their roles (leads change roles and remove members;
/// anyone may leave), the invite form and pending invitations (leads), the sessions shared
/// with the team, and a form to share one of one's own sessions with it.
import Link from "next/link";
import { useCallback, useEffect, useState } from "react";
import { api, buttonClass, inputClass, Notice, PageFrame, quietButtonClass } from "../ui";

type TeamRole = "lead" | "member" | "guest";
interface Detail {
  team: { id: string; name: string; description: string; slug: string };
  role: TeamRole;
  members: { userId: string; name: string; email: string; role: TeamRole }[];
  invitations: { id: string; email: string; role: TeamRole; expiresAt: string }[];
  sharedSessions: {
    id: string;
    title: string;
    ownerName: string;
    role: "viewer" | "editor";
    shareId: string | null;
    via: "share" | "team visibility";
  }[];
}
interface SessionRow {
  id: string;
  title: string;
  access: "owner" | "editor" | "viewer";
}

export function TeamView({ teamId, userId }: { teamId: string; userId: string }) {
  const [detail, setDetail] = useState<Detail | null>(null);
  const [own, setOwn] = useState<SessionRow[]>([]);
  const [notice, setNotice] = useState<{ text: string; tone: "ok" | "error" } | null>(null);
  const [email, setEmail] = useState("");
  const [inviteRole, setInviteRole] = useState<"member" | "guest">("member");
  const [shareSession, setShareSession] = useState("");
  const [shareRole, setShareRole] = useState<"viewer" | "editor">("editor");
  const [busy, setBusy] = useState(false);

  const load = useCallback(async () => {
    try {
      const [d, s] = await Promise.all([api<Detail>(`/api/teams/${teamId}`), api<{ sessions: SessionRow[] }>("/api/sessions")]);
      setDetail(d);
      setOwn(s.sessions.filter((x) => x.access === "owner"));
    } catch (e) {
      setNotice({ text: (e as Error).message, tone: "error" });
    }
  }, [teamId]);
  useEffect(() => {
    void load();
  }, [load]);

  async function act(what: () => Promise<unknown>, done: string) {
    setBusy(true);
    setNotice(null);
    try {
      await what();
      setNotice({ text: done, tone: "ok" });
      await load();
    } catch (e) {
      setNotice({ text: (e as Error).message, tone: "error" });
    } finally {
      setBusy(false);
    }
  }

  if (!detail) {
    return (
      <PageFrame title="Team">
        {notice ? <Notice text={notice.text} tone={notice.tone} /> : <p className="mt-6 text-ink-soft">Loading…</p>}
      </PageFrame>
    );
  }
  const lead = detail.role === "lead";

  return (
    <PageFrame title={detail.team.name}>
      <p className="mt-1 text-sm text-ink-soft">
        {detail.team.description || "A Ringside team."} You are <strong data-testid="my-team-role">{detail.role}</strong>.
      </p>
      {notice && <Notice text={notice.text} tone={notice.tone} />}

      <section aria-label="Members" className="mt-6">
        <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Members</h2>
        <ul className="mt-2 divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white dark:bg-night-panel">
          {detail.members.map((m) => (
            <li key={m.userId} className="flex items-center justify-between gap-3 px-4 py-2" data-testid="member-row">
              <span>
                <span className="font-medium">{m.name}</span> <span className="text-sm text-ink-soft">{m.email}</span>
              </span>
              <span className="flex items-center gap-2">
                {lead ? (
                  <select
                    aria-label={`Role of ${m.name}`}
                    className={inputClass}
                    value={m.role}
                    disabled={busy}
                    onChange={(e) =>
                      act(
                        () => api(`/api/teams/${teamId}/members/${m.userId}`, { method: "PATCH", body: { role: e.target.value } }),
                        `${m.name} is now ${e.target.value}.`,
                      )
                    }
                  >
                    <option value="lead">lead</option>
                    <option value="member">member</option>
                    <option value="guest">guest</option>
                  </select>
                ) : (
                  <span className="rounded-full bg-paper-deep px-2 py-0.5 text-xs text-ink-soft">{m.role}</span>
                )}
                {(lead || m.userId === userId) && (
                  <button
                    type="button"
                    className={quietButtonClass}
                    disabled={busy}
                    onClick={() =>
                      act(
                        () => api(`/api/teams/${teamId}/members/${m.userId}`, { method: "DELETE" }),
                        m.userId === userId ? "You left the team." : `${m.name} was removed.`,
                      )
                    }
                  >
                    {m.userId === userId ? "Leave" : "Remove"}
                  </button>
                )}
              </span>
            </li>
          ))}
        </ul>
      </section>

      {lead && (
        <section aria-label="Invite" className="mt-8">
          <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Invite by e-mail</h2>
          <form
            className="mt-2 flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              void act(async () => {
                await api(`/api/teams/${teamId}/invitations`, { body: { email, role: inviteRole } });
                setEmail("");
              }, `Invitation sent to ${email}.`);
            }}
          >
            <label className="flex flex-col text-sm">
              E-mail
              <input className={inputClass} type="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
            </label>
            <label className="flex flex-col text-sm">
              Role
              <select
                aria-label="Invitation role"
                className={inputClass}
                value={inviteRole}
                onChange={(e) => setInviteRole(e.target.value as "member" | "guest")}
              >
                <option value="member">member</option>
                <option value="guest">guest</option>
              </select>
            </label>
            <button type="submit" className={buttonClass} disabled={busy}>
              Send invitation
            </button>
          </form>
          {detail.invitations.length > 0 && (
            <ul className="mt-3 space-y-1 text-sm" aria-label="Pending invitations">
              {detail.invitations.map((i) => (
                <li key={i.id} className="flex items-center gap-3">
                  <span>
                    {i.email} · {i.role} · expires {new Date(i.expiresAt).toUTCString()}
                  </span>
                  <button
                    type="button"
                    className={quietButtonClass}
                    disabled={busy}
                    onClick={() =>
                      act(() => api(`/api/teams/${teamId}/invitations/${i.id}`, { method: "DELETE" }), `Invitation to ${i.email} revoked.`)
                    }
                  >
                    Revoke
                  </button>
                </li>
              ))}
            </ul>
          )}
        </section>
      )}

      <section aria-label="Shared sessions" className="mt-8">
        <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Sessions shared with the team</h2>
        {detail.sharedSessions.length === 0 ? (
          <p className="mt-2 text-sm text-ink-soft">None yet.</p>
        ) : (
          <ul className="mt-2 space-y-1 text-sm">
            {detail.sharedSessions.map((s) => (
              <li key={s.id} data-testid="team-session">
                <Link href={`/?session=${s.id}`} className="underline">
                  {s.title}
                </Link>{" "}
                <span className="text-ink-soft">
                  by {s.ownerName} · {s.role}
                  {s.via === "team visibility" ? " · visible to the team" : ""}
                </span>
              </li>
            ))}
          </ul>
        )}
        {detail.role !== "guest" && own.length > 0 && (
          <form
            className="mt-3 flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              const title = own.find((s) => s.id === shareSession)?.title ?? "";
              void act(
                () => api(`/api/sessions/${shareSession}/shares`, { body: { teamId, role: shareRole } }),
                `“${title}” is shared with ${detail.team.name} (${shareRole}; guests read only).`,
              );
            }}
          >
            <label className="flex flex-col text-sm">
              Share one of your sessions
              <select
                aria-label="Share one of your sessions"
                className={inputClass}
                required
                value={shareSession}
                onChange={(e) => setShareSession(e.target.value)}
              >
                <option value="">choose a session…</option>
                {own.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.title}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col text-sm">
              As
              <select
                aria-label="Share as"
                className={inputClass}
                value={shareRole}
                onChange={(e) => setShareRole(e.target.value as "viewer" | "editor")}
              >
                <option value="editor">editor</option>
                <option value="viewer">viewer</option>
              </select>
            </label>
            <button type="submit" className={buttonClass} disabled={busy || shareSession === ""}>
              Share with the team
            </button>
          </form>
        )}
      </section>
    </PageFrame>
  );
}
