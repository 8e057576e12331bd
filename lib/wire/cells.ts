/// The cell contract (app/api/README.md): what a stored cell looks like, the events a
/// cell job sends from its worker to the server (`JobEvent`), and the NDJSON lines the
/// server streams to the client (`CellEvent`). Schemas first, types inferred from them,
/// so the compute layer, the route and the console read one definition.
import { z } from "zod";
import { ErrorJson, SpanJson, ValueJson } from "./values";
import { NamedObject } from "./sessions";

export { ErrorJson, SpanJson } from "./values";
export type Span = SpanJson;

/// `interrupted`: the server running the cell stopped before it finished (the cell keeps what
/// had streamed, and `stopped` says so).
export const CellStatus = z.enum(["running", "done", "error", "cancelled", "interrupted"]);
export type CellStatus = z.infer<typeof CellStatus>;

const statementIndex = z.number().int().nonnegative();

/// One statement's result inside a stored cell. The contract names the statement's number
/// `index`; the stored cells of the first API version call it `statement`, so both are read.
export const CellResult = z.object({
  index: statementIndex.optional(),
  statement: statementIndex.optional(),
  span: SpanJson,
  value: ValueJson,
});
export type CellResult = z.infer<typeof CellResult>;

/// A cell as GET /api/sessions/:id/cells lists it.
export const Cell = z.object({
  id: z.string(),
  position: z.number().int(),
  source: z.string(),
  status: CellStatus,
  results: z.array(CellResult),
  /// where a cancel, a limit or a lost server stopped the cell ("stopped after homological
  /// degree 6: …"); `results` then ends with the running statement's partial results
  stopped: z.string().nullable().optional(),
  error: ErrorJson.nullable(),
  timings: z.object({ totalMs: z.number().nullable() }).nullable(),
  engineVersion: z.string().nullable().optional(),
  /// who ran it (null for cells from before authors were kept, or whose account is gone)
  author: z.object({ id: z.string(), name: z.string() }).nullable().optional(),
  createdAt: z.string(),
});
export type Cell = z.infer<typeof Cell>;

const progress = z.object({
  event: z.literal("progress"),
  statement: statementIndex,
  stage: z.string(),
  detail: z.string().optional(),
  fraction: z.number().optional(),
});
const partial = z.object({ event: z.literal("partial"), statement: statementIndex, value: ValueJson });
const result = z.object({ event: z.literal("result"), statement: statementIndex, span: SpanJson, value: ValueJson });
/// `statement` is null when the error belongs to no statement (the result could not be saved).
const error = z.object({ event: z.literal("error"), statement: statementIndex.nullable().optional(), error: ErrorJson });

/// One line of the cell stream, server → client.
export const CellEvent = z.discriminatedUnion("event", [
  z.object({ event: z.literal("accepted"), cellId: z.string(), position: z.number().int() }),
  z.object({ event: z.literal("checked"), statements: z.number().int().nonnegative() }),
  progress,
  partial,
  result,
  error,
  z.object({
    event: z.literal("done"),
    status: CellStatus,
    stopped: z.string().optional(),
    timings: z.object({ totalMs: z.number() }),
    objects: z.array(NamedObject),
  }),
]);
export type CellEvent = z.infer<typeof CellEvent>;

/// One event of a cell job, worker → server. `checked` carries the statements' spans (so
/// the server can place a stop the job could not report) and `bound` names an object to
/// store; both stay on the server.
export const JobEvent = z.discriminatedUnion("event", [
  z.object({ event: z.literal("checked"), statements: z.number().int().nonnegative(), spans: z.array(SpanJson) }),
  progress,
  partial,
  result,
  error.extend({ statement: statementIndex.nullable() }),
  z.object({
    event: z.literal("bound"),
    statement: statementIndex,
    name: z.string(),
    type: z.string(),
    value: ValueJson,
    source: z.string().optional(),
  }),
  /// A sweep of this cell goes to the background (stays on the server, like `bound`): the
  /// server creates the experiment under `id` from the planned family and probe before it
  /// stores the cell; the statement's value is already the Experiment with this id.
  z.object({
    event: z.literal("experiment"),
    id: z.string().uuid(),
    family: ValueJson,
    probe: ValueJson,
    labels: z.array(z.string()),
  }),
]);
export type JobEvent = z.infer<typeof JobEvent>;

/// The payload the route sends to a cell job: the source, the session's saved bindings
/// and the binding that was the current ring after the session's previous cell.
export const CellJob = z.object({
  source: z.string(),
  bindings: z.array(z.object({ name: z.string(), type: z.string(), value: z.unknown() })),
  currentRing: z.string().nullable(),
  /// present when the server can run sweeps as background experiments: sweeps of more
  /// members than this (or with background = true) become one (lib/limits.ts sweepRunsInline)
  inlineSweepMembers: z.number().int().nonnegative().optional(),
});
export type CellJob = z.infer<typeof CellJob>;

/// What the job returns when the evaluator finished (also after an error or a cancel).
export const CellJobOutcome = z.object({
  status: z.enum(["ok", "error", "cancelled"]),
  currentRing: z.string().nullable(),
});
export type CellJobOutcome = z.infer<typeof CellJobOutcome>;
