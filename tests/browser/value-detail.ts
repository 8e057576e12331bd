/// A value stored as a summary (issue 13, item 1) shows its size with controls that load the
/// whole value into the cell and download it as JSON; a detail the server no longer has
/// says so in words. The summaries and their files are planted as the cell job writes them
/// (tests/api/value-details.test.ts explains why), the rest is the real console and server.
import { randomUUID } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { db } from "@/db/client";
import { cells } from "@/db/schema";
import { formatBytes } from "@/app/_console/render/detail";
import { browserTest, check } from "../helpers/browser";
import { signIn } from "../helpers/browser-sign-in";
import { testEnv } from "../helpers/env";
import { ensureTestGroup } from "../helpers/fixtures";

const RING = { type: "Ring", text: "Q[a, b]", field: "Q", vars: ["a", "b"], degrees: [1, 1], order: "grevlex", ideal: [] };
/// The Koszul complex of (a, b): 0 ← S ← S(−1)² ← S(−2) ← 0 (common practice).
const WHOLE = {
  type: "Complex",
  text: "complex of ranks 1, 2, 1",
  ranks: [1, 2, 1],
  betti: [
    [0, 0, 1],
    [1, 1, 2],
    [2, 2, 1],
  ],
  complete: true,
  maps: [
    { type: "Matrix", text: "[a, b]", rows: [["a", "b"]], cols: 2, ring: RING },
    { type: "Matrix", text: "[-b; a]", rows: [["-b"], ["a"]], cols: 1, ring: RING },
  ],
  ring: RING,
};

function plant(whole: unknown, keepFile: boolean) {
  const dir = testEnv("RINGSIDE_DETAIL_DIR");
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const id = randomUUID();
  const json = JSON.stringify(whole);
  if (keepFile) {
    const file = path.join(dir, `${id}.json`);
    writeFileSync(file, json, { mode: 0o600 });
  }
  const why = "it is kept as a summary, its detail on request";
  const summary = { ...WHOLE, text: `${WHOLE.text} (${why})`, maps: null, note: why, detail: { id, bytes: json.length, type: "Complex" } };
  return { id, json, summary };
}

browserTest("a summarised value loads and downloads its whole detail on request", async ({ page, baseUrl, artifactsDir }) => {
  const group = await ensureTestGroup();
  await signIn(page, baseUrl, "member");
  const created = await page.evaluate(async () => {
    const r = await fetch("/api/sessions", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: '{"title":"Large values"}',
    });
    return (await r.json()) as { id: string };
  });
  const kept = plant(WHOLE, true);
  const lost = plant(WHOLE, false);
  for (const [position, p] of [kept, lost].entries()) {
    await db()
      .insert(cells)
      .values({
        sessionId: created.id,
        position,
        source: `C${position} := resolve(S / <a, b>)`,
        status: "done",
        result: { statements: [{ index: 0, span: null, value: p.summary }], currentRing: null },
        createdBy: group.users.member.id,
        durationMs: 4,
        finishedAt: new Date(),
      });
  }

  await page.goto(`${baseUrl}/?session=${created.id}`);
  const transcript = page.getByRole("region", { name: "Transcript" });
  const first = transcript.locator("article").nth(0);
  const control = first.getByTestId("value-detail");
  await control.waitFor();
  const size = formatBytes(kept.json.length);
  const said = await control.getByTestId("value-detail-size").textContent();
  check(said?.includes(`the full Complex takes ${size}`), `the control says: ${said}`);
  check((await first.getByText("Show the differentials").count()) === 0, "the summary has no differentials to show");

  // Load: the whole value is drawn in the cell, differentials included.
  await control.getByRole("button", { name: `Load the full value (${size})` }).click();
  const whole = control.getByTestId("value-detail-whole");
  await whole.waitFor();
  await whole.getByRole("button", { name: "Show the differentials" }).click();
  await whole.getByTestId("differentials").waitFor();
  const maps = await whole.getByTestId("differentials").locator("li").count();
  check(maps === 2, `expected the 2 differentials of the whole value, saw ${maps}`);
  await page.screenshot({ path: path.join(artifactsDir, "value-detail.png"), fullPage: true });

  // Download: the file holds exactly the stored detail.
  const [download] = await Promise.all([page.waitForEvent("download"), control.getByRole("button", { name: "Download as JSON" }).click()]);
  check(download.suggestedFilename() === `ringside-complex-${kept.id.slice(0, 8)}.json`, `downloaded as ${download.suggestedFilename()}`);
  const saved = await download.path();
  check(saved !== null && readFileSync(saved, "utf8") === kept.json, "the downloaded file is not the stored detail");

  // A detail the server no longer has: a readable refusal, for loading and for downloading.
  const second = transcript.locator("article").nth(1);
  await second.getByRole("button", { name: /Load the full value/ }).click();
  const problem = second.getByTestId("value-detail-problem");
  await problem.waitFor();
  const text = (await problem.textContent()) ?? "";
  check(/not stored on this server/.test(text), `the refusal reads: ${text}`);
});
