/// The experiments room in the browser (issue 15's evidence), against the production build,
/// the real database and a real member worker (`npm run worker`, started here): a sweep cell
/// becomes an experiment whose rows arrive while the page watches; sorting and filtering;
/// a row opens to its typeset member; the heat map appears (screenshot) and its SVG and PNG
/// downloads are valid; the CSV download's rows equal the API's; a finish notice elsewhere;
/// an upload with a bad line names the line and creates nothing; a team guest sees no
/// controls and the API refuses their cancel; a read-only link opens the room signed out;
/// no horizontal overflow at 1024 px. Screenshots in tests/artifacts/experiments-*.png.
import { readFile } from "node:fs/promises";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import type { Page } from "playwright-core";
import { db } from "@/db/client";
import { experiments, sessions, uploads } from "@/db/schema";
import { browserTest, check } from "../helpers/browser";
import { signIn } from "../helpers/browser-sign-in";
import { ensureTestGroup } from "../helpers/fixtures";
import { startWorker, stopGently, type Proc } from "../experiments/helpers";

const shot = (page: Page, dir: string, name: string) => page.screenshot({ path: path.join(dir, name), fullPage: true });

// One worker for the whole file, started as the file loads so it is warm by the first
// experiment; stopped by the last test (and, failing that, when the runner exits).
let worker: Proc | null = startWorker("browser-room", 1);
process.once("exit", () => worker?.child.kill("SIGKILL"));

/// A sweep whose members take a noticeable fraction of a second each, so the page sees the
/// table partly filled: generic quadrics in five variables (each a complete intersection of
/// four quadrics: Betti numbers 1, 4, 6, 4, 1 — the Koszul complex; Eisenbud, "Commutative
/// Algebra", 1995, §17.2, from memory). `background = true` keeps the console from running
/// it inline first (the cell says that background sweeps are started by the server), so the
/// cell's "Run as an experiment" is the only run.
const SWEEP =
  "S := GF(32003)[x, y, z, w, v]\nsweep(random_ideals(S, count = 40, gens = 4, degree = 2, seed = 21), I -> {pd: (S / I).pd, reg: (S / I).reg, codim: I.codim, betti: resolve(S / I).betti}, background = true)";
const COUNT = 40;
/// nonzero graded Betti numbers of each member (1, 4, 6, 4, 1)
const BETTI_POSITIONS = 5;

async function api<T>(page: Page, url: string, init?: { method?: string; body?: unknown }): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ url, init }) => {
      const r = await fetch(url, {
        method: init?.method ?? "GET",
        headers: init?.body ? { "content-type": "application/json" } : {},
        body: init?.body ? JSON.stringify(init.body) : undefined,
      });
      const text = await r.text();
      let body: unknown = text;
      try {
        body = JSON.parse(text);
      } catch {
        // CSV or LaTeX: kept as text
      }
      return { status: r.status, body: body as T };
    },
    { url, init },
  );
}

async function newSession(page: Page, title: string): Promise<string> {
  const r = await api<{ id: string }>(page, "/api/sessions", { method: "POST", body: { title } });
  check(r.status === 201, `creating a session answered ${r.status}`);
  return r.body.id;
}

const doneText = async (page: Page) => (await page.getByTestId("progress-done").textContent()) ?? "";

/// "12/40" → 12.
const doneOf = (t: string) => Number(t.split("/")[0]);

/// The CSV the server wrote, as rows of fields (RFC 4180: quoted fields may hold commas).
function parseCsv(text: string): string[][] {
  const out: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(field);
      field = "";
    } else if (ch === "\r" && text[i + 1] === "\n") {
      row.push(field);
      out.push(row);
      row = [];
      field = "";
      i++;
    } else field += ch;
  }
  if (field !== "" || row.length) {
    row.push(field);
    out.push(row);
  }
  return out;
}

interface ApiRow {
  index: number;
  status: string;
  fields: Record<string, { text: string }>;
}

let roomId = "";

