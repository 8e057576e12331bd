"use client";
/// Every experiment I can read — of my sessions, of sessions shared with me and of my
/// teams' sessions — newest first, with progress; "Mine" and "Shared with me" narrow it.
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { keys } from "@/app/_console/api/client";
import type { SessionSummary } from "@/lib/wire/reading";
import { buttonSecondary, focusRing, panelHeading } from "@/app/_console/views/styles";
import { experimentKeys } from "./api";
import { ExperimentStatusBadge } from "./experiment-status";
import { isActive, type ExperimentSummary } from "./types";

type Whose = "all" | "mine" | "shared";

const COLUMNS = ["Experiment", "Status", "Done", "Session", "Created"] as const;

export function ExperimentsList() {
  const list = useSWR<{ experiments: ExperimentSummary[] }>(experimentKeys.list, fetchJson, {
    refreshInterval: (d) => (d?.experiments.some((e) => isActive(e.status)) ? 2000 : 10_000),
  });
  const sessions = useSWR<{ sessions: SessionSummary[] }>(keys.sessions, fetchJson);
  const [whose, setWhose] = useState<Whose>("all");
  const bySession = new Map((sessions.data?.sessions ?? []).map((s) => [s.id, s]));
  const all = list.data?.experiments ?? [];
  const shown = all.filter((e) => {
    const s = bySession.get(e.sessionId);
    if (whose === "all" || !s) return whose === "all";
    return whose === "mine" ? s.access === "owner" : s.access !== "owner";
  });
  return (
    <section aria-labelledby="experiments-heading" className="flex min-w-0 flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <h1 id="experiments-heading" className="text-lg font-semibold">
          Experiments
        </h1>
        <div role="group" aria-label="Whose experiments" className="flex gap-1">
          {(
            [
              ["all", "All I can read"],
              ["mine", "Mine"],
              ["shared", "Shared with me and my teams"],
            ] as const
          ).map(([w, label]) => (
            <button
              key={w}
              type="button"
              aria-pressed={whose === w}
              onClick={() => setWhose(w)}
              className={`${buttonSecondary} ${whose === w ? "!bg-ink !text-paper dark:!bg-signal dark:!text-night" : ""}`}
            >
              {label}
            </button>
          ))}
        </div>
      </div>
      {list.error && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {messageOf(list.error)}
        </p>
      )}
      {list.data && shown.length === 0 && (
        <p className="text-sm text-ink-soft dark:text-paper/70">
          No experiments here yet. Run a cell with a sweep in the console and choose “Run as an experiment”, or sweep a family file below.
        </p>
      )}
      {shown.length > 0 && (
        <div className="overflow-x-auto rounded-md border border-ink/10 dark:border-paper/10">
          <table className="w-full border-collapse text-sm" data-testid="experiments-list">
            <thead className="bg-paper-deep/60 text-left dark:bg-night-panel">
              <tr>
                {COLUMNS.map((c) => (
                  <th key={c} scope="col" className="px-3 py-1.5">
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {shown.map((e) => {
                const s = bySession.get(e.sessionId);
                return (
                  <tr key={e.id} className="border-t border-ink/10 dark:border-paper/10">
                    <td className="max-w-[28rem] px-3 py-1.5">
                      <Link href={`/experiments/${e.id}`} className={`font-medium underline underline-offset-2 ${focusRing}`}>
                        {e.title}
                      </Link>
                      <p className="truncate font-mono text-xs text-ink-soft dark:text-paper/60" title={e.probeText}>
                        {e.probeText}
                      </p>
                    </td>
                    <td className="px-3 py-1.5">
                      <ExperimentStatusBadge status={e.status} />
                    </td>
                    <td className="whitespace-nowrap px-3 py-1.5 font-mono">
                      {e.done}/{e.total}
                      {e.failures > 0 && <span className="ml-1 text-signal">({e.failures} not ok)</span>}
                    </td>
                    <td className="px-3 py-1.5">
                      {s ? (
                        <span>
                          {s.title}{" "}
                          <span className="text-xs text-ink-soft dark:text-paper/60">
                            · {s.access === "owner" ? "mine" : `${s.ownerName}'s, ${s.access}`}
                          </span>
                        </span>
                      ) : (
                        "…"
                      )}
                    </td>
                    <td className="whitespace-nowrap px-3 py-1.5 text-ink-soft dark:text-paper/70">
                      {new Date(e.createdAt).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" })}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <p className={panelHeading}>{all.length} experiments in all</p>
    </section>
  );
}
