#!/usr/bin/env node
// Launcher of the `ringside` command. The CLI is TypeScript; lib/bundle bundles it into one
// ES module with packages left as imports (so ESM-only packages such as chevrotain load
// natively) and caches it until one of its source files changes.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../bundle/esm-bundle.mjs";

const here = path.dirname(fileURLToPath(import.meta.url));
const { main } = await importBundled("ringside-cli", "main", path.join(here, "main.ts"));
process.exitCode = await main(process.argv.slice(2), process);
