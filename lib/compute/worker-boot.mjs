// Worker threads start here: the job module the pool named and the generic host, bundled
// into one ES module (lib/bundle) so ESM-only packages such as chevrotain load natively.
import { workerData } from "node:worker_threads";
import { createHash } from "node:crypto";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../bundle/esm-bundle.mjs";

const host = path.join(path.dirname(fileURLToPath(import.meta.url)), "worker-host.ts");
const entry = path.resolve(workerData.entry);
const key = createHash("sha256").update(entry).digest("hex").slice(0, 16);
await importBundled("ringside-worker", key, {
  contents: `import { startHost } from ${JSON.stringify(host)};\nimport * as job from ${JSON.stringify(entry)};\nstartHost(job.handleJob);\n`,
});
