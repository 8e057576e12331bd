/// The experiments API's JSON shapes as the room reads them (app/api/README.md,
/// "Experiments"). Client-side types only: the room never imports server modules.
import type { ValueJson } from "@/app/_console/api/types";

export type ExperimentStatus = "queued" | "running" | "paused" | "done" | "cancelled";
export type RowStatus = "ok" | "error" | "limit" | "cancelled";
export const ROW_STATUSES: readonly RowStatus[] = ["ok", "error", "limit", "cancelled"];
/// The columns every experiment table starts with (notation §11).
export const FIXED_COLUMNS = ["index", "label", "status", "seconds"] as const;

export interface Progress {
  status: ExperimentStatus;
  done: number;
  total: number;
  failures: number;
  byStatus: Record<RowStatus, number>;
  /// members per second over the last minute (null before any row)
  rate: number | null;
  etaSeconds: number | null;
}

export interface Experiment {
  id: string;
  sessionId: string;
  title: string;
  status: ExperimentStatus;
  done: number;
  total: number;
  failures: number;
  progress: Progress;
  columns: string[];
  program: string;
  familyDefinition: string;
  probe: string;
  engineVersion: string;
  limits: { timeLimitMs: number; heapLimitMb: number };
  sourceCellId: string | null;
  uploadId: string | null;
  rerunOf: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export interface ExperimentAnswer {
  experiment: Experiment;
  access: "owner" | "editor" | "viewer";
  canEdit: boolean;
}

export interface ExperimentSummary {
  id: string;
  sessionId: string;
  title: string;
  status: ExperimentStatus;
  familyDefinition: string;
  probeText: string;
  /// the console cell it was made from (null for uploads); added to the list by issue 15
  sourceCellId?: string | null;
  total: number;
  done: number;
  failures: number;
  createdAt: string;
  finishedAt: string | null;
}

export interface Row {
  index: number;
  label: string;
  status: RowStatus;
  seconds: number;
  /// the probe's fields as §9 values ({} unless ok)
  fields: Record<string, ValueJson>;
  message: string | null;
  worker: string;
  finishedAt: string;
}

export interface RowsPage {
  columns: string[];
  rows: Row[];
  matched: number;
  offset: number;
  limit: number;
}

export interface MemberAnswer {
  index: number;
  label: string;
  member: ValueJson;
  familyDefinition: string;
}

export interface UploadPreview {
  count: number;
  members: { line: number; value: ValueJson }[];
  problems: { line: number; message: string }[];
  problemCount: number;
  unit: "line" | "item";
}

export const isActive = (s: ExperimentStatus): boolean => s === "queued" || s === "running";
