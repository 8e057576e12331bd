/// One cell from request to stored result: admit it to the engine's fair queue (a refusal
/// answers 429/503 and stores nothing), store it as running under this server's id, run it
/// in an engine slot, stream its events as NDJSON while the heartbeat keeps what streamed,
/// and write the outcome and new named objects in one transaction — also when the client
/// goes away, the cell is cancelled or a limit stops it (then with the work done so far).
/// A sweep too long to run inline comes back from the slot as an `experiment` request; the
/// caller's `createExperiment` (the route passes lib/experiments' createFromCell — sessions
/// do not import experiments, which import sessions) stores it before any later event is
/// streamed and before the cell is stored, so the Experiment value's id can be followed at once.
import { isEngineFull, runInSlot, type EngineFullError, type SlotOutcome } from "@/lib/compute";
import { errorValue, type CellEvent, type CellJob, type ErrorValue, type Span } from "@/lib/compute/cell-events";
import { StreamedWork } from "@/lib/compute/streamed-work";
import type { CurrentUser } from "@/lib/auth/types";
import { HttpError } from "@/lib/http/errors";
import { limitValue } from "@/lib/limits";
import type { CellEvent as StreamEvent } from "@/lib/wire/cells";
import { registerRunningCell } from "./cancel-channel";
import { ENGINE_VERSION } from "./engine-version";
import { serverId, trackRunningCell } from "./liveness";
import { currentRingOf, finishCell, listObjects, markUnsaved, startCell, type CellOutcome, type CellRow, type ObjectRow } from "./store";
import { objectView } from "./views";

const WHOLE_CELL: Span = { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } };

/// The refusal of a full engine: kind `limit` with the limit's name, and Retry-After.
function refusal(error: EngineFullError): HttpError {
  return new HttpError(
    error.limit === "userQueued" ? 429 : 503,
    "engine_full",
    error.message,
    { kind: "limit", limit: error.limit },
    { "Retry-After": String(error.retryAfterSeconds) },
  );
}

/// What the slot hands back when a sweep goes to the background (lib/wire/cells.ts, the
/// `experiment` job event), with the cell it came from.
export interface ExperimentRequest {
  /// the id the cell's Experiment value carries
  id: string;
  sessionId: string;
  userId: string;
  cellId: string;
  /// the cell's text (the experiment's program)
  source: string;
  family: unknown;
  probe: unknown;
  labels: string[];
}

export interface RunCellOptions {
  /// Stores a background experiment. Without it every sweep runs inline (as in the CLI).
  createExperiment?: (request: ExperimentRequest) => Promise<unknown>;
  /// Cancels the background experiments this run created (`ids`) when the user cancels the
  /// cell; answers the ids it cancelled (lib/experiments' cancelFromCell).
  cancelExperiments?: (cellId: string, ids: readonly string[]) => Promise<readonly string[]>;
}

