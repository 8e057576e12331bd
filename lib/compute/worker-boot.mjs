// Worker threads start here: load TypeScript through tsx, then the job module the pool named
// and the generic host. (A worker's execArgv cannot carry tsx's loader, so it is used from here.)
import { workerData } from "node:worker_threads";
import { pathToFileURL } from "node:url";
import { tsImport } from "tsx/esm/api";

const pick = (mod, name) => mod[name] ?? mod.default?.[name];
const host = await tsImport("./worker-host.ts", import.meta.url);
const job = await tsImport(pathToFileURL(workerData.entry).href, import.meta.url);
const handleJob = pick(job, "handleJob");
if (typeof handleJob !== "function") throw new Error(`worker-boot: ${workerData.entry} exports no handleJob`);
pick(host, "startHost")(handleJob);
