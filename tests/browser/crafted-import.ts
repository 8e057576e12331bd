/// An imported session whose values the import schema accepts but the console cannot draw
/// (issue 13, item 7): each such value shows an error in its own cell, and the other cells,
/// typeset by KaTeX under the Content-Security-Policy, render as usual.
import path from "node:path";
import { browserTest, check } from "../helpers/browser";
import { ensureTestGroup } from "../helpers/fixtures";
import { signIn } from "../helpers/browser-sign-in";

const cell = (position: number, source: string, value: Record<string, unknown>) => ({
  position,
  source,
  status: "done",
  results: [{ statement: 0, span: null, value }],
  error: null,
  currentRing: null,
  durationMs: 3,
  engineVersion: null,
});

// `vars` and `items` must be lists; the outer shape ("type", "text") is all an import checks.
const CRAFTED = {
  format: "ringside.session",
  version: 1,
  exportedAt: "2026-01-01T00:00:00.000Z",
  session: { title: "Crafted import", ownerName: "Someone" },
  cells: [
    cell(0, "f = x^2 + y^2", { type: "Poly", text: "x^2 + y^2" }),
    cell(1, "R = crafted", { type: "Ring", text: "R", vars: 42 }),
    cell(2, "L = crafted", { type: "List", text: "[…]", items: { not: "a list" } }),
    cell(3, "g = x*y", { type: "Poly", text: "x*y" }),
  ],
  objects: [],
};

browserTest("a crafted import renders: bad values fail in their own cells only", async ({ page, baseUrl, artifactsDir }) => {
  await ensureTestGroup();
  const pageErrors: string[] = [];
  page.on("pageerror", (e) => pageErrors.push(e.message));
  // A blocked script, style or font shows up as a console error naming the policy.
  page.on("console", (m) => {
    if (m.type() === "error" && /Content Security Policy/i.test(m.text())) pageErrors.push(m.text());
  });
  await signIn(page, baseUrl, "member");
  const answer = await page.evaluate(async (doc) => {
    const r = await fetch("/api/sessions/import", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(doc),
    });
    return { status: r.status, body: (await r.json()) as { session?: { id: string } } };
  }, CRAFTED);
  check(answer.status === 201 && Boolean(answer.body.session?.id), `the import answered ${answer.status}`);

  await page.goto(`${baseUrl}/?session=${answer.body.session!.id}`);
  const transcript = page.getByRole("region", { name: "Transcript" });
  await transcript.waitFor();
  await transcript.getByTestId("cell-render-error").nth(1).waitFor({ timeout: 20_000 });
  await page.screenshot({ path: path.join(artifactsDir, "crafted-import.png"), fullPage: true });

  const errors = await transcript.getByTestId("cell-render-error").allTextContents();
  check(errors.length === 2, `expected 2 cells with a drawing error, saw ${errors.length}`);
  check(errors[0]!.includes("R = crafted") && errors[0]!.includes("cannot draw"), `the first error cell reads: ${errors[0]}`);
  check(errors[1]!.includes("L = crafted"), `the second error cell reads: ${errors[1]}`);
  const articles = await transcript.locator("article").count();
  check(articles === 4, `expected 4 cells in the transcript, saw ${articles}`);
  // the good cells are typeset by KaTeX (inline styles allowed by the CSP)
  const katex = await transcript.locator(".katex").count();
  check(katex >= 2, `expected the two polynomials typeset by KaTeX, found ${katex} .katex elements`);
  // the editor (CodeMirror) still works on the same page
  await page.getByLabel("Ringside input").click();
  await page.keyboard.type("1 + 1");
  const typed = await page.getByLabel("Ringside input").textContent();
  check((typed ?? "").includes("1 + 1"), "the input editor did not take the typed text");
  const csp = pageErrors.filter((m) => /Content Security Policy/i.test(m));
  check(csp.length === 0, `the Content-Security-Policy blocked something: ${csp.join("; ")}`);
});
