/// Export: the LaTeX of a Betti table is a `tabular` with rows j−i and columns i, ideals
/// and polynomials are in math mode, truncation notes survive; over the API a real
/// transcript exports to LaTeX and Markdown, and JSON export → import re-creates the
/// session with its cells and objects; malformed imports are refused with nothing stored.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { cells, namedObjects, sessions } from "@/db/schema";
import { transcriptToLatex } from "@/lib/export/latex";
import { transcriptToMarkdown } from "@/lib/export/markdown";
import { bettiTabular, mathText } from "@/lib/export/tex";
import type { Transcript } from "@/lib/export/transcript";
import { ensureTestGroup, TEST_ACCOUNTS } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { allEvents } from "../api/ndjson";

/// Rows of a tabular body, each a list of cell texts (the header and rules dropped).
function tabularRows(tex: string): string[][] {
  const body = /\\begin\{tabular\}\{([^}]*)\}([\s\S]*?)\\end\{tabular\}/.exec(tex);
  if (!body) throw new Error("no tabular");
  return body[2]!
    .split("\\\\")
    .map((l) => l.replace(/\\hline/g, "").trim())
    .filter((l) => l !== "")
    .map((l) => l.split("&").map((c) => c.trim().replace(/^\$|\$$/g, "")));
}

