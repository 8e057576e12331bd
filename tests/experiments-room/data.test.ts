/// The experiments room's pure parts: cells as numbers, the filter syntax, histogram bins,
/// scatter points, the Betti heat map, the Markdown export, progress words, and the tour's
/// sweep step. The Betti tables are worked by hand (Koszul complex of a regular sequence of
/// two quadrics: 1, 2, 1 in degrees 0, 2, 4 — Eisenbud, "Commutative Algebra with a View
/// Toward Algebraic Geometry", 1995, §17.2, from memory).
import { describe, expect, it } from "vitest";
import { analyze } from "@/grammar";
import { EXPERIMENT_STEP } from "@/lib/examples/tour";
import { experimentKeys } from "@/app/_experiments/api";
import { cellNumber, cellText, numberOfValue, numericColumns, bettiColumns } from "@/app/_experiments/data/cells";
import { parseFilter, rowPasses, whereParam } from "@/app/_experiments/data/filters";
import { formatEta, formatRate, fileStem } from "@/app/_experiments/data/format";
import { rowsMarkdown } from "@/app/_experiments/data/markdown";
import { memberCellSource } from "@/app/_experiments/data/member-cell";
import { bettiHeat, histogram, scatterPoints } from "@/app/_experiments/data/plot-data";
import type { Experiment, Row } from "@/app/_experiments/types";

const int = (n: number) => ({ type: "Int", text: String(n), value: String(n) });
const betti = (entries: [number, number, number][]) => ({ type: "BettiTable", text: "Betti numbers", entries });

function row(index: number, fields: Row["fields"], status: Row["status"] = "ok"): Row {
  return {
    index,
    label: `<m${index}>`,
    status,
    seconds: index / 10,
    fields,
    message: status === "ok" ? null : "failed",
    worker: "w",
    finishedAt: "2026-01-01T00:00:00.000Z",
  };
}

const rows: Row[] = [
  row(0, {
    pd: int(2),
    e: int(4),
    b: betti([
      [0, 0, 1],
      [1, 2, 2],
      [2, 4, 1],
    ]),
  }),
  row(1, {
    pd: int(2),
    e: int(3),
    b: betti([
      [0, 0, 1],
      [1, 2, 2],
      [2, 3, 1],
    ]),
  }),
  row(2, {
    pd: int(3),
    e: int(1),
    b: betti([
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 3],
      [3, 4, 1],
    ]),
  }),
  row(3, {}, "limit"),
];

describe("cells", () => {
  it("reads Int, Rat and Bool as numbers and nothing else", () => {
    expect(numberOfValue(int(-7))).toBe(-7);
    expect(numberOfValue({ type: "Rat", text: "3/4", value: "3/4" })).toBe(0.75);
    expect(numberOfValue({ type: "Bool", text: "true", value: true })).toBe(1);
    expect(numberOfValue({ type: "Str", text: "x", value: "x" })).toBeNull();
    expect(cellNumber(rows[3], "pd")).toBeNull();
    expect(cellText(rows[0], "seconds")).toBe("0.000");
    expect(numericColumns(["index", "label", "pd", "b"], rows)).toEqual(["index", "pd"]);
    expect(bettiColumns(["pd", "b"], rows)).toEqual(["b"]);
  });
});

describe("filters", () => {
  it("parses operators, numbers and words", () => {
    expect(parseFilter("")).toBeNull();
    expect(parseFilter("3")).toEqual({ op: "eq", value: "3" });
    expect(parseFilter(">= 2")).toEqual({ op: "ge", value: "2" });
    expect(parseFilter("!=0")).toEqual({ op: "ne", value: "0" });
    expect(parseFilter("a^2")).toEqual({ op: "contains", value: "a^2" });
    expect(parseFilter(">")).toBeNull();
  });
  it("compares numbers as numbers (10 > 9) and words as substrings", () => {
    const ten = row(9, { pd: int(10) });
    expect(rowPasses(ten, "pd", parseFilter("> 9")!)).toBe(true);
    expect(rows.filter((r) => rowPasses(r, "pd", parseFilter("2")!)).map((r) => r.index)).toEqual([0, 1]);
    expect(rows.filter((r) => rowPasses(r, "label", parseFilter("m2")!)).map((r) => r.index)).toEqual([2]);
    expect(whereParam("pd", parseFilter(">=2")!)).toBe("pd:ge:2");
    expect(whereParam("name", parseFilter("abc")!)).toBe("name:eq:abc");
  });
});

