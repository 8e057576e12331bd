#!/usr/bin/env node
// Launcher of the `ringside` command. The CLI is TypeScript; esbuild (the compiler tsx
// runs on) bundles it into one ES module with packages left as imports, and that module
// runs in this same process. Bundling rather than a tsx loader hook keeps ESM-only
// packages such as chevrotain loading natively. The bundle is cached until one of its
// source files changes.
import { build } from "esbuild";
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, "..", "..");
// inside the repository, so the bundle's package imports resolve from its node_modules
const cache = path.join(root, "node_modules", ".cache", "ringside-cli");
const bundle = path.join(cache, "main.mjs");
const inputsFile = path.join(cache, "inputs.json");

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
  const result = await build({
    entryPoints: [path.join(here, "main.ts")],
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
  // written aside and renamed, so a concurrent run never reads half a file
  const tmp = `${process.pid}-${Date.now()}.tmp`;
  writeFileSync(`${inputsFile}.${tmp}`, JSON.stringify(Object.keys(result.metafile.inputs)));
  writeFileSync(`${bundle}.${tmp}`, result.outputFiles[0].contents);
  renameSync(`${inputsFile}.${tmp}`, inputsFile);
  renameSync(`${bundle}.${tmp}`, bundle);
}
const { main } = await import(pathToFileURL(bundle).href);
process.exitCode = await main(process.argv.slice(2), process);
