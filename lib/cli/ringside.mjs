#!/usr/bin/env node
// Launcher of the `ringside` command. The CLI is TypeScript; lib/bundle bundles it into one
// ES module with packages left as imports (so ESM-only packages such as chevrotain load
// natively) and caches it until one of its source files changes.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../bundle/esm-bundle.mjs";

const here = path.dirname(fileURLToPath(import.meta.url));
const argv = process.argv.slice(2);
if (argv[0] === "experiments") {
  // steering background sweeps needs the database; its own bundle keeps `eval` light
  const { experimentsMain } = await importBundled(
    "ringside-experiments-cli",
    "experimentsMain",
    path.join(here, "..", "experiments", "cli.ts"),
  );
  process.exitCode = await experimentsMain(argv.slice(1), process.stdout, process.stderr);
} else {
  const { main } = await importBundled("ringside-cli", "main", path.join(here, "main.ts"));
  process.exitCode = await main(argv, process);
}
