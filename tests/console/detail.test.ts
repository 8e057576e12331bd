/// The console's control for a value stored as a summary (issue 13, item 1: "detail fetched on
/// demand"): the marker the engine slot writes (lib/compute/large-values.ts `bounded`) is read
/// by the console (render/detail.ts), and the value's drawing (views/value-view.tsx, rendered
/// to static markup here: no browser) offers to load and download the whole value with its
/// size, only for a summary. tests/browser/value-detail.ts clicks it against the real server.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { detailFileName, detailOfValue, detailProblem, formatBytes } from "@/app/_console/render/detail";
import { ValueView } from "@/app/_console/views/value-view";
import { bounded } from "@/lib/compute/large-values";
import type { ValueReading } from "@/lib/wire/reading";

const detailDir = mkdtempSync(path.join(os.tmpdir(), "ringside-console-details-"));
beforeAll(() => {
  process.env.RINGSIDE_LARGE_VALUE_BYTES = "2000";
  process.env.RINGSIDE_DETAIL_DIR = detailDir;
});
afterAll(() => {
  delete process.env.RINGSIDE_LARGE_VALUE_BYTES;
  delete process.env.RINGSIDE_DETAIL_DIR;
  rmSync(detailDir, { recursive: true, force: true });
});

const RING = { type: "Ring", text: "Q[x]", field: "Q", vars: ["x"], degrees: [1], order: "grevlex", ideal: [] };
/// A 60 × 60 matrix of polynomials: well above 2000 bytes as JSON.
function bigMatrix() {
  const rows = Array.from({ length: 60 }, (_, i) => Array.from({ length: 60 }, (_, j) => `x^${i + j} + ${i * j}`));
  return { type: "Matrix", text: "a 60 × 60 matrix", rows, cols: 60, ring: RING };
}

const render = (value: ValueReading, detailAddress?: (id: string) => string) =>
  renderToStaticMarkup(createElement(ValueView, { value, context: { objects: [], detailAddress } }));

describe("the marker of a value stored as a summary", () => {
  it("is read from what the engine slot sends, and names the file holding the whole value", () => {
    const whole = bigMatrix();
    const summary = bounded(whole) as unknown as ValueReading;
    expect(summary.type).toBe("Str");
    const marker = detailOfValue(summary);
    expect(marker).not.toBeNull();
    expect(marker!.type).toBe("Matrix");
    expect(marker!.bytes).toBe(JSON.stringify(whole).length);
    expect(JSON.parse(readFileSync(path.join(detailDir, `${marker!.id}.json`), "utf8"))).toEqual(whole);
  });

  it("is absent from a whole value and from malformed markers", () => {
    expect(detailOfValue({ type: "Int", text: "2", value: "2" } as ValueReading)).toBeNull();
    const bad = (detail: unknown) => ({ type: "Str", text: "…", value: "…", detail }) as unknown as ValueReading;
    expect(detailOfValue(bad({ id: "../../etc/passwd", bytes: 10, type: "Matrix" }))).toBeNull();
    expect(detailOfValue(bad({ id: "0123abcd-0000-4000-8000-000000000000", bytes: -1, type: "Matrix" }))).toBeNull();
    expect(detailOfValue(bad("0123abcd-0000-4000-8000-000000000000"))).toBeNull();
    expect(detailOfValue(bad({ id: "0123abcd-0000-4000-8000-000000000000", bytes: 5, type: "Matrix" }))).toEqual({
      id: "0123abcd-0000-4000-8000-000000000000",
      bytes: 5,
      type: "Matrix",
    });
  });

  it("says sizes, file names and refusals in words", () => {
    expect(formatBytes(812)).toBe("812 bytes");
    expect(formatBytes(82_125)).toBe("80.2 KB");
    expect(formatBytes(15_309_209)).toBe("14.6 MB");
    expect(detailFileName({ id: "0123abcd-0000-4000-8000-000000000000", bytes: 1, type: "Complex" })).toBe(
      "ringside-complex-0123abcd.json",
    );
    expect(detailProblem(404, "The value's detail does not exist.")).toMatch(/not stored on this server.*does not exist\.\)$/);
    expect(detailProblem(403)).toMatch(/no longer read this session/);
    expect(detailProblem(401)).toMatch(/Sign in again/);
    expect(detailProblem(500)).toMatch(/answered 500/);
  });
});

describe("the value's drawing", () => {
  it("offers to load and to download the whole of a summarised value, with its size", () => {
    const summary = bounded(bigMatrix()) as unknown as ValueReading;
    const marker = detailOfValue(summary)!;
    const html = render(summary, (id) => `/api/sessions/s1/details/${id}`);
    expect(html).toContain('data-testid="value-detail"');
    expect(html).toContain(`data-detail-id="${marker.id}"`);
    expect(html).toContain(`the full Matrix takes ${formatBytes(marker.bytes)}`);
    expect(html).toContain(`Load the full value (${formatBytes(marker.bytes)})`);
    expect(html).toContain("Download as JSON");
  });

  it("shows the size but no fetch control where no session serves the detail", () => {
    const html = render(bounded(bigMatrix()) as unknown as ValueReading);
    expect(html).toContain('data-testid="value-detail"');
    expect(html).not.toContain("Load the full value");
  });

  it("draws a whole value with no such control", () => {
    const small = { type: "Poly", text: "x^2 + 1", ring: RING } as unknown as ValueReading;
    expect(bounded(small)).toBe(small);
    expect(render(small, (id) => `/api/sessions/s1/details/${id}`)).not.toContain("value-detail");
  });
});
