// DEVELOPERS.md's layer table is the lint rules' table (LAYERS in eslint.config.mjs): every
// row's "may import" column is what the boundary rules enforce, and no row is missing.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
// @ts-expect-error eslint.config.mjs is plain JavaScript without declarations
import { LAYERS, mayImportText } from "../../eslint.config.mjs";

type Layer = { layer: string };

const root = path.resolve(__dirname, "../..");

function tableRows(): Map<string, string> {
  const text = readFileSync(path.join(root, "DEVELOPERS.md"), "utf8");
  const section = text.slice(text.indexOf("## Layers and folders"), text.indexOf("\n## ", text.indexOf("## Layers and folders") + 3));
  const rows = new Map<string, string>();
  for (const line of section.split("\n")) {
    const cells = line.split("|").map((c) => c.trim());
    if (cells.length < 5 || !cells[1].startsWith("`")) continue;
    rows.set(cells[1].replace(/`/g, ""), cells[3]);
  }
  return rows;
}

describe("DEVELOPERS.md layer table", () => {
  it("has one row per lint layer, saying exactly what the rule allows", () => {
    const rows = tableRows();
    const layers = LAYERS as Layer[];
    expect([...rows.keys()].filter((k) => !["drizzle/", "tests/"].includes(k)).sort()).toEqual(layers.map((l) => l.layer).sort());
    for (const l of layers) expect(rows.get(l.layer), l.layer).toBe(mayImportText(l));
  });
});
