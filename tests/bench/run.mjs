// `npm run bench [-- NAME-FILTER] [--readme]`: bundles the runner like the CLI (lib/bundle; the
// notation's parser is an ES-only package) and runs it; see run.ts.
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../../lib/bundle/esm-bundle.mjs";

const here = path.dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
// Sweep throughput (experiments with `npm run worker` processes) needs the database: it runs
// alone with `-- sweep`, and after the other cases when DATABASE_URL is set.
function sweep() {
  const r = spawnSync(process.execPath, ["--import", "tsx", path.join(here, "sweep-main.ts")], {
    stdio: "inherit",
    cwd: path.join(here, "..", ".."),
  });
  if (r.status !== 0) process.exitCode = 1;
}
if (args[0] === "sweep") {
  sweep();
  process.exit();
}
const { main } = await importBundled("ringside-bench", "run", path.join(here, "run.ts"));
try {
  await main(path.join(here, "..", ".."), args);
  if (!args.some((a) => !a.startsWith("--")) && process.env.DATABASE_URL) {
    console.log("\nSweep throughput (experiments, `npm run worker` processes):");
    sweep();
  }
} catch (e) {
  console.error(e);
  process.exitCode = 1;
}
