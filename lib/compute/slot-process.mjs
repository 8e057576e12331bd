// An engine slot: a child process of the server (or of an experiment worker) that runs one
// computation at a time. The computation itself runs in a worker thread of this process
// (worker-boot.mjs) so that this thread stays free to hear "stop" from the parent and raise
// the shared stop flag the engine's loops poll. The whole process is bounded: the worker's
// heap by resourceLimits, this thread's by --max-old-space-size, and everything (typed
// arrays included) by the parent's resident-memory watchdog, which kills this process.
import { Worker } from "node:worker_threads";
import path from "node:path";
import { fileURLToPath } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const { entry, heapMb } = JSON.parse(process.env.RINGSIDE_SLOT_CONFIG ?? "{}");
const send = (message) => {
  if (process.connected) process.send(message);
};

// Without a parent there is nobody to answer: a slot never outlives its server.
process.on("disconnect", () => process.exit(0));

const worker = new Worker(path.join(here, "worker-boot.mjs"), {
  workerData: { entry },
  resourceLimits: { maxOldGenerationSizeMb: heapMb },
});

const flags = new Map(); // jobId → Int32Array over the job's shared stop flag
worker.on("message", (message) => {
  if (message.type === "finished" || message.type === "failed") flags.delete(message.jobId);
  send(message);
});
worker.on("error", (error) => {
  const heap = error?.code === "ERR_WORKER_OUT_OF_MEMORY";
  send({ type: "died", heapExhausted: heap, message: heap ? "heap exhausted" : String(error?.message ?? error) });
  process.exit(heap ? 3 : 1);
});
worker.on("exit", () => {
  send({ type: "died", heapExhausted: false, message: "the engine thread stopped" });
  process.exit(1);
});

process.on("message", (message) => {
  if (message.type === "run") {
    const flag = new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT);
    flags.set(message.jobId, new Int32Array(flag));
    worker.postMessage({ type: "run", jobId: message.jobId, payload: message.payload, flag });
  } else if (message.type === "stop") {
    const cells = flags.get(message.jobId);
    if (cells) Atomics.compareExchange(cells, 0, 0, message.reason);
  }
});
