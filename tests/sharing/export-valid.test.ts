/// The Markdown export is valid Markdown with the expected structure (parsed by marked, a
/// CommonMark/GFM parser, not by our own code), no fenced block sits inside a list item,
/// records keep the order written, Betti tables carry their totals row, and the LaTeX
/// export puts rings in math mode (issue 18, point 5).
import { describe, expect, it } from "vitest";
import { marked, type Token, type Tokens } from "marked";
import { transcriptToLatex } from "@/lib/export/latex";
import { transcriptToMarkdown } from "@/lib/export/markdown";
import { bettiTabular, ringTex } from "@/lib/export/tex";
import type { Transcript, ValueJsonLike } from "@/lib/export/transcript";

const int = (n: number): ValueJsonLike => ({ type: "Int", text: String(n), value: String(n) });
const ring: ValueJsonLike = {
  type: "Ring",
  text: "Q[x, y, z]",
  field: "Q",
  vars: ["x", "y", "z"],
  degrees: [1, 1, 1],
  order: "grevlex",
  ideal: [],
};
// S/I for I = (xy, yz, xz), three coordinate points of P²: β00 = 1, β12 = 3, β23 = 2
// (Eisenbud, The Geometry of Syzygies, GTM 229, §3A: points in general position).
const betti: ValueJsonLike = {
  type: "BettiTable",
  text: "…",
  entries: [
    [0, 0, 1],
    [1, 2, 3],
    [2, 3, 2],
  ],
  complete: true,
};
// jsonb hands the keys back sorted (shorter first); `fieldOrder` keeps what the user wrote.
const record: ValueJsonLike = {
  type: "Record",
  text: "{depth: 1, a: 2}",
  fields: { a: int(2), depth: int(1) },
  fieldOrder: ["depth", "a"],
};
const list: ValueJsonLike = { type: "List", text: "[…]", items: [betti, int(3)] };
const fn: ValueJsonLike = { type: "Function", text: "(d) ->\n  d + 1" };

const doc: Transcript = {
  title: "three points",
  ownerName: "Lena Lead",
  exportedAt: "2026-12-03T00:00:00.000Z",
  cells: [
    { position: 0, source: "S := Q[x, y, z]", status: "done", results: [{ statement: 0, value: ring }] },
    {
      position: 1,
      source: "resolve(S / <x*y, y*z, x*z>).betti\n{depth: 1, a: 2}",
      status: "done",
      results: [
        { statement: 0, value: betti },
        { statement: 1, value: record },
      ],
    },
    { position: 2, source: "[…]", status: "done", results: [{ statement: 0, value: list }] },
    { position: 3, source: "1 / 0", status: "error", results: [], error: { kind: "runtime", message: "division by zero" } },
  ].map((c) => ({ error: null, ...c })),
  objects: [
    { name: "S", type: "Ring", value: ring, source: "S := Q[x, y, z]" },
    { name: "f", type: "Function", value: fn, source: "f := (d) -> d + 1" },
    { name: "L", type: "List", value: list, source: "L := […]" },
  ],
};

function walk(tokens: Token[], visit: (t: Token, insideList: boolean) => void, insideList = false): void {
  for (const t of tokens) {
    visit(t, insideList);
    const inner = (t as { tokens?: Token[] }).tokens;
    if (inner) walk(inner, visit, insideList || t.type === "list_item");
    if (t.type === "list") walk((t as Tokens.List).items, visit, true);
  }
}

describe("Markdown export", () => {
  const md = transcriptToMarkdown(doc);
  const tokens = marked.lexer(md);

  it("parses with the expected structure: title, one heading per cell, sources as code blocks", () => {
    const headings = tokens.filter((t): t is Tokens.Heading => t.type === "heading");
    expect(headings[0]).toMatchObject({ depth: 1, text: "three points" });
    expect(headings.filter((h) => h.depth === 2).map((h) => h.text)).toEqual(["Cell 1", "Cell 2", "Cell 3", "Cell 4", "Named objects"]);
    const sources = tokens.filter((t): t is Tokens.Code => t.type === "code" && t.lang === "ringside").map((c) => c.text);
    expect(sources).toEqual(doc.cells.map((c) => c.source));
  });

  it("has no code block inside a list item", () => {
    const nested: string[] = [];
    walk(tokens, (t, inside) => {
      if (inside && t.type === "code") nested.push((t as Tokens.Code).text);
    });
    expect(nested).toEqual([]);
  });

  it("writes Betti tables as tables with a totals row, and records in their written order", () => {
    const tables = tokens.filter((t): t is Tokens.Table => t.type === "table");
    const bettiTable = tables[0]!;
    expect(bettiTable.header.map((h) => h.text)).toEqual(["j−i \\ i", "0", "1", "2"]);
    expect(bettiTable.rows.map((r) => r.map((c) => c.text))).toEqual([
      ["0", "1", "", ""],
      ["1", "", "3", "2"],
      ["total", "1", "3", "2"],
    ]);
    const recordTable = tables[1]!;
    expect(recordTable.rows.map((r) => r[0]!.text)).toEqual(["depth", "a"]);
  });

  it("keeps the error as a quote and the ring in math", () => {
    expect(tokens.some((t) => t.type === "blockquote" && /division by zero/.test(t.raw))).toBe(true);
    expect(md).toContain("$\\mathbb{Q}[x, y, z]$");
  });
});

describe("LaTeX export", () => {
  it("puts rings in math mode, quotients with their ideal", () => {
    expect(ringTex(ring)).toBe("\\mathbb{Q}[x, y, z]");
    const q: ValueJsonLike = { ...ring, type: "Ring", text: "GF(7)[x, y] / <x^2>", field: "GF(7)", vars: ["x", "y"], ideal: ["x^2"] };
    expect(ringTex(q)).toBe("\\mathbb{F}_{7}[x, y]/\\langle x^{2} \\rangle");
    const tex = transcriptToLatex(doc);
    expect(tex).toContain("$\\mathbb{Q}[x, y, z]$");
    expect(tex).not.toContain("\\texttt{Q[x, y, z]}");
  });

  it("gives Betti tables a totals row (the ranks of the free modules)", () => {
    const tex = bettiTabular(
      [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      true,
    );
    expect(tex).toMatch(/\\hline\ntotal & \$1\$ & \$3\$ & \$2\$ \\\\\n\\end\{tabular\}/);
  });

  it("keeps record fields in the order written", () => {
    const tex = transcriptToLatex(doc);
    expect(tex.indexOf("\\item[depth]")).toBeLessThan(tex.indexOf("\\item[a]"));
  });
});
