"use client";
/// A notice when an experiment I can read finishes while I am elsewhere in the app (the
/// console, the list, another experiment). The last statuses seen are kept for the browser
/// tab in sessionStorage, so one that finishes while a page loads is still announced.
/// Mounted on every signed-in page of the app (console and experiments pages).
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import useSWR from "swr";
import { fetchJson } from "@/app/_client/fetch";
import { buttonQuiet, focusRing } from "@/app/_console/views/styles";
import { experimentKeys } from "./api";
import { isActive, type ExperimentStatus, type ExperimentSummary } from "./types";

const KEY = "ringside.experiment-statuses";
const POLL_MS = 5000;

interface Finished {
  id: string;
  title: string;
  status: ExperimentStatus;
  done: number;
  total: number;
  failures: number;
}

function readSeen(): Record<string, ExperimentStatus> | null {
  try {
    const raw = window.sessionStorage.getItem(KEY);
    return raw ? (JSON.parse(raw) as Record<string, ExperimentStatus>) : null;
  } catch {
    return null;
  }
}

export function FinishWatcher() {
  const list = useSWR<{ experiments: ExperimentSummary[] }>(experimentKeys.list, fetchJson, { refreshInterval: POLL_MS });
  const path = usePathname();
  const [notices, setNotices] = useState<Finished[]>([]);
  const seen = useRef<Record<string, ExperimentStatus> | null>(null);

  useEffect(() => {
    const now = list.data?.experiments;
    if (!now) return;
    seen.current ??= readSeen();
    const before = seen.current;
    const next: Record<string, ExperimentStatus> = {};
    const finished: Finished[] = [];
    for (const e of now) {
      next[e.id] = e.status;
      const was = before?.[e.id];
      const ended = e.status === "done" || e.status === "cancelled";
      // only a change seen here counts: the first visit announces nothing old
      if (was !== undefined && (isActive(was) || was === "paused") && ended && path !== `/experiments/${e.id}`) {
        finished.push({ id: e.id, title: e.title, status: e.status, done: e.done, total: e.total, failures: e.failures });
      }
    }
    seen.current = next;
    try {
      window.sessionStorage.setItem(KEY, JSON.stringify(next));
    } catch {
      // storage full or refused: notices still work while the page stays open
    }
    if (finished.length) setNotices((n) => [...n, ...finished]);
  }, [list.data, path]);

  if (notices.length === 0) return null;
  return (
    <div
      className="fixed bottom-4 right-4 z-50 flex w-[min(24rem,92vw)] flex-col gap-2"
      role="status"
      aria-live="polite"
      data-testid="finish-notices"
    >
      {notices.map((n) => (
        <div key={n.id} className="rounded-md border border-ink/20 bg-white p-3 text-sm shadow-lg dark:border-paper/20 dark:bg-night-panel">
          <p>
            The experiment <strong>{n.title}</strong> {n.status === "done" ? "finished" : "was cancelled"}: {n.done} of {n.total} members,{" "}
            {n.failures} not ok.
          </p>
          <p className="mt-1 flex gap-2">
            <Link href={`/experiments/${n.id}`} className={`underline ${focusRing}`}>
              Open it
            </Link>
            <button type="button" className={buttonQuiet} onClick={() => setNotices((all) => all.filter((x) => x.id !== n.id))}>
              Dismiss
            </button>
          </p>
        </div>
      ))}
    </div>
  );
}
