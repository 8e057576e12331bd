/// A visitor creates an account on the sign-up page, is told plainly to look for the
/// confirmation link in the mail (with the link's lifetime), and goes on into the console,
/// signed in.
import { formatLimit } from "../../lib/limits";
import { browserTest, check } from "../helpers/browser";
import { uniqueEmail } from "../helpers/fixtures";

browserTest(
  "creates an account on the sign-up page, is told to check the mail for the link, and arrives signed in",
  async ({ page, baseUrl }) => {
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel("Name").fill("Browser Newcomer");
    await page.getByLabel("Email").fill(uniqueEmail("browser"));
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.getByRole("alert").filter({ hasText: "shorter than 10 characters" }).waitFor();

    await page.getByLabel("Password").fill("fresh-newcomer-8086");
    await page.getByRole("button", { name: "Create account" }).click();
    const notice = page.getByRole("status", { name: "Account created" });
    await notice.waitFor();
    const text = (await notice.textContent()) ?? "";
    check(/check your mail/i.test(text), `the sign-up page does not tell the user to check the mail: ${text}`);
    check(text.includes(formatLimit("emailVerificationMs")), `the notice does not give the link's lifetime: ${text}`);
    await page.getByRole("button", { name: "Continue" }).click();
    await page.getByRole("region", { name: "Transcript" }).waitFor();
    check((await page.getByTestId("user-name").textContent()) === "Browser Newcomer", "the header does not show the new user's name");
  },
);
