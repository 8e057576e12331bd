#!/usr/bin/env node
// Launcher of the `ringside` command. The CLI is TypeScript; it is bundled with esbuild
// (the compiler tsx runs on) into one ES module, with packages left as imports, and that
// module is loaded in this same process. Bundling rather than a tsx loader hook keeps
// ESM-only packages such as chevrotain loading natively.
import { build } from "esbuild";
import { mkdirSync, unlinkSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, "..", "..");
const result = await build({
  entryPoints: [path.join(here, "main.ts")],
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  packages: "external",
  sourcemap: "inline",
  write: false,
  logLevel: "error",
  absWorkingDir: root,
});
// inside the repository, so the bundle's package imports resolve from its node_modules
const dir = path.join(root, "node_modules", ".cache", "ringside-cli");
mkdirSync(dir, { recursive: true });
const file = path.join(dir, `main-${process.pid}-${Date.now()}.mjs`);
writeFileSync(file, result.outputFiles[0].contents);
let main;
try {
  ({ main } = await import(pathToFileURL(file).href));
} finally {
  unlinkSync(file);
}
process.exitCode = await main(process.argv.slice(2), process);