browserTest(
  "experiments room: a sweep cell becomes an experiment; rows arrive while the page watches; a notice elsewhere when it finishes",
  async ({ page, baseUrl, artifactsDir }) => {
    await signIn(page, baseUrl, "member");
    const sessionId = await newSession(page, `Kestrel sweep ${Date.now().toString(36)}`);
    await page.goto(`${baseUrl}/?session=${sessionId}`);
    const input = page.getByLabel("Ringside input");
    await input.click();
    const lines = SWEEP.split("\n");
    for (let k = 0; k < lines.length; k++) {
      if (k > 0) await page.keyboard.press("Shift+Enter");
      await page.keyboard.type(lines[k]);
    }
    await page.keyboard.press("Escape");
    await page.keyboard.press("Enter");
    // the inline run finishes; the stored cell offers to run its sweep as an experiment
    const runAsExperiment = page.getByRole("button", { name: "Run as an experiment" });
    await runAsExperiment.waitFor({ timeout: 40_000 });
    await runAsExperiment.click();
    await page.waitForURL(/\/experiments\/[0-9a-f-]{36}$/);
    roomId = page.url().split("/experiments/")[1]!;
    await page.getByTestId("experiment-title").waitFor();

    // rows arrive while the page watches: some reading shows the table partly filled
    const tableRows = page.locator("[data-testid=experiment-table] tbody tr[data-row-index]");
    const seen: string[] = [];
    const until = Date.now() + 45_000;
    for (;;) {
      const d = doneOf(await doneText(page));
      const shown = await tableRows.count();
      seen.push(`${d}/${shown}`);
      if (shown > 0 && shown < COUNT) break;
      check(shown < COUNT, `the table was full before the page saw it partly filled (done/shown readings: ${seen.join(", ")})`);
      check(Date.now() < until, `no row arrived within 45 s (done/shown readings: ${seen.join(", ")})`);
      await page.waitForTimeout(150);
    }
    await shot(page, artifactsDir, "experiments-1-rows-arriving.png");

    // elsewhere in the app when it finishes: the list page announces it
    await page.getByRole("link", { name: "All experiments" }).click();
    await page.getByRole("heading", { name: "Experiments", exact: true }).waitFor();
    const notice = page.getByTestId("finish-notices");
    await notice.getByText("finished").waitFor({ timeout: 45_000 });
    await shot(page, artifactsDir, "experiments-2-finish-notice.png");
    await notice.getByRole("link", { name: "Open it" }).click();
    await page.waitForURL(`**/experiments/${roomId}`);
    await page
      .getByTestId("progress-done")
      .filter({ hasText: `${COUNT}/${COUNT}` })
      .waitFor();
    await page.getByTestId("experiment-status").filter({ hasText: "done" }).waitFor();
    await page
      .locator("[data-testid=experiment-table] tbody tr[data-row-index]")
      .nth(COUNT - 1)
      .waitFor();
  },
);

