"use client";
/// The room's live documents: the experiment (polled while it runs) and its rows. SWR
/// keeps one cache, so the table and the plots share the rows they both read.
import useSWR from "swr";
import { fetchJson } from "@/app/_client/fetch";
import { allRows, experimentKeys } from "./api";
import { isActive, type ExperimentAnswer, type Row } from "./types";

/// How often a running experiment is read again.
export const POLL_MS = 1500;
/// The most rows read into the browser for plots (and for the table of a small experiment);
/// a plot of a larger experiment says it shows the first this many.
export const ROWS_IN_BROWSER = 5000;

export function useExperiment(id: string, link: string | null) {
  const r = useSWR<ExperimentAnswer>(experimentKeys.one(id, link), fetchJson, {
    refreshInterval: (data) => (data && !isActive(data.experiment.status) ? 0 : POLL_MS),
  });
  return r;
}

/// Every row so far (up to ROWS_IN_BROWSER) in member order, read again whenever the
/// experiment's count of finished rows changes (the count is part of the key, so the last
/// rows are read even when the experiment ends between two polls).
export function useAllRows(id: string, link: string | null, done: number, total: number) {
  const cap = Math.min(total, ROWS_IN_BROWSER);
  return useSWR<{ rows: Row[]; matched: number }>(["experiment-rows", id, link, cap, done], () => allRows(id, link, Math.max(cap, 1)), {
    keepPreviousData: true,
  });
}
