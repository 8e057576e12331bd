/// The console for daily work (issue 18's evidence), in a real browser against the
/// production build and the test database; a screenshot of each state goes to
/// tests/artifacts/daily-*.png.
import path from "node:path";
import { eq } from "drizzle-orm";
import { marked, type Token, type Tokens } from "marked";
import type { Page } from "playwright-core";
import { db } from "@/db/client";
import { cells, invitations, sessions, teams, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { tokenHash } from "@/lib/sharing/common";
import { browserTest, check } from "../helpers/browser";
import { signIn } from "../helpers/browser-sign-in";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";

const shot = (page: Page, dir: string, name: string) => page.screenshot({ path: path.join(dir, `daily-${name}.png`), fullPage: true });
const input = (page: Page) => page.getByLabel("Ringside input");
const transcript = (page: Page) => page.getByRole("region", { name: "Transcript" });
const articles = (page: Page) => transcript(page).locator("article");
const stamp = () => Date.now().toString(36) + Math.random().toString(36).slice(2, 5);

async function typeInput(page: Page, lines: string[]) {
  await input(page).click();
  for (let k = 0; k < lines.length; k++) {
    if (k > 0) await page.keyboard.press("Shift+Enter");
    await page.keyboard.type(lines[k]!);
  }
  await page.keyboard.press("Escape");
}

/// Waits until the transcript holds `count` finished cells.
async function finished(page: Page, count: number) {
  await page.waitForFunction(
    (n) => {
      const list = [...document.querySelectorAll('section[aria-label="Transcript"] article')];
      return list.length >= n && !document.querySelector('article[aria-label="Running cell"]');
    },
    count,
    { timeout: 40_000 },
  );
}

async function run(page: Page, lines: string[], count: number) {
  await typeInput(page, lines);
  await page.keyboard.press("Enter");
  await finished(page, count);
}

/// A session of `owner` made in the database, opened in the page.
async function openOwnSession(page: Page, baseUrl: string, who: "lead" | "member", title: string, team = false) {
  const group = await ensureTestGroup();
  const [s] = await db()
    .insert(sessions)
    .values({ title, ownerId: group.users[who].id, ...(team ? { teamId: group.teamId, visibility: "team" as const } : {}) })
    .returning({ id: sessions.id });
  await signIn(page, baseUrl, who, `/?session=${s!.id}`);
  await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
  return s!.id;
}

browserTest("daily: rename and delete a session", async ({ page, baseUrl, artifactsDir }) => {
  const title = `Tidepool draft ${stamp()}`;
  const id = await openOwnSession(page, baseUrl, "lead", title);
  const panel = page.getByRole("region", { name: "Sessions" });
  await panel.getByRole("button", { name: `Rename ${title}` }).click();
  const field = panel.getByRole("textbox", { name: "New title" });
  await field.fill(`${title} (renamed)`);
  await shot(page, artifactsDir, "1-rename");
  await field.press("Enter");
  const row = (t: string) => panel.getByTestId("session-row").filter({ hasText: t });
  await row(`${title} (renamed)`).waitFor();
  await page
    .getByTestId("session-title")
    .filter({ hasText: `${title} (renamed)` })
    .waitFor();
  // search finds it by title
  await panel.getByRole("searchbox", { name: "Search sessions" }).fill(`${title} (renamed)`);
  await row(`${title} (renamed)`).waitFor();
  check((await panel.getByTestId("session-row").count()) === 1, "the search shows sessions that do not match");
  await shot(page, artifactsDir, "1-renamed-and-found");
  await panel.getByRole("button", { name: `Delete ${title} (renamed)` }).click();
  const ask = page.getByRole("dialog", { name: "Delete this session?" });
  await ask.waitFor();
  await shot(page, artifactsDir, "1-delete-asks");
  await ask.getByRole("button", { name: "Delete the session" }).click();
  await row(`${title} (renamed)`).waitFor({ state: "detached" });
  const [stored] = await db().select().from(sessions).where(eq(sessions.id, id));
  check(stored === undefined, "the session is still in the database after Delete");
  await shot(page, artifactsDir, "1-deleted");
});

browserTest("daily: find an object from another session in the library and insert it", async ({ page, baseUrl, artifactsDir }) => {
  const group = await ensureTestGroup();
  const mark = `tideideal${stamp()}`;
  const [source] = await db()
    .insert(sessions)
    .values({ title: `Harbor source ${mark}`, ownerId: group.users.lead.id })
    .returning({ id: sessions.id });
  const title = `Harbor target ${mark}`;
  await openOwnSession(page, baseUrl, "lead", title);
  // define the object in the other session through the API, as a cell would
  // Same-origin, as the page's own fetch is (state-changing requests must say where they come from).
  const r = await page.request.post(`${baseUrl}/api/sessions/${source!.id}/cells`, {
    headers: { Origin: baseUrl },
    data: { source: `S := Q[x, y]\n${mark} := <x^2, x*y>` },
  });
  check(r.ok(), `running the source cell answered ${r.status()}`);
  await r.text();
  await page.getByRole("button", { name: "Library" }).click();
  const dialog = page.getByRole("dialog", { name: "Library" });
  await dialog.waitFor();
  await dialog.getByRole("searchbox", { name: "Search the library" }).fill(mark);
  const insert = dialog.getByRole("button", { name: `Insert ${mark} from Harbor source ${mark}` });
  await insert.waitFor();
  await shot(page, artifactsDir, "2-library-found");
  await insert.click();
  const shelf = page.getByRole("region", { name: "Shelf" });
  const item = shelf.locator(`[data-object-name="${mark}"]`);
  await item.waitFor();
  const origin = await item.getByTestId("object-origin").textContent();
  check(origin?.includes(`Harbor source ${mark}`), `the copy does not record its origin: ${origin}`);
  await shot(page, artifactsDir, "2-library-inserted");
});

browserTest(
  "daily: a member's cell shows its author, and redefining the lead's name asks first",
  async ({ page, baseUrl, artifactsDir }) => {
    const title = `Shared breakwater ${stamp()}`;
    const id = await openOwnSession(page, baseUrl, "lead", title, true);
    await run(page, ["S := Q[x, y]", "J := <x^2>"], 1);
    await signIn(page, baseUrl, "member", `/?session=${id}`);
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await finished(page, 1);
    await run(page, ["K := <y^3>"], 2);
    const authors = await transcript(page).getByTestId("cell-author").allTextContents();
    check(
      authors[0]?.includes(TEST_ACCOUNTS.lead.name) && authors[1]?.includes(TEST_ACCOUNTS.member.name),
      `authors shown: ${JSON.stringify(authors)}`,
    );
    await shot(page, artifactsDir, "3-authors");
    await typeInput(page, ["J := <y>"]);
    await page.keyboard.press("Enter");
    const ask = page.getByRole("dialog", { name: "Replace a name someone else defined?" });
    await ask.waitFor();
    check((await ask.textContent())?.includes(TEST_ACCOUNTS.lead.name), "the question does not say whose name it is");
    await shot(page, artifactsDir, "3-redefine-asks");
    check((await articles(page).count()) === 2, "the cell ran before the member answered");
    await ask.getByRole("button", { name: "Replace it" }).click();
    await finished(page, 3);
    const status = await articles(page).last().getByTestId("cell-status").textContent();
    check(status === "done", `the confirmed cell ended as ${status}`);
    await shot(page, artifactsDir, "3-redefined");
  },
);

browserTest(
  "daily: an invitee signs up from the invitation and lands in a session of their own",
  async ({ page, baseUrl, artifactsDir }) => {
    const group = await ensureTestGroup();
    const tag = stamp();
    const [team] = await db()
      .insert(teams)
      .values({ slug: `inv-${tag}`, name: `Estuary group ${tag}`, createdBy: group.users.lead.id })
      .returning({ id: teams.id });
    const { memberships } = await import("@/db/schema");
    await db().insert(memberships).values({ teamId: team!.id, userId: group.users.lead.id, role: "lead" });
    // the lead's own session exists, and must not be where the invitee lands
    await db()
      .insert(sessions)
      .values({ title: `Lead's estuary work ${tag}`, ownerId: group.users.lead.id, teamId: team!.id, visibility: "team" });
    const email = `iris-${tag}@console.test.example`;
    const token = `${tag}`.padEnd(43, "k");
    await db()
      .insert(invitations)
      .values({
        teamId: team!.id,
        email,
        role: "member",
        tokenHash: tokenHash(token),
        invitedBy: group.users.lead.id,
        expiresAt: new Date(Date.now() + 3600_000),
      });
    const [u] = await db()
      .insert(users)
      .values({ email, displayName: "Iris Invitee", passwordHash: await hashPassword("invitee-pass-5531") })
      .returning({ id: users.id });

    await page.context().clearCookies();
    await page.goto(`${baseUrl}/invitations/${token}`);
    await page.getByTestId("invitation-note").waitFor();
    const note = await page.getByTestId("invitation-note").textContent();
    check(note?.includes(`Estuary group ${tag}`) && note.includes(email), `the sign-in page does not say what the invitation is: ${note}`);
    await shot(page, artifactsDir, "4-sign-in-says-invitation");
    await page.getByLabel("Email").fill(email);
    await page.getByLabel("Password").fill("invitee-pass-5531");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("button", { name: "Accept invitation" }).click();
    await page.getByTestId("session-title").waitFor();
    const sessionId = new URL(page.url()).searchParams.get("session");
    check(sessionId, `the invitee did not land in a session: ${page.url()}`);
    const [landed] = await db().select().from(sessions).where(eq(sessions.id, sessionId));
    check(landed?.ownerId === u!.id, "the invitee landed in a session that is not their own");
    await shot(page, artifactsDir, "4-invitee-own-session");
  },
);

browserTest(
  "daily: a resolution shows its free modules with twists, and the Betti table copies as LaTeX",
  async ({ page, baseUrl, artifactsDir }) => {
    await openOwnSession(page, baseUrl, "lead", `Three points ${stamp()}`);
    // S/(xy, yz, xz): three coordinate points of P², resolved by 0 ← S ← S(−2)³ ← S(−3)² ← 0
    // (Eisenbud, The Geometry of Syzygies, GTM 229, §3A).
    await run(page, ["S := Q[x, y, z]", "F := resolve(S / <x*y, y*z, x*z>)", "F", "F.betti"], 1);
    const chain = transcript(page).getByTestId("resolution-chain").first();
    await chain.waitFor();
    const plain = await chain.getAttribute("data-plain");
    check(plain === "0 <- S <- S(-2)^3 <- S(-3)^2 <- 0", `the resolution reads ${plain}`);
    const rendered = (await chain.textContent()) ?? "";
    check(/S\(−2\)/.test(rendered) || /S\(-2\)/.test(rendered), `the typeset chain has no twist S(−2): ${rendered}`);
    await transcript(page).getByRole("button", { name: "Show the differentials" }).first().click();
    await transcript(page).getByTestId("differentials").first().waitFor();
    await shot(page, artifactsDir, "5-resolution-twists");

    await page.context().grantPermissions(["clipboard-read", "clipboard-write"], { origin: baseUrl });
    const bettiValue = transcript(page).locator('[data-value-type="BettiTable"]').last();
    await bettiValue.getByRole("button", { name: "Copy this result" }).click();
    await bettiValue.getByRole("menuitem", { name: "LaTeX" }).click();
    await bettiValue.getByRole("status").filter({ hasText: "Copied as LaTeX" }).waitFor();
    const clip = await page.evaluate(() => navigator.clipboard.readText());
    check(clip.includes("\\begin{array}{r|rrr}"), `the clipboard holds no LaTeX array: ${clip}`);
    check(clip.includes("1 &  & 3 & 2 \\\\"), `the clipboard lacks the row j−i = 1: ${clip}`);
    check(clip.includes("\\text{total} & 1 & 3 & 2 \\\\"), `the clipboard lacks the totals row: ${clip}`);
    await shot(page, artifactsDir, "6-copied-latex");
  },
);

browserTest(
  "daily: the Markdown export of chosen cells parses as Markdown with the expected structure",
  async ({ page, baseUrl, artifactsDir }) => {
    const title = `Export check ${stamp()}`;
    await openOwnSession(page, baseUrl, "lead", title);
    await run(page, ["S := Q[x, y, z]", "resolve(S / <x*y, y*z, x*z>).betti"], 1);
    // an error the checker cannot see, so the cell runs and ends in an error
    await run(page, ["I := <x^2 + y> + <y*z>", "resolve(S / I)"], 2);
    await run(page, ["{depth: 2, a: 1}"], 3);
    await page.getByRole("button", { name: "Export", exact: true }).click();
    await page
      .getByRole("dialog", { name: "Export or import" })
      .getByRole("button", { name: /Choose cells/ })
      .click();
    const dialog = page.getByRole("dialog", { name: "Export", exact: true });
    await dialog.waitFor();
    await dialog.getByLabel("Markdown").check();
    await shot(page, artifactsDir, "7-export-dialog");
    const [download] = await Promise.all([page.waitForEvent("download"), dialog.getByRole("button", { name: /^Download/ }).click()]);
    const file = await download.path();
    const { readFile } = await import("node:fs/promises");
    const md = await readFile(file!, "utf8");
    const tokens = marked.lexer(md);
    const headings = tokens.filter((t): t is Tokens.Heading => t.type === "heading").map((h) => `${h.depth}:${h.text}`);
    check(headings[0] === `1:${title}`, `the first heading is ${headings[0]}`);
    check(
      JSON.stringify(headings.filter((h) => h.startsWith("2:Cell"))) === JSON.stringify(["2:Cell 1", "2:Cell 2"]),
      `cells exported: ${JSON.stringify(headings)}`,
    );
    check(!md.includes("not homogeneous"), "the error cell was exported although error cells are left out");
    const tables = tokens.filter((t): t is Tokens.Table => t.type === "table");
    const betti = tables[0]?.rows.map((r) => r.map((c) => c.text));
    check(
      JSON.stringify(betti) ===
        JSON.stringify([
          ["0", "1", "", ""],
          ["1", "", "3", "2"],
          ["total", "1", "3", "2"],
        ]),
      `Betti table: ${JSON.stringify(betti)}`,
    );
    check(
      JSON.stringify(tables[1]?.rows.map((r) => r[0]!.text)) === JSON.stringify(["depth", "a"]),
      "the record's fields are not in the order written",
    );
    const nested: string[] = [];
    const walk = (list: Token[], inside: boolean) => {
      for (const t of list) {
        if (inside && t.type === "code") nested.push(t.raw);
        const kids = (t as { tokens?: Token[] }).tokens;
        if (kids) walk(kids, inside || t.type === "list_item");
        if (t.type === "list") walk((t as Tokens.List).items, true);
      }
    };
    walk(tokens, false);
    check(nested.length === 0, `code blocks inside list items: ${nested.join(" | ")}`);
    await shot(page, artifactsDir, "7-exported");
  },
);

browserTest("daily: a runtime error names no internal function", async ({ page, baseUrl, artifactsDir }) => {
  await openOwnSession(page, baseUrl, "lead", `Error words ${stamp()}`);
  // not an ideal literal, so only the engine finds that it is not homogeneous
  await run(page, ["S := Q[x, y, z]", "I := <x^2 + y> + <y*z>", "resolve(S / I)"], 1);
  const error = articles(page).last().getByRole("group", { name: "Error" });
  await error.waitFor();
  const text = (await error.textContent()) ?? "";
  check(!/resolveQuotient|[a-z]+[A-Z][A-Za-z]+: /.test(text), `the error shows an internal name: ${text}`);
  check(/homogeneous/.test(text) && /homogenize/.test(text), `the error does not say what to change: ${text}`);
  await shot(page, artifactsDir, "8-runtime-error");
  // what the checker can see is held before running
  await typeInput(page, ["T := Q[a, b]", "resolve(T / <a^2 + b>)"]);
  await page.keyboard.press("Enter");
  const held = page.getByTestId("input-held");
  await held.waitFor();
  check(/homogeneous/.test((await held.textContent()) ?? ""), "the held input does not say why");
  check((await articles(page).count()) === 1, "Enter ran an input with a diagnostic");
  await shot(page, artifactsDir, "8-held-before-running");
  // the deliberate shortcut runs it anyway (the server's checker then answers)
  await input(page).click();
  await page.keyboard.press("Control+Shift+Enter");
  await finished(page, 2);
  await shot(page, artifactsDir, "8-run-anyway");
});

browserTest("daily: history search by typing inserts the highlighted match", async ({ page, baseUrl, artifactsDir }) => {
  const mark = `hx${stamp()}`;
  const group = await ensureTestGroup();
  // an input from another of the lead's sessions
  const [other] = await db()
    .insert(sessions)
    .values({ title: `History elsewhere ${mark}`, ownerId: group.users.lead.id })
    .returning({ id: sessions.id });
  await db()
    .insert(cells)
    .values({
      sessionId: other!.id,
      position: 0,
      source: `${mark}_far := 11`,
      status: "done",
      result: { statements: [], currentRing: null },
      createdBy: group.users.lead.id,
    });
  await openOwnSession(page, baseUrl, "lead", `History here ${mark}`);
  await run(page, [`${mark}_near := 7`], 1);
  await page.keyboard.press("Alt+r");
  const dialog = page.getByRole("dialog", { name: "Input history" });
  await dialog.waitFor();
  await page.keyboard.type(`${mark}_far`);
  await dialog.getByRole("option", { name: new RegExp(`${mark}_far`) }).waitFor();
  await shot(page, artifactsDir, "9-history-search");
  await page.keyboard.press("Enter");
  await dialog.waitFor({ state: "hidden" });
  const text = await input(page).textContent();
  check(text?.includes(`${mark}_far := 11`), `Enter did not insert the match: ${text}`);
  await shot(page, artifactsDir, "9-history-inserted");
});

browserTest("daily: 390 px read-only view has no horizontal scroll; 1024 px works fully", async ({ page, baseUrl, artifactsDir }) => {
  const group = await ensureTestGroup();
  const token = `ro${stamp()}`.padEnd(43, "r");
  const [s] = await db()
    .insert(sessions)
    .values({ title: `Narrow reading ${stamp()}`, ownerId: group.users.lead.id, shareToken: token })
    .returning({ id: sessions.id });
  await db()
    .insert(cells)
    .values({
      sessionId: s!.id,
      position: 0,
      source: "S := Q[x, y, z]\nresolve(S / <x*y, y*z, x*z>).betti",
      status: "done",
      result: {
        statements: [
          {
            statement: 1,
            span: null,
            value: {
              type: "BettiTable",
              text: "Betti numbers",
              entries: [
                [0, 0, 1],
                [1, 2, 3],
                [2, 3, 2],
              ],
              complete: true,
            },
          },
        ],
        currentRing: "S",
      },
      createdBy: group.users.lead.id,
    });
  await page.context().clearCookies();
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(`${baseUrl}/?session=${s!.id}&link=${token}`);
  await transcript(page).locator("article").first().waitFor();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  await shot(page, artifactsDir, "10-390px");
  check(overflow <= 0, `the page scrolls sideways by ${overflow} px at 390 px`);
  await page.setViewportSize({ width: 1024, height: 768 });
  await openOwnSession(page, baseUrl, "lead", `Wide working ${stamp()}`);
  await input(page).waitFor();
  await run(page, ["S := Q[x, y, z]", "resolve(S / <x*y, y*z, x*z>)"], 1);
  const wide = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  check(wide <= 0, `the console scrolls sideways by ${wide} px at 1024 px`);
  await shot(page, artifactsDir, "10-1024px");
  await page.setViewportSize({ width: 1280, height: 800 });
});

browserTest(
  "daily: the guided steps run in the reader's own new session, never in someone else's",
  async ({ page, baseUrl, artifactsDir }) => {
    const title = `Lead's tide tables ${stamp()}`;
    const id = await openOwnSession(page, baseUrl, "lead", title, true);
    await run(page, ["n := 6 * 7"], 1);
    // a guest of the team reads the lead's session and opens the guided steps from it
    await signIn(page, baseUrl, "guest", `/?session=${id}`);
    await page.getByTestId("session-title").filter({ hasText: title }).waitFor();
    await page.keyboard.press("Alt+g");
    const tour = page.getByRole("dialog", { name: "Guided first steps" });
    await tour.waitFor();
    await tour
      .getByRole("button", { name: /^Insert example:/ })
      .first()
      .click();
    await page.getByTestId("session-title").filter({ hasText: "Guided first steps" }).waitFor();
    await input(page).waitFor();
    await page.waitForFunction(() => (document.querySelector('[aria-label="Ringside input"]')?.textContent ?? "").trim() !== "");
    const now = new URL(page.url()).searchParams.get("session");
    check(now && now !== id, "the guided steps stayed in the lead's session");
    const [landed] = await db().select().from(sessions).where(eq(sessions.id, now!));
    const group = await ensureTestGroup();
    check(landed?.ownerId === group.users.guest.id, "the guided steps' session is not the reader's own");
    await page.keyboard.press("Escape");
    await input(page).click();
    await page.keyboard.press("Enter");
    await finished(page, 1);
    const leadCells = await db().select().from(cells).where(eq(cells.sessionId, id));
    check(leadCells.length === 1, "a cell of the guided steps reached the lead's session");
    await shot(page, artifactsDir, "11-tour-own-session");
  },
);
