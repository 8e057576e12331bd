"use client";
/// The experiments room: one experiment's progress, controls, live table, plots, exports,
/// sharing and recipe. Viewers and link holders see everything but the controls (the API
/// refuses those to them too); the controls appear only once the server says canEdit.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type KeyboardEvent } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { keys } from "@/app/_console/api/client";
import type { SessionDetail } from "@/lib/wire/reading";
import { Modal } from "@/app/_console/views/modal";
import { ShareSessionPanel } from "@/app/_console/views/share-dialog";
import { buttonPrimary, buttonSecondary, focusRing, panelHeading } from "@/app/_console/views/styles";
import { actOn } from "./api";
import { fileStem } from "./data/format";
import { ExportMenu } from "./export-menu";
import { ROWS_IN_BROWSER, useAllRows, useExperiment } from "./hooks";
import { CLIENT_ROWS, LiveTable } from "./live-table";
import { PlotPanel, type PlotKind } from "./plots/plot-panel";
import { ProgressBar } from "./progress-bar";
import { ExperimentStatusBadge } from "./experiment-status";
import { isActive, type Experiment } from "./types";

type Tab = "table" | "plots" | "recipe";
const TABS: [Tab, string][] = [
  ["table", "Table"],
  ["plots", "Plots"],
  ["recipe", "Recipe"],
];

