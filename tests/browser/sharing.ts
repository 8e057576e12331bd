/// Sharing in the browser (issue 8's evidence): the lead shares a session with the group
/// from the team page, a member opens it from their own account and reads the transcript,
/// a guest reads it too but is offered no way to run a cell. Screenshots in tests/artifacts/.
import path from "node:path";
import type { Page } from "playwright-core";
import { db } from "@/db/client";
import { cells, sessions } from "@/db/schema";
import { browserTest, check } from "../helpers/browser";
import { ensureTestGroup } from "../helpers/fixtures";
import { signIn } from "../helpers/browser-sign-in";

const shot = (page: Page, dir: string, name: string) => page.screenshot({ path: path.join(dir, name), fullPage: true });

browserTest(
  "sharing: the lead shares a session with the group; a member reads it, a guest cannot run",
  async ({ page, baseUrl, artifactsDir }) => {
    const group = await ensureTestGroup();
    const title = `Breakwater notes ${Date.now().toString(36)}`;
    const [session] = await db().insert(sessions).values({ title, ownerId: group.users.lead.id }).returning({ id: sessions.id });
    await db()
      .insert(cells)
      .values({
        sessionId: session!.id,
        position: 0,
        source: "tide := 6 * 7",
        status: "done",
        result: {
          statements: [
            {
              statement: 0,
              span: { from: { line: 1, col: 1 }, to: { line: 1, col: 14 } },
              value: { type: "Int", text: "42", value: "42" },
            },
          ],
          currentRing: null,
        },
        finishedAt: new Date(),
        durationMs: 1,
        createdBy: group.users.lead.id,
      });

    // the lead, on the team page
    await signIn(page, baseUrl, "lead");
    await page.goto(`${baseUrl}/teams/${group.teamId}`);
    await page.getByTestId("my-team-role").filter({ hasText: "lead" }).waitFor();
    const shared = page.getByRole("region", { name: "Shared sessions" });
    await shared.getByRole("combobox", { name: "Share one of your sessions" }).selectOption({ label: title });
    await shared.getByRole("combobox", { name: "Share as", exact: true }).selectOption("editor");
    await page.getByRole("button", { name: "Share with the team" }).click();
    await page.getByTestId("team-notice").filter({ hasText: "is shared with" }).waitFor();
    await page.getByRole("region", { name: "Shared sessions" }).getByRole("link", { name: title }).waitFor();
    await shot(page, artifactsDir, "sharing-1-lead-shared.png");

    // a member, from their own account: the session is listed on the team page and opens
    await signIn(page, baseUrl, "member");
    await page.goto(`${baseUrl}/teams/${group.teamId}`);
    await page.getByRole("region", { name: "Shared sessions" }).getByRole("link", { name: title }).click();
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    const transcript = page.getByRole("region", { name: "Transcript" });
    await transcript.getByText("tide := 6 * 7").waitFor();
    await transcript.getByText("42").first().waitFor();
    check((await page.getByLabel("Ringside input").count()) === 1, "a member (editor through the team share) is not offered the input");
    await shot(page, artifactsDir, "sharing-2-member-reads.png");

    // a guest reads the same transcript but cannot run a cell: no input, and the API refuses
    await signIn(page, baseUrl, "guest");
    await page.goto(`${baseUrl}/?session=${session!.id}`);
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").waitFor();
    check((await page.getByLabel("Ringside input").count()) === 0, "a guest is shown the input editor");
    check((await page.getByRole("button", { name: "Run" }).count()) === 0, "a guest is shown a Run button");
    const status = await page.evaluate(async (id) => {
      const r = await fetch(`/api/sessions/${id}/cells`, {
        method: "POST",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ source: "1 + 1" }),
      });
      return r.status;
    }, session!.id);
    check(status === 403, `a guest's cell was answered ${status}, not 403`);
    await shot(page, artifactsDir, "sharing-3-guest-read-only.png");
  },
);
