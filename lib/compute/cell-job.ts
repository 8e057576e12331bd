/// The job a worker thread runs for one cell: the evaluator over the session's saved
/// bindings, its events translated to the cell stream of app/api/README.md.
import { parse } from "../../grammar/parser";
import { evaluate, type EvalEvent } from "../notation/evaluate";
import type { CellEvent, CellJob, Span } from "./cell-events";
import type { JobContext } from "./protocol";
import { bounded, restored } from "./large-values";

function plainSpan(span: { from: { line: number; col: number }; to: { line: number; col: number } }): Span {
  return { from: { line: span.from.line, col: span.from.col }, to: { line: span.to.line, col: span.to.col } };
}

export async function handleJob(payload: unknown, { signal, emit }: JobContext) {
  const job = payload as CellJob;
  const send = (event: CellEvent) => emit(event);
  // Statement spans let the server place a stop (cancel, time or memory limit) that the
  // evaluator could not report itself because its thread was killed.
  const spans = parse(job.source).program.statements.map((s) => plainSpan(s.span));

  const onEvent = (e: EvalEvent) => {
    switch (e.event) {
      case "checked":
        return send({ event: "checked", statements: e.statements, spans });
      case "progress": {
        const { event: _event, index, ...info } = e;
        const p = info as { stage?: string; detail?: string; fraction?: number };
        return send({ event: "progress", statement: index, stage: p.stage ?? "working", detail: p.detail, fraction: p.fraction });
      }
      case "partial":
        return send({ event: "partial", statement: e.index, value: bounded(e.value) });
      case "result": {
        // A large value leaves the slot as a summary (its detail written once, shared by both events).
        const value = bounded(e.value);
        if (e.name !== null) send({ event: "bound", statement: e.index, name: e.name, type: e.value.type, value });
        return send({ event: "result", statement: e.index, span: e.span, value });
      }
      case "error":
        return send({ event: "error", statement: e.index, error: e.error });
    }
  };

  // Values stored as summaries come back whole from their detail, here inside the slot.
  const bindings = job.bindings.map((b) => ({ ...b, value: restored(b.value) as typeof b.value }));
  const outcome = await evaluate(job.source, bindings, { signal, onEvent, currentRing: job.currentRing ?? null });
  // The checker's type names (List<Int>, …) and the defining source replace the provisional
  // ones sent with each result.
  for (const o of outcome.objects)
    send({ event: "bound", statement: o.statement, name: o.name, type: o.type, value: bounded(o.value), source: o.source });
  return { status: outcome.status, currentRing: outcome.currentRing };
}
