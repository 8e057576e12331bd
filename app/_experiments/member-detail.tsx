"use client";
/// An expanded row: the member typeset (the whole member, read from the API: the label is
/// cut at 120 characters), every field of the probe's result, the message of a failed row,
/// and "Open in a session", which puts the member into a new cell.
import { useState } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import type { ValueReading as ValueJson } from "@/lib/wire/reading";
import { buttonSecondary, panelHeading } from "@/app/_console/views/styles";
import { ValueView } from "@/app/_console/views/value-view";
import { experimentKeys, runAsCell } from "./api";
import { memberCellSource } from "./data/member-cell";
import type { Experiment, MemberAnswer, Row } from "./types";
import { RowStatusBadge } from "./status-chips";

export function MemberDetail({
  experiment,
  row,
  link,
  canEdit,
}: {
  experiment: Experiment;
  row: Row;
  link: string | null;
  canEdit: boolean;
}) {
  const member = useSWR<MemberAnswer>(experimentKeys.member(experiment.id, row.index, link), fetchJson);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const open = async () => {
    if (!member.data) return;
    setBusy(true);
    setProblem(null);
    try {
      await runAsCell(experiment.sessionId, memberCellSource(experiment, row.index, member.data.member));
      window.location.assign(`/?session=${experiment.sessionId}`);
    } catch (e) {
      setProblem(`The member could not be put into the session: ${messageOf(e)}`);
      setBusy(false);
    }
  };

  return (
    <div className="flex flex-col gap-3 px-3 py-3" data-testid="member-detail">
      <div className="flex items-center gap-2">
        <h3 className={panelHeading}>Member {row.index}</h3>
        <RowStatusBadge status={row.status} />
        <span className="text-xs text-ink-soft dark:text-paper/70">
          {row.seconds.toFixed(3)} s on {row.worker}
        </span>
        {canEdit && (
          <button type="button" className={`${buttonSecondary} ml-auto`} disabled={!member.data || busy} onClick={() => void open()}>
            {busy ? "Opening…" : "Open in a session"}
          </button>
        )}
      </div>
      {member.error && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {messageOf(member.error)}
        </p>
      )}
      {member.data ? (
        <ValueView value={member.data.member} />
      ) : (
        !member.error && <p className="text-sm text-ink-soft">Reading the member…</p>
      )}
      {row.message && (
        <p className="rounded bg-red-50 px-2 py-1 text-sm text-red-800 dark:bg-red-900/30 dark:text-red-200" data-testid="row-message">
          {row.message}
        </p>
      )}
      {Object.keys(row.fields).length > 0 && (
        <div className="flex flex-col gap-2" aria-label="The probe's result">
          {Object.entries(row.fields).map(([name, value]) => (
            <div key={name} className="flex items-start gap-2">
              <span className="w-20 shrink-0 pt-0.5 text-right font-mono text-sm text-ink-soft dark:text-paper/70">{name}</span>
              <ValueView value={value as ValueJson} />
            </div>
          ))}
        </div>
      )}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {problem}
        </p>
      )}
    </div>
  );
}