export async function runCell(user: CurrentUser, sessionId: string, source: string, options: RunCellOptions = {}): Promise<Response> {
  const bindings = (await listObjects(sessionId)).map((o) => ({ name: o.name, type: o.type, value: o.value }));
  const currentRing = await currentRingOf(sessionId);
  const createExperiment = options.createExperiment;
  const job: CellJob = {
    source,
    bindings,
    currentRing,
    ...(createExperiment ? { inlineSweepMembers: limitValue("inlineSweepMembers") } : {}),
  };

  // Admission first: a computation the engine cannot take leaves no cell behind.
  const events: CellEvent[] = [];
  let deliver: ((event: CellEvent) => void) | null = null;
  const stop = new AbortController();
  let done: Promise<SlotOutcome>;
  try {
    done = runInSlot(
      { user: user.id, payload: job },
      { signal: stop.signal, onEvent: (event) => (deliver ? deliver(event) : void events.push(event)) },
    );
  } catch (error) {
    if (isEngineFull(error)) throw refusal(error);
    throw error;
  }

  let cell: CellRow;
  try {
    cell = await startCell(sessionId, user, source, serverId());
  } catch (error) {
    stop.abort();
    throw error;
  }
  const started = performance.now();
  const encoder = new TextEncoder();

  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      let open = true;
      const send = (event: StreamEvent) => {
        if (!open) return;
        try {
          controller.enqueue(encoder.encode(JSON.stringify(event) + "\n"));
        } catch {
          open = false;
        }
      };
      send({ event: "accepted", cellId: cell.id, position: cell.position });

      let untrack = () => {};
      try {
        const work = new StreamedWork();
        const bound = new Map<string, { name: string; type: string; value: unknown; source: string }>();
        let failure: ErrorValue | null = null;
        // Events reach the client in order, each after any experiment requested before it is
        // stored (so an Experiment value never names an experiment that does not exist yet).
        let order: Promise<void> = Promise.resolve();
        const forward = (event: StreamEvent) => {
          order = order.then(() => send(event));
        };
        let experimentProblem: string | null = null;
        // the experiments this run stored, and whether the user asked to cancel the cell
        const created: string[] = [];
        let cancelRequested = false;
        const onEvent = (event: CellEvent) => {
          work.observe(event);
          switch (event.event) {
            case "bound":
              bound.set(event.name, { name: event.name, type: event.type, value: event.value, source: event.source ?? "" });
              return;
            case "checked":
              return forward({ event: "checked", statements: event.statements });
            case "experiment": {
              const request: ExperimentRequest = {
                id: event.id,
                sessionId,
                userId: user.id,
                cellId: cell.id,
                source,
                family: event.family,
                probe: event.probe,
                labels: event.labels,
              };
              order = order.then(() =>
                (createExperiment ?? noExperiments)(request).then(
                  () => void created.push(request.id),
                  (error: Error) => {
                    console.error(`[ringside] cell ${cell.id}: creating experiment ${request.id} failed:`, error);
                    experimentProblem ??= error.message;
                  },
                ),
              );
              return;
            }
            case "error":
              failure = event.error;
              // The evaluator sees any stop as a cancel; whether it was the user or the time
              // limit is known only when the job ends, so that error is sent then.
              if (event.error.kind === "cancelled") return;
              return forward(event);
            default:
              return forward(event);
          }
        };
        for (const event of events.splice(0)) onEvent(event);
        deliver = onEvent;

        untrack = trackRunningCell(cell.id, () => work.snapshot());
        // Without the cancel channel the cell still runs; only cross-server cancel is lost.
        const unregister = await registerRunningCell(cell.id, () => {
          cancelRequested = true;
          stop.abort();
        }).catch((error) => {
          console.error("[ringside] cancel channel unavailable:", error);
          return () => {};
        });
        const end = await done.finally(unregister);
        await order;

        // A stop that the job did not report itself becomes the cell's error, placed at the
        // statement that was running.
        const running = work.results.length;
        const reported = failure as ErrorValue | null;
        const at = reported?.span ?? work.spans[running] ?? work.spans[work.spans.length - 1] ?? WHOLE_CELL;
        if (end.status !== "finished" && (!reported || reported.kind === "cancelled")) {
          failure =
            end.status === "cancelled"
              ? errorValue("cancelled", "the computation was cancelled", at)
              : end.status === "limit"
                ? errorValue("limit", end.message, at)
                : errorValue("runtime", end.message, at);
          send({ event: "error", statement: running, error: failure });
        } else if (reported?.kind === "cancelled") {
          send({ event: "error", statement: running, error: reported });
        } else if (experimentProblem !== null && !reported) {
          // The cell's value names an experiment that could not be stored: the cell says so.
          failure = errorValue("runtime", `the sweep's background experiment could not be created: ${experimentProblem}`, at);
          send({ event: "error", statement: null, error: failure });
        }
        const final = failure as ErrorValue | null;
        const status: CellOutcome["status"] =
          end.status === "cancelled" || final?.kind === "cancelled" ? "cancelled" : final ? "error" : "done";
        // The user's cancel stops what the cell started too: its background experiments
        // (lib/experiments/README.md, "Sweeps in a cell"). A dropped connection or a limit
        // leaves them running — a background experiment is meant to outlive the page.
        const stoppedExperiments =
          status === "cancelled" && cancelRequested && created.length > 0
            ? await (options.cancelExperiments?.(cell.id, created) ?? Promise.resolve([])).catch((error: Error) => {
                console.error(`[ringside] cell ${cell.id}: cancelling its experiments failed:`, error);
                return [];
              })
            : [];
        // A cancel or a limit keeps the work done: finished statements and the running one's
        // partial results, with where it stopped.
        const stoppedWhy =
          final && (final.kind === "cancelled" || final.kind === "limit")
            ? final.kind === "cancelled"
              ? `cancelled${withExperiments(stoppedExperiments.length)}`
              : final.message
            : null;
        const kept = stoppedWhy ? work.stored(stoppedWhy) : null;
        const durationMs = performance.now() - started;
        const outcome: CellOutcome = {
          status,
          results: kept?.statements ?? work.results,
          stopped: kept?.stopped ?? null,
          error: failure,
          durationMs,
          engineVersion: ENGINE_VERSION,
          objects: [...bound.values()],
          // After a stop the evaluator could not report, the ring the cell started in stays current.
          currentRing: end.outcome ? (end.outcome.currentRing ?? null) : currentRing,
        };
        if (kept) {
          const partial = kept.statements.length > work.results.length ? kept.statements.at(-1) : undefined;
          if (partial) send({ event: "result", ...partial });
        }
        const saved = await saveWithRetries(cell, user, outcome);
        if (saved) {
          send({
            event: "done",
            status,
            ...(outcome.stopped ? { stopped: outcome.stopped } : {}),
            timings: { totalMs: Math.round(durationMs) },
            objects: saved.map(objectView),
          });
        } else {
          send({ event: "error", statement: null, error: errorValue("runtime", "the result could not be saved", WHOLE_CELL) });
          send({ event: "done", status: "error", timings: { totalMs: Math.round(durationMs) }, objects: [] });
        }
      } catch (error) {
        // Nothing unexpected may leave the cell running: it is marked, and the stream ends.
        console.error(`[ringside] cell ${cell.id} failed on the server:`, error);
        stop.abort();
        await markUnsaved(cell.id, "the server failed while finishing this cell; run it again").catch(() => {});
        send({ event: "error", statement: null, error: errorValue("runtime", "the server failed while finishing this cell", WHOLE_CELL) });
        send({ event: "done", status: "error", timings: { totalMs: Math.round(performance.now() - started) }, objects: [] });
      } finally {
        untrack();
      }
      open = false;
      try {
        controller.close();
      } catch {
        // the client already went away
      }
    },
    cancel() {
      // The client dropped the connection: stop the work; start() still stores the cell.
      stop.abort();
    },
  });

  return new Response(stream, {
    headers: {
      "content-type": "application/x-ndjson; charset=utf-8",
      "cache-control": "no-store",
      "x-accel-buffering": "no",
    },
  });
}

