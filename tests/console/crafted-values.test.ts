/// The values of tests/browser/crafted-import.ts pass the import schema (lib/export/format.ts
/// checks only "type" and "text") yet make the drawing code throw, so that browser test
/// really exercises the per-cell error boundary rather than a value that draws anyway.
import { describe, expect, it } from "vitest";
import { viewOfValue } from "@/app/_console/render/view-model";
import { ExportedValue } from "@/lib/export/format";

const CRAFTED = [
  { type: "Ring", text: "R", vars: 42 },
  { type: "List", text: "[…]", items: { not: "a list" } },
];

describe("crafted import values", () => {
  it.each(CRAFTED)("%j is accepted by the import schema but cannot be drawn", (value) => {
    expect(ExportedValue.safeParse(value).success).toBe(true);
    expect(() => viewOfValue(value as never)).toThrow(TypeError);
  });
});
