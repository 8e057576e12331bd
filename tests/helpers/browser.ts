/// The registry the browser tests (tests/browser/*.ts) add themselves to; the runner
/// (tests/helpers/browser-runner.ts) gives each test a fresh page with no cookies.
import type { Page } from "playwright-core";

export interface BrowserTestContext {
  page: Page;
  baseUrl: string;
  artifactsDir: string;
}

export interface BrowserTest {
  name: string;
  run: (ctx: BrowserTestContext) => Promise<void>;
}

export const registeredBrowserTests: BrowserTest[] = [];

export function browserTest(name: string, run: BrowserTest["run"]): void {
  registeredBrowserTests.push({ name, run });
}

/// Throws with `message` unless `condition` holds (browser tests run outside vitest).
export function check(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(message);
}