/// Stores the outcome, trying again with growing pauses while the database is away (a
/// restart takes seconds); if every try fails, a last smaller write marks the cell, and if
/// even that fails, its heartbeat stops and the orphan sweep marks it `interrupted`.
async function saveWithRetries(cell: CellRow, user: CurrentUser, outcome: CellOutcome): Promise<ObjectRow[] | null> {
  const attempts = limitValue("saveAttempts");
  for (let attempt = 1; attempt <= attempts; attempt++) {
    try {
      return await finishCell(cell, user, outcome);
    } catch (error) {
      console.error(`[ringside] storing cell ${cell.id} failed (try ${attempt} of ${attempts}):`, (error as Error).message);
      // PostgreSQL refused the data itself (class 22, e.g. a NUL character in a string):
      // trying again cannot help, so the cell is marked at once, saying why.
      const code = (error as { code?: unknown }).code;
      if (typeof code === "string" && code.startsWith("22")) {
        await markUnsaved(cell.id, `the result could not be stored: ${(error as Error).message}`).catch(() => {});
        return null;
      }
      if (attempt < attempts) await new Promise((r) => setTimeout(r, Math.min(500 * 2 ** (attempt - 1), 8000)));
    }
  }
  await markUnsaved(cell.id, `the result could not be saved after ${attempts} tries (saveAttempts); run the cell again`).catch(() => {});
  return null;
}

/// Says in the cell's "stopped" line that its cancel also cancelled the experiments it started.
const withExperiments = (n: number): string =>
  n === 0 ? "" : n === 1 ? ", and so was the background experiment it started" : `, and so were the ${n} background experiments it started`;

/// The slot is offered experiments only when the caller can create them; reaching this means
/// it asked anyway, and the cell says so instead of naming an experiment that does not exist.
const noExperiments = async (): Promise<never> => {
  throw new Error("this server was not given a way to create experiments");
};
