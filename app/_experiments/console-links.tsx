"use client";
/// Where the console meets the experiments room: under a cell with a sweep, "Run as an
/// experiment" (editors) and links to the experiments made from it or named by its value;
/// and the palette's experiment commands (open, create, pause, resume, cancel).
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { fetchJson, messageOf, withLink } from "@/app/_client/fetch";
import type { Cell } from "@/lib/wire/reading";
import type { PaletteCommand } from "@/app/_console/views/command-palette";
import { buttonSecondary, focusRing } from "@/app/_console/views/styles";
import { actOn, createFromCell, experimentKeys } from "./api";
import { ExperimentStatusBadge } from "./experiment-status";
import { isActive, type ExperimentSummary } from "./types";

/// Whether a cell's program has a sweep the server can run as an experiment.
export const hasSweep = (source: string): boolean => /\bsweep\s*\(/.test(source);

export function useSessionExperiments(sessionId: string | null, signedIn: boolean, link: string | null) {
  return useSWR<{ experiments: ExperimentSummary[] }>(experimentKeys.ofSession(sessionId, signedIn, link), fetchJson, {
    refreshInterval: (d) => (d?.experiments.some((e) => isActive(e.status)) ? 3000 : 0),
  });
}

/// The experiment ids a cell's values name (an Experiment value, notation §11).
function experimentIdsIn(cell: Cell): string[] {
  return cell.results.flatMap((r) => {
    const v = r.value as { type: string; id?: unknown };
    return v.type === "Experiment" && typeof v.id === "string" ? [v.id] : [];
  });
}

export function CellExperiments({
  cell,
  sessionId,
  canEdit,
  signedIn,
  link,
}: {
  cell: Cell;
  sessionId: string | null;
  canEdit: boolean;
  signedIn: boolean;
  /// the read-only link the console was opened with: the list and the rooms are read through it
  link: string | null;
}) {
  const list = useSessionExperiments(sessionId, signedIn, link);
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const named = experimentIdsIn(cell);
  const made = (list.data?.experiments ?? []).filter((e) => e.sourceCellId === cell.id || named.includes(e.id));
  const unlisted = named.filter((id) => !made.some((e) => e.id === id));
  if (!hasSweep(cell.source) && named.length === 0) return null;
  const create = async () => {
    if (!sessionId) return;
    setBusy(true);
    setProblem(null);
    try {
      const { experiment } = await createFromCell(sessionId, cell.id);
      router.push(`/experiments/${experiment.id}`);
    } catch (e) {
      setProblem(`Not started: ${messageOf(e)}`);
      setBusy(false);
    }
  };
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm" data-testid="cell-experiments">
      {made.map((e) => (
        <a
          key={e.id}
          href={withLink(`/experiments/${e.id}`, link)}
          className={`inline-flex items-center gap-1.5 underline underline-offset-2 ${focusRing}`}
        >
          Experiment: {e.done}/{e.total} <ExperimentStatusBadge status={e.status} />
        </a>
      ))}
      {unlisted.map((id) => (
        <a key={id} href={withLink(`/experiments/${id}`, link)} className={`underline underline-offset-2 ${focusRing}`}>
          Open the experiment
        </a>
      ))}
      {canEdit && hasSweep(cell.source) && (
        <button
          type="button"
          className={buttonSecondary}
          disabled={busy}
          onClick={() => void create()}
          title="Run this cell's sweep in the background, one job per member, and open its room"
        >
          {busy ? "Starting…" : "Run as an experiment"}
        </button>
      )}
      {problem && (
        <span role="alert" className="text-red-700 dark:text-red-300">
          {problem}
        </span>
      )}
    </div>
  );
}

/// The palette's experiment commands for the open session.
export function useExperimentCommands(
  sessionId: string | null,
  cells: readonly Cell[] | undefined,
  canEdit: boolean,
  signedIn: boolean,
  link: string | null,
  notify: (s: string) => void,
): PaletteCommand[] {
  const list = useSessionExperiments(sessionId, signedIn, link);
  const router = useRouter();
  return useMemo(() => {
    if (!signedIn) return [];
    const out: PaletteCommand[] = [
      {
        id: "experiments",
        group: "Experiments",
        label: "Open the experiments list",
        keywords: ["sweep", "table", "plot"],
        run: () => router.push("/experiments"),
      },
    ];
    const lastSweep = [...(cells ?? [])].reverse().find((c) => hasSweep(c.source));
    if (canEdit && sessionId && lastSweep) {
      out.push({
        id: "experiment-create",
        group: "Experiments",
        label: "Run the last sweep cell as an experiment",
        keywords: ["create", "background", "sweep"],
        run: () =>
          void createFromCell(sessionId, lastSweep.id).then(
            ({ experiment }) => router.push(`/experiments/${experiment.id}`),
            (e) => notify(`The experiment did not start: ${messageOf(e)}`),
          ),
      });
    }
    for (const e of list.data?.experiments ?? []) {
      out.push({
        id: `experiment-open-${e.id}`,
        group: "Experiments",
        label: `Open experiment: ${e.title}`,
        keywords: [e.status],
        run: () => router.push(`/experiments/${e.id}`),
      });
      if (!canEdit) continue;
      const act = (action: "pause" | "resume" | "cancel", done: string) => () =>
        void actOn(e.id, action).then(
          () => {
            notify(`${done}: ${e.title}.`);
            void list.mutate();
          },
          (err) => notify(`Could not ${action} ${e.title}: ${messageOf(err)}`),
        );
      if (isActive(e.status))
        out.push({
          id: `experiment-pause-${e.id}`,
          group: "Experiments",
          label: `Pause experiment: ${e.title}`,
          run: act("pause", "Paused"),
        });
      if (e.status === "paused")
        out.push({
          id: `experiment-resume-${e.id}`,
          group: "Experiments",
          label: `Resume experiment: ${e.title}`,
          run: act("resume", "Resumed"),
        });
      if (isActive(e.status) || e.status === "paused")
        out.push({
          id: `experiment-cancel-${e.id}`,
          group: "Experiments",
          label: `Cancel experiment: ${e.title}`,
          run: act("cancel", "Cancelled"),
        });
    }
    return out;
  }, [signedIn, canEdit, sessionId, cells, list, router, notify]);
}