browserTest(
  "experiments room: sort, filter, expand with the keyboard, plots, SVG/PNG/CSV/Markdown downloads",
  async ({ page, baseUrl, artifactsDir }) => {
    check(roomId !== "", "the previous test made no experiment");
    await signIn(page, baseUrl, "member");
    await page.goto(`${baseUrl}/experiments/${roomId}`);
    await page
      .locator("[data-testid=experiment-table] tbody tr[data-row-index]")
      .nth(COUNT - 1)
      .waitFor();

    // sort: index descending puts the last member first; seconds ascending is ordered
    const indexHeader = page.getByRole("button", { name: "Sort by index" });
    await indexHeader.click();
    await page.waitForFunction(
      () => document.querySelector("[data-testid=experiment-table] tbody tr[data-row-index]")?.getAttribute("data-row-index") === "39",
    );
    await page.getByRole("button", { name: "Sort by seconds" }).click();
    const secondsCol = await page.evaluate(() => {
      const head = [...document.querySelectorAll("[data-testid=experiment-table] thead tr:first-child th")].map(
        (th) => th.textContent ?? "",
      );
      const k = head.findIndex((h) => h.startsWith("seconds"));
      return [...document.querySelectorAll("[data-testid=experiment-table] tbody tr[data-row-index]")].map((tr) =>
        Number(tr.children[k]?.textContent),
      );
    });
    check(secondsCol.length === COUNT, `sorted by seconds, ${secondsCol.length} rows are shown`);
    check(
      secondsCol.every((s, k) => k === 0 || secondsCol[k - 1] <= s),
      `seconds are not ascending: ${secondsCol.join(", ")}`,
    );

    // filter: codim = 3 keeps exactly the rows the API's where=codim:eq:3 keeps
    const apiFiltered = await api<{ matched: number }>(page, `/api/experiments/${roomId}/rows?where=codim:eq:3&limit=1`);
    await page.getByLabel("Filter codim").fill("3");
    await page
      .getByTestId("rows-matched")
      .filter({ hasText: `${apiFiltered.body.matched} of ${COUNT} rows` })
      .waitFor();
    await page.getByLabel("Filter codim").fill("!= 3");
    await page
      .getByTestId("rows-matched")
      .filter({ hasText: `${COUNT - apiFiltered.body.matched} of ${COUNT} rows` })
      .waitFor();
    await page.getByLabel("Filter codim").fill("");
    await page.getByLabel("Filter index").fill("< 10");
    await page
      .getByTestId("rows-matched")
      .filter({ hasText: `10 of ${COUNT} rows` })
      .waitFor();
    const shownIndexes = await page
      .locator("[data-testid=experiment-table] tbody tr[data-row-index]")
      .evaluateAll((trs) => trs.map((tr) => Number(tr.getAttribute("data-row-index"))));
    check(shownIndexes.length === 10 && shownIndexes.every((k) => k < 10), `index < 10 shows ${shownIndexes.join(", ")}`);
    await page.getByLabel("Filter index").fill("");
    await page
      .getByTestId("rows-matched")
      .filter({ hasText: `${COUNT} of ${COUNT} rows` })
      .waitFor();

    // a row opens with the keyboard: its member typeset by KaTeX and its full result
    await page.getByRole("button", { name: "Open member 0", exact: true }).focus();
    await page.keyboard.press("Enter");
    const detail = page.getByTestId("member-detail");
    await detail.locator(".katex").first().waitFor();
    check((await detail.getByText("betti", { exact: true }).count()) === 1, "the expanded row does not list the probe's betti field");
    await page.getByRole("button", { name: "Close member 0" }).click();

    // the plots tab, reached with the arrow keys; the heat map of graded Betti numbers
    await page.getByRole("tab", { name: "Table" }).focus();
    await page.keyboard.press("ArrowRight");
    await page.getByRole("tab", { name: "Plots", selected: true }).waitFor();
    await page.getByRole("button", { name: "Heat map of graded Betti numbers" }).click();
    const plot = page.locator("[data-testid=plot] > svg");
    await plot.waitFor();
    check(
      (await plot.locator("rect[data-value]").count()) === COUNT * BETTI_POSITIONS,
      "the heat map does not hold one cell per member and Betti position (1, 4, 6, 4, 1)",
    );
    await shot(page, artifactsDir, "experiments-3-heat-map.png");
    // the plot follows the theme: Alt+T switches to dark, and the plot's own colours change
    const lightBackground = await plot.locator("rect").first().getAttribute("fill");
    await page.keyboard.press("Alt+t");
    await page.waitForFunction(() => document.documentElement.classList.contains("dark"));
    await page.waitForFunction(
      (before) => document.querySelector("[data-testid=plot] svg rect")?.getAttribute("fill") !== before,
      lightBackground,
    );
    await shot(page, artifactsDir, "experiments-3-heat-map-dark.png");
    await page.keyboard.press("Alt+t");
    await page.waitForFunction(() => !document.documentElement.classList.contains("dark"));
    await page.getByRole("button", { name: "Scatter of two columns" }).click();
    await plot.locator("circle").first().waitFor();
    await page.getByRole("button", { name: "Histogram of a column" }).click();
    await plot.locator("rect[data-count]").first().waitFor();
    await shot(page, artifactsDir, "experiments-4-histogram.png");

    const [svgDownload] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download SVG" }).click()]);
    const svgText = await readFile((await svgDownload.path())!, "utf8");
    const parsed = await page.evaluate((text) => {
      const doc = new DOMParser().parseFromString(text, "image/svg+xml");
      return {
        error: doc.getElementsByTagName("parsererror").length,
        root: doc.documentElement.nodeName,
        ns: doc.documentElement.namespaceURI,
        bars: doc.querySelectorAll("rect[data-count]").length,
      };
    }, svgText);
    check(
      parsed.error === 0 && parsed.root === "svg" && parsed.ns === "http://www.w3.org/2000/svg",
      `the SVG download does not parse as SVG: ${JSON.stringify(parsed)}`,
    );
    check(parsed.bars > 0, "the SVG download holds no bars of the histogram");
    const [pngDownload] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download PNG" }).click()]);
    const png = await readFile((await pngDownload.path())!);
    check(png.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])), "the PNG download is not a PNG");

    // the CSV download's rows equal the API's rows
    await page.getByText("Export", { exact: true }).click();
    const [csvDownload] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Table as CSV" }).click()]);
    const csv = parseCsv(await readFile((await csvDownload.path())!, "utf8"));
    const apiRows = (await api<{ rows: ApiRow[] }>(page, `/api/experiments/${roomId}/rows?limit=1000`)).body.rows;
    const header = csv[0]!;
    check(header.join(",") === "index,label,status,seconds,pd,reg,codim,betti,message,worker", `CSV header ${header.join(",")}`);
    check(csv.length - 1 === apiRows.length && apiRows.length === COUNT, `CSV has ${csv.length - 1} rows, the API ${apiRows.length}`);
    for (const r of apiRows) {
      const line = csv[r.index + 1]!;
      const expected = [String(r.index), r.status, r.fields.pd.text, r.fields.reg.text, r.fields.codim.text, r.fields.betti.text];
      const got = [line[0], line[2], line[4], line[5], line[6], line[7]];
      check(
        JSON.stringify(got) === JSON.stringify(expected),
        `CSV row ${r.index} is ${JSON.stringify(got)}, the API's ${JSON.stringify(expected)}`,
      );
    }
    const [mdDownload] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("button", { name: "Table as Markdown" }).click(),
    ]);
    const md = await readFile((await mdDownload.path())!, "utf8");
    check(
      md.includes("seed = 21") && md.split("\n").filter((l) => l.startsWith("| ")).length === COUNT + 2,
      "the Markdown export lacks the seed or rows",
    );
  },
);

