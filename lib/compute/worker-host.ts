import { parentPort } from "node:worker_threads";
import type { FromWorker, JobHandler, ToWorker } from "./protocol";
import { signalFromStopFlag } from "./shared-signal";

/// Serves jobs from the pool, one at a time, with the given job function.
export function startHost(handleJob: JobHandler): void {
  const port = parentPort;
  if (!port) throw new Error("startHost: must run inside a worker thread");
  const send = (m: FromWorker) => port.postMessage(m);

  port.on("message", async (message: ToWorker) => {
    if (message.type !== "run") return;
    const { jobId, payload, flag } = message;
    try {
      const outcome = await handleJob(payload, {
        signal: signalFromStopFlag(flag),
        emit: (event) => send({ type: "event", jobId, event }),
      });
      send({ type: "finished", jobId, outcome });
    } catch (err) {
      send({ type: "failed", jobId, message: err instanceof Error ? err.message : String(err) });
    }
  });
  send({ type: "ready" });
}
