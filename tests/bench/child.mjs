// Child process of the bench runner: node [--max-old-space-size=N] tests/bench/child.mjs CASE.
// The cases are bundled by esbuild like the CLI (lib/bundle), so the figures are those of
// the code a user runs; prints one JSON line with the timing and the peak resident memory.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../../lib/bundle/esm-bundle.mjs";

const here = path.dirname(fileURLToPath(import.meta.url));
const { runCase } = await importBundled("ringside-bench", "child", path.join(here, "child.ts"));
const r = await runCase(process.argv[2]);
process.stdout.write(`${JSON.stringify({ ...r, peakMb: process.resourceUsage().maxRSS / 1024 })}\n`);