browserTest(
  "experiments room: an upload with a bad line shows its number and creates nothing; a good file is previewed typeset",
  async ({ page, baseUrl, artifactsDir }) => {
    await signIn(page, baseUrl, "member");
    await newSession(page, `Kestrel uploads ${Date.now().toString(36)}`);
    const count = async () => {
      const [u] = await db()
        .select({ n: sql<number>`count(*)::int` })
        .from(uploads);
      const [e] = await db()
        .select({ n: sql<number>`count(*)::int` })
        .from(experiments);
      return `${u!.n} uploads, ${e!.n} experiments`;
    };
    const before = await count();
    await page.goto(`${baseUrl}/experiments`);
    await page.getByRole("heading", { name: "Sweep a family file" }).waitFor();
    await page.getByLabel("Family file", { exact: true }).setInputFiles({
      name: "shoreline.txt",
      mimeType: "text/plain",
      buffer: Buffer.from("# Kestrel Lake shoreline ideals\n<x^2, y>\n<x*y +* z>\n<z^3>\n"),
    });
    const problems = page.getByTestId("upload-problems");
    await problems.waitFor();
    check((await problems.locator("li[data-line='3']").count()) === 1, `the bad line 3 is not listed: ${await problems.textContent()}`);
    check((await problems.textContent())?.includes("line 3:") === true, "the problem does not say 'line 3'");
    check(
      (await page.getByRole("button", { name: "Create the experiment" }).count()) === 0,
      "a file with a bad line can still be made an experiment",
    );
    await shot(page, artifactsDir, "experiments-5-upload-bad-line.png");
    check((await count()) === before, `a refused upload stored something: ${before} before, ${await count()} after`);

    // a good file dropped on the drop zone: its members typeset, and still nothing stored
    await page.evaluate(() => {
      const dt = new DataTransfer();
      dt.items.add(new File(["<x^2, y^2>\n<x*y, z^2>\n\n<x, y, z>\n"], "shoreline-good.txt", { type: "text/plain" }));
      document
        .querySelector("[data-testid=drop-zone]")!
        .dispatchEvent(new DragEvent("drop", { dataTransfer: dt, bubbles: true, cancelable: true }));
    });
    const preview = page.getByTestId("upload-preview");
    await preview.getByText("3 members read").waitFor();
    check((await preview.locator(".katex").count()) >= 3, "the previewed members are not typeset");
    check((await count()) === before, "a preview stored something");
    await shot(page, artifactsDir, "experiments-6-upload-preview.png");
  },
);

