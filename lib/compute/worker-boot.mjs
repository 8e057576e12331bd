// Worker threads start here. The job module (TypeScript) and the generic host are bundled
// by esbuild into one ES module, packages left as imports, and cached until a source file
// changes: ESM-only packages such as chevrotain then load natively, which a tsx loader
// inside a worker cannot offer (it would `require` them).
import { workerData } from "node:worker_threads";
import { build } from "esbuild";
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, "..", "..");
const entry = path.resolve(workerData.entry);
// Inside the repository, so the bundle's package imports resolve from its node_modules.
const cache = path.join(root, "node_modules", ".cache", "ringside-worker");
const key = createHash("sha256").update(entry).digest("hex").slice(0, 16);
const bundle = path.join(cache, `${key}.mjs`);
const inputsFile = path.join(cache, `${key}.inputs.json`);

function isFresh() {
  try {
    const built = statSync(bundle).mtimeMs;
    const inputs = JSON.parse(readFileSync(inputsFile, "utf8"));
    return inputs.every((f) => statSync(path.join(root, f)).mtimeMs < built);
  } catch {
    return false;
  }
}

if (!isFresh()) {
  const host = path.join(here, "worker-host.ts");
  const result = await build({
    stdin: {
      contents: `import { startHost } from ${JSON.stringify(host)};\nimport * as job from ${JSON.stringify(entry)};\nstartHost(job.handleJob);\n`,
      resolveDir: root,
      sourcefile: "worker-entry.ts",
      loader: "ts",
    },
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: "external",
    sourcemap: "inline",
    metafile: true,
    write: false,
    logLevel: "error",
    absWorkingDir: root,
  });
  mkdirSync(cache, { recursive: true });
  // Written aside and renamed, so a worker starting at the same time never reads half a file.
  const tmp = `${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.tmp`;
  const inputs = Object.keys(result.metafile.inputs).filter((f) => f !== "<stdin>");
  writeFileSync(`${inputsFile}.${tmp}`, JSON.stringify(inputs));
  writeFileSync(`${bundle}.${tmp}`, result.outputFiles[0].contents);
  renameSync(`${inputsFile}.${tmp}`, inputsFile);
  renameSync(`${bundle}.${tmp}`, bundle);
}
await import(pathToFileURL(bundle).href);
