/// The console's sharing dialogs end to end (issue 8): the lead opens the share dialog from
/// the palette and shares a session with the team; a member opens it from their own
/// sessions list, reads the transcript and runs a cell; a guest reads it but cannot run a cell; the
/// lead publishes a read-only link, which a signed-out visitor reads read-only until the
/// lead revokes it. A named object shared from the shelf is imported by the member into a
/// session of their own, its origin shown; the export dialog downloads LaTeX and JSON, and
/// the JSON file imports as a new session. Screenshots in tests/artifacts/.
import { readFile } from "node:fs/promises";
import path from "node:path";
import type { Page } from "playwright-core";
import { db } from "@/db/client";
import { cells, namedObjects, sessions } from "@/db/schema";
import { browserTest, check } from "../helpers/browser";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { signIn } from "../helpers/browser-sign-in";

const shot = (page: Page, dir: string, name: string) => page.screenshot({ path: path.join(dir, name), fullPage: true });

/// A private session of the lead's, outside any team, with one finished cell and one named object.
async function leadSession(title: string) {
  const group = await ensureTestGroup();
  const lead = group.users.lead.id;
  const [s] = await db().insert(sessions).values({ title, ownerId: lead }).returning({ id: sessions.id });
  const value = { type: "Int", text: "42", value: "42" };
  const [cell] = await db()
    .insert(cells)
    .values({
      sessionId: s!.id,
      position: 0,
      source: "tide := 6 * 7",
      status: "done",
      result: { statements: [{ statement: 0, span: { from: { line: 1, col: 1 }, to: { line: 1, col: 14 } }, value }], currentRing: null },
      finishedAt: new Date(),
      durationMs: 1,
      createdBy: lead,
    })
    .returning({ id: cells.id });
  await db()
    .insert(namedObjects)
    .values({ sessionId: s!.id, ownerId: lead, name: "tide", type: "Int", value, source: "tide := 6 * 7", sourceCellId: cell!.id });
  return { group, id: s!.id };
}

/// Runs a palette command by its name (Ctrl+K, type, Enter).
async function palette(page: Page, command: string) {
  await page.keyboard.press("Control+k");
  const box = page.getByPlaceholder("Type a command…");
  await box.waitFor();
  await box.fill(command);
  await page.getByRole("option", { name: command }).first().click();
}

const postCell = (page: Page, url: string) =>
  page.evaluate(async (u) => {
    const r = await fetch(u, {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ source: "1 + 1" }),
    });
    return r.status;
  }, url);

browserTest(
  "share dialog: the lead shares with the team; a member reads it, a guest cannot run",
  async ({ page, baseUrl, artifactsDir }) => {
    const title = `Jetty soundings ${Date.now().toString(36)}`;
    const { group, id } = await leadSession(title);

    await signIn(page, baseUrl, "lead", `/?session=${id}`);
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await palette(page, "Share this session…");
    const dialog = page.getByRole("dialog", { name: `Share “${title}”` });
    await dialog.waitFor();
    await dialog.getByLabel("A team").check();
    await dialog.getByLabel("Team", { exact: true }).selectOption(group.teamId);
    await dialog.getByLabel("Role").selectOption("editor");
    await dialog.getByRole("button", { name: "Share", exact: true }).click();
    await dialog.getByTestId("share-row").filter({ hasText: "team Harbor test group" }).filter({ hasText: "editor" }).waitFor();
    await shot(page, artifactsDir, "share-dialogs-1-lead-shared-with-team.png");
    await page.keyboard.press("Escape");

    // a member, from their own account: the session is in their sessions list
    await signIn(page, baseUrl, "member");
    await page
      .getByRole("region", { name: "Sessions" })
      .getByRole("button", { name: new RegExp(title) })
      .click();
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").waitFor();
    await page.getByRole("region", { name: "Transcript" }).getByText("42").first().waitFor();
    check((await page.getByLabel("Ringside input").count()) === 1, "a member (editor through the team share) is not offered the input");
    // an editor runs cells in the shared session
    await page.getByLabel("Ringside input").click();
    await page.keyboard.type("tide + 1");
    await page.keyboard.press("Escape");
    await page.keyboard.press("Enter");
    await page.getByRole("region", { name: "Transcript" }).getByText("43", { exact: true }).first().waitFor();
    await shot(page, artifactsDir, "share-dialogs-2-member-reads.png");

    // a guest of the team reads it (a team share leaves guests viewers) but cannot run a cell
    await signIn(page, baseUrl, "guest", `/?session=${id}`);
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").waitFor();
    check((await page.getByLabel("Ringside input").count()) === 0, "a guest is shown the input editor");
    check((await page.getByRole("button", { name: "Run" }).count()) === 0, "a guest is shown a Run button");
    check((await page.getByRole("button", { name: "Share", exact: true }).count()) === 0, "a guest is offered the share dialog");
    const status = await postCell(page, `/api/sessions/${id}/cells`);
    check(status === 403, `a guest's cell was answered ${status}, not 403`);
    await shot(page, artifactsDir, "share-dialogs-3-guest-read-only.png");
  },
);

