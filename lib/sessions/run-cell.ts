/// One cell from request to stored result: store it as running, run it in the worker pool,
/// stream its events as NDJSON, and write the outcome and new named objects in one
/// transaction — also when the client goes away or the cell is cancelled.
import { cellLimits, cellPool } from "@/lib/compute/cell-pool";
import { errorValue, type CellEvent, type CellJob, type CellJobOutcome, type ErrorValue, type Span } from "@/lib/compute/cell-events";
import { PoolBusyError, type JobEnd } from "@/lib/compute/pool";
import type { CurrentUser } from "@/lib/auth/types";
import type { CellEvent as StreamEvent } from "@/lib/wire/cells";
import { registerRunningCell } from "./cancel-channel";
import { ENGINE_VERSION } from "./engine-version";
import { abandonStaleCells, currentRingOf, finishCell, listObjects, startCell, type CellOutcome } from "./store";
import { objectView } from "./views";

const WHOLE_CELL: Span = { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } };

// Once per process: cells that outlived any time limit were left by a server that stopped.
const holder = globalThis as typeof globalThis & { __ringsideStaleSwept?: boolean };
async function sweepStaleCellsOnce(): Promise<void> {
  if (holder.__ringsideStaleSwept) return;
  holder.__ringsideStaleSwept = true;
  await abandonStaleCells(cellLimits().timeLimitMs + 60_000).catch((error) => console.error("[ringside] stale cell sweep failed:", error));
}

export async function runCell(user: CurrentUser, sessionId: string, source: string): Promise<Response> {
  await sweepStaleCellsOnce();
  const pool = cellPool();
  const bindings = (await listObjects(sessionId)).map((o) => ({ name: o.name, type: o.type, value: o.value }));
  const currentRing = await currentRingOf(sessionId);
  const cell = await startCell(sessionId, user, source);
  const started = performance.now();
  const encoder = new TextEncoder();
  const job: CellJob = { source, bindings, currentRing };

  let cancel: () => void = () => {};
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

      const results: { statement: number; span: Span; value: unknown }[] = [];
      const bound = new Map<string, { name: string; type: string; value: unknown; source: string }>();
      let spans: Span[] = [];
      let failure: ErrorValue | null = null;
      const onEvent = (raw: unknown) => {
        const event = raw as CellEvent;
        switch (event.event) {
          case "bound":
            bound.set(event.name, { name: event.name, type: event.type, value: event.value, source: event.source ?? "" });
            return;
          case "checked":
            spans = event.spans;
            return send({ event: "checked", statements: event.statements });
          case "result":
            results.push({ statement: event.statement, span: event.span, value: event.value });
            return send(event);
          case "error":
            failure = event.error;
            // The evaluator sees any stop as a cancel; whether it was the user or the time
            // limit is known only when the job ends, so that error is sent then.
            if (event.error.kind === "cancelled") return;
            return send(event);
          default:
            return send(event);
        }
      };

      let end: JobEnd;
      try {
        const handle = pool.submit(job, { onEvent, timeLimitMs: cellLimits().timeLimitMs });
        cancel = handle.cancel;
        // Without the cancel channel the cell still runs; only cross-server cancel is lost.
        const unregister = await registerRunningCell(cell.id, handle.cancel).catch((error) => {
          console.error("[ringside] cancel channel unavailable:", error);
          return () => {};
        });
        end = await handle.done.finally(unregister);
      } catch (error) {
        const message = error instanceof PoolBusyError ? error.message : "the engine could not start this computation";
        if (!(error instanceof PoolBusyError)) console.error("[ringside] cell submit failed:", error);
        end = { status: "crashed", message };
      }

      // A stop that the job did not report itself becomes the cell's error, placed at the
      // statement that was running.
      const running = results.length;
      const reported = failure as ErrorValue | null;
      const at = reported?.span ?? spans[running] ?? spans[spans.length - 1] ?? WHOLE_CELL;
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
      }
      const status: CellOutcome["status"] =
        end.status === "cancelled" || (failure as ErrorValue | null)?.kind === "cancelled" ? "cancelled" : failure ? "error" : "done";
      const durationMs = performance.now() - started;
      try {
        const saved = await finishCell(cell, user, {
          status,
          results,
          error: failure,
          durationMs,
          engineVersion: ENGINE_VERSION,
          objects: [...bound.values()],
          // After a stop the evaluator could not report, the ring the cell started in stays current.
          currentRing: "outcome" in end && end.outcome ? ((end.outcome as CellJobOutcome).currentRing ?? null) : currentRing,
        });
        send({ event: "done", status, timings: { totalMs: Math.round(durationMs) }, objects: saved.map(objectView) });
      } catch (error) {
        console.error("[ringside] storing a cell failed:", error);
        send({ event: "error", statement: null, error: errorValue("runtime", "the result could not be saved", WHOLE_CELL) });
        send({ event: "done", status: "error", timings: { totalMs: Math.round(durationMs) }, objects: [] });
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
      cancel();
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

