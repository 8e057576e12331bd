/// Signs a browser page in as one of the test accounts (fresh cookies), landing on `then`.
import type { Page } from "playwright-core";
import { TEST_ACCOUNTS, type FixtureKey } from "./fixtures";

export async function signIn(page: Page, baseUrl: string, who: FixtureKey, then = "/"): Promise<void> {
  await page.context().clearCookies();
  const account = TEST_ACCOUNTS[who];
  await page.goto(`${baseUrl}/sign-in?callbackUrl=${encodeURIComponent(then)}`);
  await page.getByLabel("Email").fill(account.email);
  await page.getByLabel("Password").fill(account.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("region", { name: "Transcript" }).waitFor();
}