browserTest("read-only link: published from the dialog, read signed out, dead once revoked", async ({ page, baseUrl, artifactsDir }) => {
  const title = `Slipway tallies ${Date.now().toString(36)}`;
  const { id } = await leadSession(title);

  await signIn(page, baseUrl, "lead", `/?session=${id}`);
  await page.getByRole("button", { name: "Share", exact: true }).click();
  const dialog = page.getByRole("dialog", { name: `Share “${title}”` });
  await dialog.getByRole("button", { name: "Publish a read-only link" }).click();
  const field = dialog.getByLabel("Link address");
  await field.waitFor();
  const url = await field.inputValue();
  check(url.includes(`session=${id}`) && /[?&]link=[\w-]{40,}/.test(url), `the published link looks wrong: ${url}`);
  await shot(page, artifactsDir, "share-dialogs-4-link-published.png");
  await page.keyboard.press("Escape");

  // signed out, through the link: the transcript and the shelf, said to be read-only, no input
  await page.context().clearCookies();
  await page.goto(url);
  await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
  await page.getByTestId("link-banner").waitFor();
  await page.getByTestId("read-only-badge").filter({ hasText: "read-only shared link" }).waitFor();
  await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").waitFor();
  await page.getByRole("region", { name: "Shelf" }).getByText("tide").first().waitFor();
  check(new URL(page.url()).pathname === "/", `the signed-out visitor was sent to ${page.url()}`);
  check((await page.getByLabel("Ringside input").count()) === 0, "a link holder is shown the input editor");
  check((await page.getByRole("button", { name: "Run" }).count()) === 0, "a link holder is shown a Run button");
  const token = new URL(url).searchParams.get("link")!;
  const status = await postCell(page, `/api/sessions/${id}/cells?link=${encodeURIComponent(token)}`);
  check(status === 401, `a signed-out link holder's cell was answered ${status}, not 401`);
  await shot(page, artifactsDir, "share-dialogs-5-link-read-signed-out.png");

  // without the link a signed-out visitor is still sent to sign in
  await page.goto(`${baseUrl}/?session=${id}`);
  await page.getByRole("button", { name: "Sign in" }).waitFor();
  check(new URL(page.url()).pathname === "/sign-in", "a signed-out visitor without a link was not sent to sign in");

  // the lead revokes the link from the same dialog; the address stops working
  await signIn(page, baseUrl, "lead", `/?session=${id}`);
  await palette(page, "Publish or revoke the read-only link…");
  await page
    .getByRole("dialog", { name: `Share “${title}”` })
    .getByRole("button", { name: "Revoke the link" })
    .click();
  await page
    .getByRole("dialog", { name: `Share “${title}”` })
    .getByRole("button", { name: "Publish a read-only link" })
    .waitFor();
  await page.keyboard.press("Escape");
  await page.context().clearCookies();
  await page.goto(url);
  await page.getByRole("alert").filter({ hasText: "This read-only link does not open a session" }).waitFor();
  check(
    (await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").count()) === 0,
    "a revoked link still shows the transcript",
  );
  await shot(page, artifactsDir, "share-dialogs-6-link-revoked.png");
});

browserTest(
  "object sharing: shared from the shelf, imported by a member with its origin shown",
  async ({ page, baseUrl, artifactsDir }) => {
    const title = `Buoy readings ${Date.now().toString(36)}`;
    const { group, id } = await leadSession(title);
    const [own] = await db()
      .insert(sessions)
      .values({ title: `Milo's scratch ${Date.now().toString(36)}`, ownerId: group.users.member.id })
      .returning({ id: sessions.id });

    await signIn(page, baseUrl, "lead", `/?session=${id}`);
    await page.getByRole("region", { name: "Shelf" }).getByRole("button", { name: "Share tide" }).click();
    const dialog = page.getByRole("dialog", { name: "Share the named object tide" });
    await dialog.getByLabel("A person").check();
    await dialog.getByLabel("E-mail address").fill(TEST_ACCOUNTS.member.email);
    await dialog.getByRole("button", { name: "Share", exact: true }).click();
    await dialog.getByTestId("share-row").filter({ hasText: TEST_ACCOUNTS.member.email }).waitFor();
    await shot(page, artifactsDir, "share-dialogs-7-object-shared.png");
    await page.keyboard.press("Escape");

    await signIn(page, baseUrl, "member", `/?session=${own!.id}`);
    await page.getByLabel("Ringside input").waitFor();
    await page.getByRole("region", { name: "Shelf" }).getByRole("button", { name: "Shared with me" }).click();
    const list = page.getByRole("dialog", { name: "Objects shared with me" });
    await list.locator(`[data-shared-object="tide"]`).filter({ hasText: title }).getByRole("button", { name: "Import tide" }).click();
    await page.getByTestId("console-notice").filter({ hasText: "Imported tide" }).waitFor();
    const origin = page.getByRole("region", { name: "Shelf" }).getByTestId("object-origin");
    await origin.filter({ hasText: `from ${TEST_ACCOUNTS.lead.name}'s session “${title}”` }).waitFor();
    await shot(page, artifactsDir, "share-dialogs-8-object-imported.png");
  },
);

browserTest("export dialog: LaTeX and JSON downloads; the JSON file imports as a new session", async ({ page, baseUrl, artifactsDir }) => {
  const title = `Tidepool ledger ${Date.now().toString(36)}`;
  const { id } = await leadSession(title);
  await signIn(page, baseUrl, "lead", `/?session=${id}`);
  await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
  await page.getByRole("button", { name: "Export", exact: true }).click();
  const dialog = page.getByRole("dialog", { name: "Export or import" });

  const download = async (label: string) => {
    const [file] = await Promise.all([page.waitForEvent("download"), dialog.getByRole("button", { name: label, exact: true }).click()]);
    const where = await file.path();
    return { name: file.suggestedFilename(), where, text: await readFile(where, "utf8") };
  };
  const tex = await download("LaTeX");
  check(tex.name.endsWith(".tex"), `the LaTeX download is named ${tex.name}`);
  check(
    tex.text.includes("\\begin{document}") && tex.text.includes("tide := 6 * 7"),
    "the LaTeX download lacks the document or the cell source",
  );
  const json = await download("JSON");
  check(
    json.name.endsWith(".json") && JSON.parse(json.text).format === "ringside.session",
    `the JSON download is not our export: ${json.name}`,
  );
  await shot(page, artifactsDir, "share-dialogs-9-export-dialog.png");

  await dialog.getByLabel(/A JSON export file/).setInputFiles(json.where);
  await page
    .getByTestId("console-notice")
    .filter({ hasText: `Imported “${title}”` })
    .waitFor();
  await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
  await page.getByRole("region", { name: "Transcript" }).getByText("tide := 6 * 7").waitFor();
  check(new URL(page.url()).searchParams.get("session") !== id, "the import did not open a new session");
  await shot(page, artifactsDir, "share-dialogs-10-imported.png");
});
