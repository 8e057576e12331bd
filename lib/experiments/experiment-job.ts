/// What an engine thread runs for experiments (loaded by lib/compute's worker host, like the
/// cell job): `plan` evaluates a program up to its first `sweep(F, probe)` and returns the
/// family and the probe as §9 JSON instead of running it; `member` applies a stored probe to
/// one stored member and returns the row.
import { evaluate } from "../notation/evaluate";
import type { ErrorJson, ValueJson } from "../notation/json";
import { encodeValue } from "../notation/json";
import { memberLabel } from "../notation/families";
import type { JobContext } from "../compute/protocol";
import type { Binding } from "../notation/evaluate";

export type ExperimentJob =
  | { kind: "plan"; source: string; bindings: Binding[]; currentRing: string | null }
  | { kind: "member"; probe: unknown; member: unknown }
  | { kind: "upload"; ring: string; text: string };

/// A problem with one line of an uploaded family (1-based line of the upload).
export interface UploadProblem {
  line: number;
  message: string;
}

export type UploadOutcome =
  { kind: "upload"; ring: ValueJson; members: ValueJson[]; lines: number[] } | { kind: "upload-error"; problems: UploadProblem[] };

export type PlanOutcome =
  | { kind: "plan"; family: ValueJson; probe: ValueJson; labels: string[] }
  | { kind: "plan-error"; error: Pick<ErrorJson, "message"> & { kind: string } };

export type MemberOutcome = {
  kind: "member";
  status: "ok" | "error" | "limit" | "cancelled";
  /// the probe's Record fields in order, when ok
  fields: [string, ValueJson][];
  message: string | null;
  ms: number;
};

export async function handleJob(payload: unknown, { signal }: JobContext): Promise<PlanOutcome | MemberOutcome | UploadOutcome> {
  const job = payload as ExperimentJob;
  if (job.kind === "plan") return plan(job, signal);
  if (job.kind === "upload") return upload(job, signal);
  return member(job, signal);
}

/// Reads an uploaded family: the ring, then one ideal per line in the notation (blank lines
/// and # comments allowed). Every line is checked; all check problems are reported, each
/// with its line of the upload; a line whose value is not an ideal is a problem too.
async function upload(job: Extract<ExperimentJob, { kind: "upload" }>, signal: AbortSignal): Promise<UploadOutcome> {
  const ringName = "upload_ring";
  const source = `${ringName} := ${job.ring.replace(/[\r\n]+/g, " ")}\n${job.text}`;
  const problems: UploadProblem[] = [];
  const outcome = await evaluate(source, [], {
    signal,
    onEvent: (e) => {
      if (e.event === "checked")
        for (const x of e.errors)
          problems.push({ line: x.span.from.line - 1, message: `${x.kind} error at column ${x.span.from.col}: ${x.message}` });
    },
  });
  if (problems.length > 0) {
    const ringProblem = problems.find((p) => p.line === 0);
    if (ringProblem) return { kind: "upload-error", problems: [{ line: 0, message: `the ring ${job.ring}: ${ringProblem.message}` }] };
    return { kind: "upload-error", problems };
  }
  if (outcome.error) {
    const line = outcome.error.span.from.line - 1;
    return {
      kind: "upload-error",
      problems: [{ line, message: line === 0 ? `the ring ${job.ring}: ${outcome.error.message}` : outcome.error.message }],
    };
  }
  const [ring, ...rest] = outcome.results;
  const members: ValueJson[] = [];
  const lines: number[] = [];
  for (const r of rest) {
    const line = r.span.from.line - 1;
    if (r.name !== null) problems.push({ line, message: "a definition; each line must be one ideal such as <x^2, y*z>" });
    else if (r.value.type !== "Ideal")
      problems.push({ line, message: `expected an ideal such as <x^2, y*z>, got ${r.value.type} ${r.value.text}` });
    else {
      members.push(r.value);
      lines.push(line);
    }
  }
  if (problems.length > 0) return { kind: "upload-error", problems };
  return { kind: "upload", ring: ring.value, members, lines };
}

async function plan(job: Extract<ExperimentJob, { kind: "plan" }>, signal: AbortSignal): Promise<PlanOutcome> {
  let captured: PlanOutcome | null = null;
  const outcome = await evaluate(job.source, job.bindings, {
    signal,
    currentRing: job.currentRing,
    experiments: {
      inlineMax: -1,
      start: (family, probe) => {
        captured ??= { kind: "plan", family: encodeValue(family), probe: encodeValue(probe), labels: family.members.map(memberLabel) };
        return { type: "None" };
      },
    },
  });
  if (captured) return captured;
  if (outcome.error) return { kind: "plan-error", error: outcome.error };
  return { kind: "plan-error", error: { kind: "runtime", message: "the program has no sweep(family, probe) to run as an experiment" } };
}

async function member(job: Extract<ExperimentJob, { kind: "member" }>, signal: AbortSignal): Promise<MemberOutcome> {
  const t0 = performance.now();
  const outcome = await evaluate(
    "probe(member)",
    [
      { name: "probe", value: job.probe },
      { name: "member", value: job.member },
    ],
    { signal },
  );
  const ms = Math.round(performance.now() - t0);
  if (outcome.status === "ok") {
    const v = outcome.results[0]?.value;
    if (v?.type !== "Record") {
      return { kind: "member", status: "error", fields: [], message: `the probe must return a Record, got ${v?.type ?? "nothing"}`, ms };
    }
    return { kind: "member", status: "ok", fields: Object.entries(v.fields), message: null, ms };
  }
  const e = outcome.error!;
  const status = e.kind === "limit" ? "limit" : e.kind === "cancelled" ? "cancelled" : "error";
  return { kind: "member", status, fields: [], message: e.message, ms };
}
