/// A signed-out visitor is sent to sign-in, signs in with a test account and sees the
/// console shell with their name.
import path from "node:path";
import { browserTest, check } from "../helpers/browser";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";

browserTest("signs in with a team account and sees the console shell", async ({ page, baseUrl, artifactsDir }) => {
  await ensureTestGroup();
  const account = TEST_ACCOUNTS.lead;
  await page.goto(baseUrl);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel("Email").fill(account.email);
  await page.getByLabel("Password").fill(account.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("region", { name: "Transcript" }).waitFor();
  for (const region of ["Transcript", "Input"]) {
    check(await page.getByRole("region", { name: region }).isVisible(), `the console shell shows no ${region} region`);
  }
  check((await page.getByTestId("user-name").textContent()) === account.name, "the header does not show the user's name");
  check(await page.getByRole("link", { name: "Sign out" }).isVisible(), "the header has no sign-out link");
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  check(overflow <= 0, `the console is ${overflow}px wider than the window`);
  await page.screenshot({ path: path.join(artifactsDir, "console-shell.png"), fullPage: true });
});

browserTest("shows a clear message for a wrong password", async ({ page, baseUrl }) => {
  await ensureTestGroup();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("Email").fill(TEST_ACCOUNTS.guest.email);
  await page.getByLabel("Password").fill("certainly-wrong-1");
  await page.getByRole("button", { name: "Sign in" }).click();
  // Filtered by text: Next's route announcer is an (empty) alert region too.
  await page.getByRole("alert").filter({ hasText: "do not match an account" }).waitFor();
  check(new URL(page.url()).pathname === "/sign-in", "left the sign-in page after a failed attempt");
});