export function ExperimentRoom({
  id,
  link,
  signedIn,
  initialTab,
  initialPlot,
}: {
  id: string;
  link: string | null;
  signedIn: boolean;
  initialTab: Tab;
  initialPlot?: PlotKind;
}) {
  const answer = useExperiment(id, link);
  const e = answer.data?.experiment;
  const canEdit = signedIn && answer.data?.canEdit === true;
  const session = useSWR<{ session: SessionDetail }>(e ? keys.session(e.sessionId, link) : null, fetchJson);
  const canShare = signedIn && session.data?.session.canManageSharing === true;
  // the plots (and the table of a small experiment) read every row so far
  const rows = useAllRows(id, link, e?.done ?? 0, e?.total ?? 0);
  const [tab, setTab] = useState<Tab>(initialTab);
  const [notice, setNotice] = useState<string | null>(null);
  const [sharing, setSharing] = useState(false);
  const [busy, setBusy] = useState(false);
  const router = useRouter();

  if (answer.error) {
    return (
      <p role="alert" className="p-6 text-sm text-red-700 dark:text-red-300">
        {link ? "This read-only link does not open the experiment: it was revoked, or the address is incomplete." : messageOf(answer.error)}
      </p>
    );
  }
  if (!e) return <p className="p-6 text-sm text-ink-soft">Opening the experiment…</p>;

  const act = async (action: "pause" | "resume" | "cancel" | "rerun") => {
    setBusy(true);
    setNotice(null);
    try {
      const { experiment } = await actOn(e.id, action);
      if (action === "rerun") {
        router.push(`/experiments/${experiment.id}`);
        return;
      }
      await answer.mutate();
      setNotice(
        action === "pause"
          ? "Paused: running members finish, the rest wait."
          : action === "resume"
            ? "Resumed: the remaining members are queued."
            : "Cancelled: members without a row are marked cancelled.",
      );
    } catch (err) {
      setNotice(`Could not ${action === "rerun" ? "run it again" : action}: ${messageOf(err)}`);
    } finally {
      setBusy(false);
    }
  };

  const onTabKey = (ev: KeyboardEvent<HTMLDivElement>) => {
    const k = TABS.findIndex(([t]) => t === tab);
    const next = ev.key === "ArrowRight" ? (k + 1) % TABS.length : ev.key === "ArrowLeft" ? (k + TABS.length - 1) % TABS.length : null;
    if (next === null) return;
    ev.preventDefault();
    setTab(TABS[next][0]);
    document.getElementById(`tab-${TABS[next][0]}`)?.focus();
  };

  const truncated = e.total > ROWS_IN_BROWSER ? ROWS_IN_BROWSER : null;

  return (
    <div className="mx-auto flex w-full max-w-[96rem] min-w-0 flex-col gap-4 px-5 py-4">
      <div className="flex flex-wrap items-start gap-3">
        <div className="min-w-0 flex-1">
          <p className={panelHeading}>
            <Link href="/experiments" className={`underline ${focusRing}`}>
              Experiments
            </Link>{" "}
            · session{" "}
            <Link
              href={link ? `/?session=${e.sessionId}&link=${encodeURIComponent(link)}` : `/?session=${e.sessionId}`}
              className={`underline ${focusRing}`}
            >
              {session.data?.session.title ?? "…"}
            </Link>
          </p>
          <h1 className="mt-1 flex flex-wrap items-center gap-2 text-lg font-semibold" data-testid="experiment-title">
            <span className="break-all">{e.title}</span>
            <ExperimentStatusBadge status={e.status} />
            {!canEdit && (
              <span
                className="rounded bg-signal-soft px-1.5 py-0.5 text-xs font-normal text-ink dark:bg-signal/30 dark:text-paper"
                data-testid="read-only-badge"
              >
                {link && !signedIn ? "read-only shared link" : "read-only"}
              </span>
            )}
          </h1>
        </div>
        <div className="flex flex-wrap items-center gap-1.5">
          {canEdit && (e.status === "running" || e.status === "queued") && (
            <button type="button" className={buttonSecondary} disabled={busy} onClick={() => void act("pause")}>
              Pause
            </button>
          )}
          {canEdit && e.status === "paused" && (
            <button type="button" className={buttonPrimary} disabled={busy} onClick={() => void act("resume")}>
              Resume
            </button>
          )}
          {canEdit && (isActive(e.status) || e.status === "paused") && (
            <button type="button" className={buttonSecondary} disabled={busy} onClick={() => void act("cancel")}>
              Cancel
            </button>
          )}
          {canEdit && (e.status === "done" || e.status === "cancelled") && (
            <button
              type="button"
              className={buttonSecondary}
              disabled={busy}
              onClick={() => void act("rerun")}
              title="A new experiment with the same program, members, seeds and probe"
            >
              Run again
            </button>
          )}
          {canShare && (
            <button type="button" className={buttonSecondary} onClick={() => setSharing(true)}>
              Share
            </button>
          )}
          <ExportMenu experiment={e} link={link} />
        </div>
      </div>

      <div className="flex flex-col gap-1">
        <ProgressBar experiment={e} />
        <p
          role="status"
          aria-live="polite"
          className="min-h-[1.25rem] text-sm text-ink-soft dark:text-signal-soft"
          data-testid="room-notice"
        >
          {notice}
        </p>
      </div>

      <div
        role="tablist"
        aria-label="Views of the experiment"
        className="flex gap-1 border-b border-ink/10 dark:border-paper/10"
        onKeyDown={onTabKey}
      >
        {TABS.map(([t, label]) => (
          <button
            key={t}
            id={`tab-${t}`}
            type="button"
            role="tab"
            aria-selected={tab === t}
            aria-controls={`panel-${t}`}
            tabIndex={tab === t ? 0 : -1}
            onClick={() => setTab(t)}
            className={`-mb-px border-b-2 px-3 py-1.5 text-sm font-medium ${tab === t ? "border-signal text-ink dark:text-paper" : "border-transparent text-ink-soft hover:text-ink dark:text-paper/60 dark:hover:text-paper"} ${focusRing}`}
          >
            {label}
          </button>
        ))}
      </div>

      <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`} className="min-w-0">
        {tab === "table" && (
          <LiveTable
            experiment={e}
            link={link}
            canEdit={canEdit}
            allRows={{ rows: e.total <= CLIENT_ROWS ? rows.data?.rows : undefined, error: rows.error }}
          />
        )}
        {tab === "plots" && (
          <PlotPanel
            rows={rows.data?.rows ?? []}
            columns={e.columns}
            fileStem={fileStem(e.title, e.id)}
            truncatedTo={truncated}
            initialKind={initialPlot}
          />
        )}
        {tab === "recipe" && <Recipe experiment={e} />}
      </div>

      <Modal open={sharing} title={`Share “${session.data?.session.title ?? "the session"}”`} onClose={() => setSharing(false)}>
        <p className="text-sm">
          An experiment is shared with its session: whoever may read the session reads this experiment; editors may pause, resume and cancel
          it. A published read-only link opens this page signed out too.
        </p>
        <ShareSessionPanel sessionId={e.sessionId} onChanged={setNotice} />
        <ExperimentLink experimentId={e.id} sessionId={e.sessionId} />
      </Modal>
    </div>
  );
}

/// The read-only address of this experiment, made from the session's published link.
function ExperimentLink({ experimentId, sessionId }: { experimentId: string; sessionId: string }) {
  const sharing = useSWR<{ link: { url: string | null } }>(keys.sessionShares(sessionId), fetchJson);
  const url = sharing.data?.link.url;
  if (!url)
    return (
      <p className="text-sm text-ink-soft dark:text-paper/70">Publish the read-only link above to get an address for this experiment.</p>
    );
  const token = new URL(url, window.location.origin).searchParams.get("link");
  const address = `${window.location.origin}/experiments/${experimentId}?link=${encodeURIComponent(token ?? "")}`;
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className={panelHeading}>Read-only address of this experiment</span>
      <input
        readOnly
        value={address}
        data-testid="experiment-link"
        className="rounded-md border border-ink/20 bg-white px-2 py-1 font-mono text-xs dark:border-paper/20 dark:bg-night"
        onFocus={(ev) => ev.currentTarget.select()}
      />
    </label>
  );
}

function Recipe({ experiment: e }: { experiment: Experiment }) {
  const item = (label: string, value: string, mono = true) => (
    <div className="contents">
      <dt className="text-ink-soft dark:text-paper/60">{label}</dt>
      <dd className={mono ? "whitespace-pre-wrap break-all font-mono text-sm" : "text-sm"}>{value}</dd>
    </div>
  );
  return (
    <dl className="grid grid-cols-[10rem_minmax(0,1fr)] gap-x-3 gap-y-2 text-sm" aria-label="How to reproduce the experiment">
      {item("Family (with seed)", e.familyDefinition)}
      {item("Probe", e.probe)}
      {item("Program", e.program)}
      {item("Engine version", e.engineVersion)}
      {item("Limits per member", `${e.limits.timeLimitMs / 1000} s, ${e.limits.heapLimitMb} MB`, false)}
      {item("Created", new Date(e.createdAt).toLocaleString(), false)}
      {e.finishedAt && item("Finished", new Date(e.finishedAt).toLocaleString(), false)}
      {e.rerunOf && item("Runs again", e.rerunOf)}
    </dl>
  );
}