let viewerRoom = "";
let viewerSession = "";

browserTest(
  "experiments room: a team guest sees the running experiment but no controls, and the API answers 403 to their cancel",
  async ({ page, baseUrl, artifactsDir }) => {
    const group = await ensureTestGroup();
    await signIn(page, baseUrl, "member");
    viewerSession = await newSession(page, `Kestrel shared ${Date.now().toString(36)}`);
    await db().update(sessions).set({ teamId: group.teamId, visibility: "team" }).where(eq(sessions.id, viewerSession));
    const created = await api<{ experiment: { id: string } }>(page, "/api/experiments", {
      method: "POST",
      body: {
        sessionId: viewerSession,
        source: "S := GF(32003)[x, y, z, w]\nsweep(random_ideals(S, count = 1500, gens = 3, degree = 2, seed = 5), I -> {pd: (S / I).pd})",
      },
    });
    check(created.status === 201, `creating the experiment answered ${created.status}`);
    viewerRoom = created.body.experiment.id;
    // the owner is offered the controls (so their absence below means something)
    await page.goto(`${baseUrl}/experiments/${viewerRoom}`);
    await page.getByRole("button", { name: "Cancel", exact: true }).waitFor();
    await page.getByRole("button", { name: "Pause", exact: true }).waitFor();

    await signIn(page, baseUrl, "guest");
    await page.goto(`${baseUrl}/experiments/${viewerRoom}`);
    await page.getByTestId("read-only-badge").waitFor();
    await page.getByRole("tab", { name: "Table" }).waitFor();
    for (const name of ["Cancel", "Pause", "Resume", "Run again", "Share"]) {
      check((await page.getByRole("button", { name, exact: true }).count()) === 0, `a guest is shown ${name}`);
    }
    check((await page.getByText("Sweep a family file").count()) === 0, "a guest's room offers an upload");
    const status = await page.getByTestId("experiment-status").textContent();
    check(status === "running" || status === "queued", `the experiment is ${status}, so the missing Cancel button proves nothing`);
    const refused = await api(page, `/api/experiments/${viewerRoom}/cancel`, { method: "POST" });
    check(refused.status === 403, `a guest's cancel was answered ${refused.status}, not 403`);
    await shot(page, artifactsDir, "experiments-7-guest-read-only.png");
  },
);