describe("plot data", () => {
  it("a histogram of small integers has one bin per integer and skips rows without a number", () => {
    const h = histogram(rows, "pd");
    expect(h.bins.map((b) => [b.from, b.count])).toEqual([
      [2, 2],
      [3, 1],
    ]);
    expect(h.used).toBe(3);
    expect(h.skipped).toBe(1);
  });
  it("a histogram of spread-out numbers uses equal bins holding every value", () => {
    const spread = Array.from({ length: 100 }, (_, k) => row(k, { x: int(k * 1000) }));
    const h = histogram(spread, "x", 10);
    expect(h.bins).toHaveLength(10);
    expect(h.bins.reduce((s, b) => s + b.count, 0)).toBe(100);
    expect(h.bins[9].count).toBe(10);
  });
  it("scatter points pair the two columns, with the colour column when given", () => {
    const s = scatterPoints(rows, "pd", "e", "index");
    expect(s.points.map((p) => [p.index, p.x, p.y, p.c])).toEqual([
      [0, 2, 4, 0],
      [1, 2, 3, 1],
      [2, 3, 1, 2],
    ]);
    expect(s.skipped).toBe(1);
  });
  it("the heat map has one column per ok member and one row per nonzero (i, j)", () => {
    const h = bettiHeat(rows, "b");
    expect(h.members).toEqual([0, 1, 2]);
    expect(h.positions).toEqual([
      [0, 0],
      [1, 2],
      [2, 3],
      [2, 4],
      [3, 4],
    ]);
    expect(h.max).toBe(3);
    expect(h.cells.find((c) => c.member === 0 && c.i === 2)).toMatchObject({ j: 4, value: 1 });
  });
});

const experiment: Experiment = {
  id: "0123456789abcdef",
  sessionId: "s",
  title: "Quadrics | four",
  status: "done",
  done: 4,
  total: 4,
  failures: 1,
  progress: {
    status: "done",
    done: 4,
    total: 4,
    failures: 1,
    byStatus: { ok: 3, error: 0, limit: 1, cancelled: 0 },
    rate: null,
    etaSeconds: null,
  },
  columns: ["index", "label", "status", "seconds", "pd", "e"],
  program: "",
  familyDefinition: "random_ideals(S, count = 4, gens = 2, degree = 2, seed = 5)",
  probe: "I -> {pd: (S / I).pd, e: I.degree}",
  engineVersion: "ringside-engine 1.1",
  limits: { timeLimitMs: 1000, heapLimitMb: 100 },
  sourceCellId: null,
  uploadId: null,
  rerunOf: null,
  createdAt: "2026-01-01T00:00:00.000Z",
  startedAt: null,
  finishedAt: null,
};

describe("exports and words", () => {
  it("Markdown: a caption with family (and seed), probe and engine, escaped pipes, one line per row", () => {
    const md = rowsMarkdown(experiment, rows);
    const lines = md.trim().split("\n");
    expect(lines[0]).toContain("seed = 5");
    expect(lines[0]).toContain("ringside-engine 1.1");
    expect(lines[0]).toContain("Quadrics \\| four");
    expect(lines[2]).toBe("| index | label | status | seconds | pd | e |");
    expect(lines[3]).toBe("| ---: | --- | --- | ---: | --- | --- |");
    expect(lines.slice(4)).toHaveLength(4);
    expect(lines[4]).toBe("| 0 | <m0> | ok | 0.000 | 2 | 4 |");
    expect(lines[7]).toBe("| 3 | <m3> | limit | 0.300 |  |  |");
  });
  it("rate, time left and file names", () => {
    expect(formatRate(null)).toBe("—");
    expect(formatRate(0.5)).toBe("30 members/min");
    expect(formatRate(4.25)).toBe("4.3 members/s");
    expect(formatEta(65)).toBe("about 1 min 05 s");
    expect(formatEta(null)).toBe("—");
    expect(fileStem("Quadrics | four", "0123456789")).toBe("Quadrics-four-01234567");
  });
  it("the member's cell defines its ring and the member", () => {
    const src = memberCellSource(experiment, 2, {
      type: "Ideal",
      text: "<a*b, c^2>",
      gens: ["a*b", "c^2"],
      ring: { type: "Ring", text: "GF(32003)[a, b, c, d]" },
    });
    expect(src.split("\n").slice(1)).toEqual(["S := GF(32003)[a, b, c, d]", "m2 := <a*b, c^2>"]);
    expect(analyze(src).errors).toEqual([]);
  });
});

describe("the tour's sweep step", () => {
  it("passes the notation's checker in a new session and is explained", () => {
    expect(analyze(EXPERIMENT_STEP.source).errors).toEqual([]);
    expect(EXPERIMENT_STEP.source).toContain("sweep(");
    expect(EXPERIMENT_STEP.why).toMatch(/Kestrel Lake/);
  });
});

describe("a session's experiments from the console", () => {
  const id = "00000000-0000-4000-8000-000000000007";
  it("are read through the console's read-only link, signed in or not", () => {
    expect(experimentKeys.ofSession(id, true, null)).toBe(`/api/experiments?session=${id}`);
    expect(experimentKeys.ofSession(id, true, "t/k")).toBe(`/api/experiments?session=${id}&link=t%2Fk`);
    expect(experimentKeys.ofSession(id, false, "t/k")).toBe(`/api/experiments?session=${id}&link=t%2Fk`);
  });
  it("are not asked for without a session, or signed out without a link", () => {
    expect(experimentKeys.ofSession(null, true, "t")).toBeNull();
    expect(experimentKeys.ofSession(id, false, null)).toBeNull();
  });
});
