// `npm run bench [-- NAME-FILTER] [--readme]`: bundles the runner like the CLI (lib/bundle; the
// notation's parser is an ES-only package) and runs it; see run.ts.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { importBundled } from "../../lib/bundle/esm-bundle.mjs";

const here = path.dirname(fileURLToPath(import.meta.url));
const { main } = await importBundled("ringside-bench", "run", path.join(here, "run.ts"));
try {
  await main(path.join(here, "..", ".."), process.argv.slice(2));
} catch (e) {
  console.error(e);
  process.exitCode = 1;
}
