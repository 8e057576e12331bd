// Runs TypeScript entry points as one ES module bundled by esbuild (packages left as
// imports), cached under node_modules/.cache until one of its source files changes.
// ESM-only packages such as chevrotain then load natively, which tsx's CommonJS transform
// of this (non-"type": "module") package cannot offer. Used by the CLI launcher and by the
// engine's worker threads.
import { build } from "esbuild";
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");

function isFresh(bundle, inputsFile) {
  try {
    const built = statSync(bundle).mtimeMs;
    const inputs = JSON.parse(readFileSync(inputsFile, "utf8"));
    return inputs.every((f) => statSync(path.join(root, f)).mtimeMs < built);
  } catch {
    return false;
  }
}

/// Bundles `source` (an entry file, or `{ contents }` of a TypeScript module resolved from
/// the repository root) as `name` in the cache folder `cacheDir`, and imports it.
export async function importBundled(cacheDir, name, source) {
  // Inside the repository, so the bundle's package imports resolve from its node_modules.
  const cache = path.join(root, "node_modules", ".cache", cacheDir);
  const bundle = path.join(cache, `${name}.mjs`);
  const inputsFile = path.join(cache, `${name}.inputs.json`);
  if (!isFresh(bundle, inputsFile)) {
    const entry =
      typeof source === "string"
        ? { entryPoints: [source] }
        : { stdin: { contents: source.contents, resolveDir: root, sourcefile: `${name}-entry.ts`, loader: "ts" } };
    const result = await build({
      ...entry,
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
    // Written aside and renamed, so a run starting at the same time never reads half a file.
    const tmp = `${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.tmp`;
    const inputs = Object.keys(result.metafile.inputs).filter((f) => f !== "<stdin>");
    writeFileSync(`${inputsFile}.${tmp}`, JSON.stringify(inputs));
    writeFileSync(`${bundle}.${tmp}`, result.outputFiles[0].contents);
    renameSync(`${inputsFile}.${tmp}`, inputsFile);
    renameSync(`${bundle}.${tmp}`, bundle);
  }
  return import(pathToFileURL(bundle).href);
}