browserTest(
  "experiments room: a read-only link opens the experiment signed out; 1024 px does not overflow",
  async ({ page, baseUrl, artifactsDir }) => {
    check(viewerRoom !== "", "the previous test made no experiment");
    await signIn(page, baseUrl, "member");
    const published = await api(page, `/api/sessions/${viewerSession}/link`, { method: "POST", body: {} });
    check(published.status < 300, `publishing the link answered ${published.status}`);
    // the owner stops the long experiment (the worker is then free)
    const cancelled = await api(page, `/api/experiments/${viewerRoom}/cancel`, { method: "POST" });
    check(cancelled.status === 200, `the owner's cancel answered ${cancelled.status}`);
    const [s] = await db().select({ token: sessions.shareToken }).from(sessions).where(eq(sessions.id, viewerSession));
    const token = s!.token!;

    await page.context().clearCookies();
    await page.goto(`${baseUrl}/experiments/${viewerRoom}?link=${encodeURIComponent(token)}`);
    check(!page.url().includes("/sign-in"), `the link visit was sent to ${page.url()}`);
    await page.getByTestId("read-only-badge").filter({ hasText: "read-only shared link" }).waitFor();
    await page.getByTestId("experiment-status").filter({ hasText: "cancelled" }).waitFor();
    await page.getByTestId("experiment-table").waitFor();
    check((await page.getByRole("button", { name: "Cancel", exact: true }).count()) === 0, "a link visitor is shown Cancel");
    check((await page.getByRole("button", { name: "Run again", exact: true }).count()) === 0, "a link visitor is shown Run again");
    // 1500 members: more than the browser reads whole, so the database sorts and pages
    await page.getByTestId("rows-matched").filter({ hasText: "sorted and filtered by the database" }).waitFor();
    await page.getByRole("button", { name: "Sort by index" }).click();
    await page.waitForFunction(
      () => document.querySelector("[data-testid=experiment-table] tbody tr[data-row-index]")?.getAttribute("data-row-index") === "1499",
    );
    await page.getByRole("navigation", { name: "Pages of rows" }).getByText("page 1 of 30").waitFor();
    await shot(page, artifactsDir, "experiments-8-link-visitor.png");
    // without the token the room is not readable signed out
    await page.goto(`${baseUrl}/experiments/${viewerRoom}`);
    await page.waitForURL(/\/sign-in/);

    // the first room at a 1024 px wide window, both tabs: nothing wider than the window
    await signIn(page, baseUrl, "member");
    await page.setViewportSize({ width: 1024, height: 768 });
    try {
      for (const view of ["table", "plots"]) {
        await page.goto(`${baseUrl}/experiments/${roomId || viewerRoom}?view=${view}`);
        await page
          .locator(view === "table" ? "[data-testid=experiment-table] tbody tr[data-row-index]" : "[data-testid=plot] svg")
          .first()
          .waitFor();
        const wide = await page.evaluate(() => document.documentElement.scrollWidth);
        check(wide <= 1024, `the ${view} view is ${wide} px wide at a 1024 px window`);
        await shot(page, artifactsDir, `experiments-9-1024-${view}.png`);
      }
      await page.goto(`${baseUrl}/experiments`);
      await page.getByRole("heading", { name: "Sweep a family file" }).waitFor();
      const wide = await page.evaluate(() => document.documentElement.scrollWidth);
      check(wide <= 1024, `the list is ${wide} px wide at a 1024 px window`);
    } finally {
      await page.setViewportSize({ width: 1280, height: 800 });
    }
  },
);

browserTest(
  "experiments room: the guided tour's last step runs a small sweep as an experiment and shows its heat map",
  async ({ page, baseUrl, artifactsDir }) => {
    await signIn(page, baseUrl, "member");
    const sessionId = await newSession(page, `Kestrel tour ${Date.now().toString(36)}`);
    await page.goto(`${baseUrl}/?session=${sessionId}`);
    await page.getByLabel("Ringside input").waitFor();
    await page.keyboard.press("Alt+g");
    await page.getByRole("button", { name: "Run the sweep as an experiment and show its plot" }).click();
    await page.waitForURL(/\/experiments\/[0-9a-f-]{36}\?view=plots&plot=heat$/);
    await page.getByRole("tab", { name: "Plots", selected: true }).waitFor();
    // 18 members (quadratic monomial ideals in four variables up to symmetry), all of them
    await page.getByTestId("progress-done").filter({ hasText: "18/18" }).waitFor({ timeout: 40_000 });
    const cells = page.locator("[data-testid=plot] svg rect[data-value]");
    await page.waitForFunction(() => document.querySelectorAll("[data-testid=plot] svg rect[data-value]").length > 0);
    // <a^2, b^2> (member 3) is a complete intersection of two quadrics: β(2,4) = 1 (Koszul)
    try {
      check((await cells.count()) % 18 === 0, `the heat map has ${await cells.count()} cells, not a multiple of 18 members`);
      const titles = await page.locator("[data-testid=plot] svg rect title").allTextContents();
      check(titles.includes("member 3: β2,4 = 1"), "the heat map does not show β(2,4) = 1 for <a^2, b^2>");
      check(titles.includes("member 2: β2,3 = 1"), "the heat map does not show β(2,3) = 1 for <a^2, a*b>");
      await shot(page, artifactsDir, "experiments-10-tour-heat-map.png");
    } finally {
      // the last test of the file stops the worker it started
      if (worker) await stopGently(worker);
      worker = null;
    }
  },
);
