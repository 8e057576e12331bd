/// A visitor creates an account on the sign-up page and lands in the console, signed in.
import { browserTest, check } from "../helpers/browser";
import { uniqueEmail } from "../helpers/fixtures";

browserTest("creates an account on the sign-up page and arrives signed in", async ({ page, baseUrl }) => {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel("Name").fill("Browser Newcomer");
  await page.getByLabel("Email").fill(uniqueEmail("browser"));
  await page.getByLabel("Password").fill("short");
  await page.getByRole("button", { name: "Create account" }).click();
  await page.getByRole("alert").filter({ hasText: "shorter than 10 characters" }).waitFor();

  await page.getByLabel("Password").fill("fresh-newcomer-8086");
  await page.getByRole("button", { name: "Create account" }).click();
  await page.getByRole("region", { name: "Transcript" }).waitFor();
  check((await page.getByTestId("user-name").textContent()) === "Browser Newcomer", "the header does not show the new user's name");
});
