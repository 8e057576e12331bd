/// The experiments API's JSON shapes as the room reads them (app/api/README.md,
/// "Experiments"). Client-side types only: the room never imports server modules.
import type {
  Experiment as WireExperiment,
  ExperimentRowView,
  ExperimentSummary as WireExperimentSummary,
  Progress as WireProgress,
  RowPage,
} from "@/lib/wire/experiments";
import type { Reading, ValueReading as ValueJson } from "@/lib/wire/reading";

export type { ExperimentStatus, RowStatus } from "@/lib/wire/experiments";
export { FIXED_COLUMNS } from "@/lib/wire/experiments";
import type { ExperimentStatus, RowStatus } from "@/lib/wire/experiments";
export const ROW_STATUSES: readonly RowStatus[] = ["ok", "error", "limit", "cancelled"];

/// The wire shapes (lib/wire/experiments.ts) as a tolerant reader sees them.
export type Progress = Reading<WireProgress>;
export type Experiment = Reading<WireExperiment>;

export interface ExperimentAnswer {
  experiment: Experiment;
  access: "owner" | "editor" | "viewer";
  canEdit: boolean;
}

export type ExperimentSummary = Reading<WireExperimentSummary>;

export type Row = Reading<ExperimentRowView>;
export type RowsPage = Reading<RowPage>;

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
