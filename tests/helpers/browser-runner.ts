/// Runs every tests/browser/*.ts file in Debian's chromium through playwright-core and
/// writes `{ numPassedTests, numFailedTests }` to the file named by the first argument.
/// Further arguments name the files to run alone (e.g. `sharing.ts`), for iterating on one.
import { mkdir, mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { chromium } from "playwright-core";
import { closeDb } from "@/db/client";
import { registeredBrowserTests } from "./browser";
import { testEnv } from "./env";

const CHROMIUM = "/usr/bin/chromium";
const FLAGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];
const TEST_TIMEOUT_MS = 60_000;

async function main(): Promise<number> {
  const resultsFile = process.argv[2];
  const baseUrl = testEnv("RINGSIDE_TEST_BASE_URL");
  const root = path.resolve(__dirname, "..", "..");
  const browserDir = path.join(root, "tests", "browser");
  const artifactsDir = path.join(root, "tests", "artifacts");
  await mkdir(artifactsDir, { recursive: true });

  const only = process.argv.slice(3);
  for (const file of (await readdir(browserDir)).filter((f) => f.endsWith(".ts") && (only.length === 0 || only.includes(f))).sort()) {
    await import(path.join(browserDir, file));
  }

  // A fresh profile each run; playwright passes --headless itself and owns --user-data-dir
  // through launchPersistentContext.
  const profile = await mkdtemp(path.join(os.tmpdir(), "ringside-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: FLAGS,
    viewport: { width: 1280, height: 800 },
  });
  let passed = 0;
  let failed = 0;
  try {
    for (const test of registeredBrowserTests) {
      await context.clearCookies();
      const page = await context.newPage();
      page.setDefaultTimeout(20_000);
      const started = Date.now();
      try {
        await withTimeout(test.run({ page, baseUrl, artifactsDir }), TEST_TIMEOUT_MS, test.name);
        passed++;
        console.log(`  ✓ ${test.name} (${Date.now() - started} ms)`);
      } catch (error) {
        failed++;
        console.log(`  ✗ ${test.name}\n    ${error instanceof Error ? error.message : String(error)}`);
        await page.screenshot({ path: path.join(artifactsDir, `failed-${slug(test.name)}.png`) }).catch(() => {});
      } finally {
        await page.close();
      }
    }
  } finally {
    await context.close();
    await rm(profile, { recursive: true, force: true });
    await closeDb();
  }
  console.log(`browser tests: ${passed} passed, ${failed} failed`);
  if (resultsFile) await writeFile(resultsFile, JSON.stringify({ numPassedTests: passed, numFailedTests: failed }));
  return failed === 0 ? 0 : 1;
}

function withTimeout<T>(promise: Promise<T>, ms: number, name: string): Promise<T> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name}: no result within ${ms / 1000} s`)), ms);
    promise.then(
      (v) => (clearTimeout(timer), resolve(v)),
      (e: unknown) => (clearTimeout(timer), reject(e)),
    );
  });
}

function slug(name: string): string {
  return name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .slice(0, 60);
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error("browser runner:", error);
    process.exit(1);
  },
);