describe("LaTeX of values", () => {
  it("typesets a Betti table as a tabular with rows j−i and columns i", () => {
    // S/I, I the ideal of three general points of P²: β00 = 1, β12 = 3, β23 = 2
    const tex = bettiTabular(
      [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      true,
    );
    expect(tex).toMatch(/^\\begin\{tabular\}\{r\|rrr\}/);
    expect(tabularRows(tex)).toEqual([
      ["", "0", "1", "2"],
      ["0", "1", "", ""],
      ["1", "", "3", "2"],
      // the totals row: β_i = Σ_j β_ij, the ranks 1, 3, 2 of the free modules (issue 18)
      ["total", "1", "3", "2"],
    ]);
    // every row has as many cells as the column spec says
    for (const row of tabularRows(tex)) expect(row).toHaveLength(4);
    expect(tex).not.toMatch(/Truncated/);
  });

  it("keeps gaps between rows and notes truncation", () => {
    const tex = bettiTabular(
      [
        [0, 0, 1],
        [1, 3, 1],
      ],
      false,
    );
    expect(tabularRows(tex)).toEqual([
      ["", "0", "1"],
      ["0", "1", ""],
      ["1", "", ""],
      ["2", "", "1"],
      ["total", "1", "1"],
    ]);
    expect(tex).toMatch(/\\emph\{Truncated:/);
  });

  it("puts polynomials in math mode with exponents, fractions and subscripts", () => {
    expect(mathText("3/4*x^2*y-2*x1+3")).toBe("\\frac{3}{4} x^{2} y - 2 x_{1} + 3");
    const doc: Transcript = {
      title: "A & B's 100% test",
      ownerName: "Lena",
      exportedAt: "2026-01-02T00:00:00.000Z",
      cells: [
        {
          position: 0,
          source: "I := <x^2, y>",
          status: "done",
          results: [{ statement: 0, value: { type: "Ideal", text: "<x^2, y>", gens: ["x^2", "y"] } }],
          error: null,
        },
        { position: 1, source: "1/0", status: "error", results: [], error: { kind: "runtime", message: "division by zero" } },
      ],
      objects: [],
    };
    const tex = transcriptToLatex(doc);
    expect(tex).toContain("$\\langle x^{2},\\ y \\rangle$");
    expect(tex).toContain("\\title{A \\& B's 100\\% test}");
    expect(tex).toContain("\\begin{verbatim}\nI := <x^2, y>\n\\end{verbatim}");
    expect(tex).toMatch(/Error \(runtime\):\} division by zero/);
    expect(tex.indexOf("\\begin{document}")).toBeLessThan(tex.indexOf("\\end{document}"));
    const md = transcriptToMarkdown(doc);
    expect(md).toContain("$\\langle x^{2}, y \\rangle$");
  });
});

describe("export and import over the API", () => {
  const owner = new TestClient(testAddress(190));
  const other = new TestClient(testAddress(191));
  let sessionId = "";

  beforeAll(async () => {
    const group = await ensureTestGroup();
    expect((await owner.signIn(TEST_ACCOUNTS.lead.email, TEST_ACCOUNTS.lead.password)).status).toBe(200);
    expect((await other.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
    const r = await owner.json("/api/sessions", { title: "three points" });
    sessionId = ((await r.json()) as { id: string }).id;
    const run = async (source: string) => {
      const events = await allEvents(await owner.json(`/api/sessions/${sessionId}/cells`, { source }));
      expect(events.at(-1)).toMatchObject({ event: "done", status: "done" });
    };
    await run("S := Q[x, y, z]\nI := <x*y, y*z, x*z>\nf := x^2 - 3/4*y*z");
    // The exporter formats stored §9 JSON; the Betti table of S/I (three points of P²:
    // β00 = 1, β12 = 3, β23 = 2) is stored as a finished cell would store it.
    const betti = {
      type: "BettiTable",
      text: "Betti numbers β(0,0)=1, β(1,2)=3, β(2,3)=2",
      entries: [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      complete: true,
    };
    const span = { from: { line: 1, col: 1 }, to: { line: 1, col: 26 } };
    const [cell] = await db()
      .insert(cells)
      .values({
        sessionId,
        position: 1,
        source: "B := resolve(S / I).betti",
        status: "done",
        result: { statements: [{ statement: 0, span, value: betti }], currentRing: "S" },
        finishedAt: new Date(),
        durationMs: 3,
      })
      .returning();
    await db().insert(namedObjects).values({
      sessionId,
      ownerId: group.users.lead.id,
      name: "B",
      type: "BettiTable",
      value: betti,
      source: "B := resolve(S / I).betti",
      sourceCellId: cell!.id,
    });
  }, 120_000);
  afterAll(async () => {
    await db().delete(sessions).where(eq(sessions.title, "three points"));
    await closeDb();
  });

  it("exports LaTeX with the Betti table as a tabular", async () => {
    const r = await owner.request(`/api/sessions/${sessionId}/export?format=latex`);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toMatch(/x-latex/);
    const tex = await r.text();
    expect(tabularRows(tex.slice(tex.indexOf("\\subsection*{Cell 2}")))).toEqual([
      ["", "0", "1", "2"],
      ["0", "1", "", ""],
      ["1", "", "3", "2"],
      ["total", "1", "3", "2"],
    ]);
    expect(tex).toContain("\\langle x y,\\ y z,\\ x z \\rangle");
  });

  it("exports Markdown with a Markdown table", async () => {
    const r = await owner.request(`/api/sessions/${sessionId}/export?format=markdown`);
    expect(r.status).toBe(200);
    const md = await r.text();
    expect(md).toContain("# three points");
    expect(md).toMatch(/\| 1 \| {2}\| 3 \| 2 \|/);
  });

  it("refuses an unknown format", async () => {
    const r = await owner.request(`/api/sessions/${sessionId}/export?format=docx`);
    expect(r.status).toBe(400);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe("invalid_format");
  });

  it("round-trips JSON export → import with cells and objects", async () => {
    const exported = (await (await owner.request(`/api/sessions/${sessionId}/export?format=json`)).json()) as {
      format: string;
      cells: { source: string; results: unknown[]; status: string }[];
      objects: { name: string; type: string; value: unknown; cell: number | null }[];
    };
    expect(exported.format).toBe("ringside.session");
    expect(exported.objects.map((o) => o.name).sort()).toEqual(["B", "I", "S", "f"]);
    const imported = await other.json("/api/sessions/import", exported);
    expect(imported.status).toBe(201);
    const { session } = (await imported.json()) as { session: { id: string; title: string } };
    expect(session.title).toBe("three points");
    // the copy belongs to the importer, and its own export equals the original's
    const again = (await (await other.request(`/api/sessions/${session.id}/export?format=json`)).json()) as typeof exported & {
      session: { ownerName: string };
    };
    expect(again.cells).toEqual(exported.cells);
    const strip = (os: typeof exported.objects) => os.map(({ name, type, value, cell }) => ({ name, type, value, cell }));
    expect(strip(again.objects)).toEqual(strip(exported.objects));
    expect(again.session.ownerName).toBe(TEST_ACCOUNTS.member.name);
    // a later cell in the imported session uses an imported object
    const events = await allEvents(await other.json(`/api/sessions/${session.id}/cells`, { source: "I.codim" }));
    expect(events.at(-1)).toMatchObject({ event: "done", status: "done" });
  }, 60_000);

  it("refuses malformed imports and stores nothing", async () => {
    const count = async () => (await db().select({ id: sessions.id }).from(sessions).where(eq(sessions.title, "bad import"))).length;
    const base = {
      format: "ringside.session",
      version: 1,
      exportedAt: new Date().toISOString(),
      session: { title: "bad import", ownerName: "" },
      cells: [],
      objects: [],
    };
    const cases: unknown[] = [
      { ...base, format: "other" },
      { ...base, version: 2 },
      { ...base, objects: [{ name: "1x", type: "Int", value: { type: "Int", text: "1" }, source: "", cell: null, origin: null }] },
      { ...base, objects: [{ name: "a", type: "Int", value: { type: "Int", text: "1" }, source: "", cell: 7, origin: null }] },
      {
        ...base,
        cells: [
          {
            position: 0,
            source: "1",
            status: "running",
            results: [],
            error: null,
            currentRing: null,
            durationMs: null,
            engineVersion: null,
          },
        ],
      },
      [],
    ];
    for (const body of cases) {
      const r = await other.json("/api/sessions/import", body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      const e = (await r.json()) as { error: { code: string; message: string } };
      expect(e.error.code).toMatch(/invalid_export|invalid_body/);
    }
    const notJson = await other.request("/api/sessions/import", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: "{",
    });
    expect(notJson.status).toBe(400);
    expect(await count()).toBe(0);
  });
});
