/// The experiments contract (app/api/README.md, "Experiments"): request bodies, an
/// experiment with its progress, a row, a list entry. Schemas first, types inferred from
/// them; lib/experiments produces these shapes and the browser (issue 15) reads them.
import { z } from "zod";
import { atMost, LIMIT_TABLE } from "../limits";
import { ValueJson } from "./values";

/// A text field bounded by a row of lib/limits.ts (counted in characters), whose refusal names it.
export function boundedText(name: "uploadChars" | "experimentProgramChars" | "probeChars") {
  const n = LIMIT_TABLE[name].value;
  return z.string().max(n, `is longer than ${n} characters (limit ${name})`);
}

export const ExperimentStatus = z.enum(["queued", "running", "paused", "done", "cancelled"]);
export type ExperimentStatus = z.infer<typeof ExperimentStatus>;
export const RowStatus = z.enum(["ok", "error", "limit", "cancelled"]);
export type RowStatus = z.infer<typeof RowStatus>;

/// The columns every experiment table starts with (notation.md §11), then the probe's fields.
export const FIXED_COLUMNS = ["index", "label", "status", "seconds"] as const;

const uuid = z.string().uuid();
/// A title given by the user (an experiment's, an imported session's): trimmed, not empty,
/// within the limit `titleChars`; optional.
export const optionalTitle = z
  .string()
  .trim()
  .min(1)
  .max(...atMost("titleChars"))
  .optional();
const identifier = z.string().regex(/^[A-Za-z][A-Za-z0-9_']*$/, "expected an identifier (a letter, then letters, digits, _ or ')");

/// POST /api/experiments: from a program (a cell's text) or a cell of the session …
export const CreateFromProgramBody = z
  .object({
    sessionId: uuid,
    /// the program whose first sweep(family, probe) becomes the experiment
    source: boundedText("experimentProgramChars").optional(),
    /// or a cell of the session, whose text is used
    cellId: uuid.optional(),
    title: optionalTitle,
  })
  .strict();
/// … or from an uploaded family and a probe over it.
export const CreateFromUploadBody = z
  .object({
    sessionId: uuid,
    uploadId: uuid,
    /// a function of one member, e.g. "I -> {depth: (S / I).depth}"
    probe: boundedText("probeChars").trim().min(1),
    /// the name the probe uses for the upload's ring (default S)
    ringName: identifier.optional(),
    title: optionalTitle,
  })
  .strict();
export const CreateExperimentBody = z.union([CreateFromProgramBody, CreateFromUploadBody]);
export type CreateExperimentBody = z.infer<typeof CreateExperimentBody>;

/// POST /api/experiments/uploads.
/// A family file as the browser sends it, for the preview (POST …/uploads/preview) and the
/// upload alike.
export const FamilyFileBody = z
  .object({
    format: z.enum(["text", "json"]),
    /// the ring the ideals are read in, in the notation: "GF(32003)[x, y, z]"
    ring: z
      .string()
      .min(1)
      .max(...atMost("ringTextChars")),
    content: boundedText("uploadChars"),
  })
  .strict();

export const UploadBody = FamilyFileBody.extend({
  sessionId: uuid,
  /// the named object the family becomes
  name: z
    .string()
    .min(1)
    .max(...atMost("objectNameChars")),
}).strict();
export type UploadBody = z.infer<typeof UploadBody>;

export const Upload = z.object({
  id: z.string(),
  name: z.string(),
  format: z.enum(["text", "json"]),
  length: z.number(),
  createdAt: z.string(),
});
export type Upload = z.infer<typeof Upload>;

/// A refused upload: 422 with error.details = [UploadProblem] (line 0: the ring).
export const UploadProblem = z.object({ line: z.number(), message: z.string() });
export type UploadProblem = z.infer<typeof UploadProblem>;

export const Progress = z.object({
  status: ExperimentStatus,
  done: z.number(),
  total: z.number(),
  /// rows with status error or limit
  failures: z.number(),
  byStatus: z.object({ ok: z.number(), error: z.number(), limit: z.number(), cancelled: z.number() }),
  /// members per second over the last minute, null before any row
  rate: z.number().nullable(),
  /// seconds left at that rate, null when unknown or not running
  etaSeconds: z.number().nullable(),
});
export type Progress = z.infer<typeof Progress>;

/// GET /api/experiments/:id (and the answer of every action).
export const Experiment = z.object({
  id: z.string(),
  sessionId: z.string(),
  title: z.string(),
  status: ExperimentStatus,
  done: z.number(),
  total: z.number(),
  failures: z.number(),
  progress: Progress,
  /// index, label, status, seconds, then the probe's fields (known after the first ok row)
  columns: z.array(z.string()),
  program: z.string(),
  familyDefinition: z.string(),
  probe: z.string(),
  engineVersion: z.string(),
  limits: z.object({ timeLimitMs: z.number(), heapLimitMb: z.number() }),
  sourceCellId: z.string().nullable(),
  uploadId: z.string().nullable(),
  rerunOf: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type Experiment = z.infer<typeof Experiment>;

/// A row of GET /api/experiments.
export const ExperimentSummary = z.object({
  id: z.string(),
  sessionId: z.string(),
  title: z.string(),
  status: ExperimentStatus,
  familyDefinition: z.string(),
  probeText: z.string(),
  /// the console cell the experiment was made from (null for uploads and programs)
  sourceCellId: z.string().nullable(),
  total: z.number(),
  done: z.number(),
  failures: z.number(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type ExperimentSummary = z.infer<typeof ExperimentSummary>;

/// One member's row (GET /api/experiments/:id/rows, export JSON).
export const ExperimentRowView = z.object({
  index: z.number(),
  label: z.string(),
  status: RowStatus,
  seconds: z.number(),
  /// the probe's fields as §9 values ({} unless ok)
  fields: z.record(z.string(), ValueJson),
  message: z.string().nullable(),
  /// host:pid:label of the process that ran it
  worker: z.string(),
  finishedAt: z.string(),
});
export type ExperimentRowView = z.infer<typeof ExperimentRowView>;

/// GET /api/experiments/:id/rows.
export const RowPage = z.object({
  columns: z.array(z.string()),
  rows: z.array(ExperimentRowView),
  matched: z.number(),
  offset: z.number(),
  limit: z.number(),
});
export type RowPage = z.infer<typeof RowPage>;
