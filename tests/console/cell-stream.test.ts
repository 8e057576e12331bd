import { describe, expect, it } from "vitest";
import { readNdjson } from "@/app/_console/api/cell-stream";
import type { CellEvent } from "@/lib/wire/reading";
import { applyCellEvent, overallFraction, startedCell } from "@/app/_console/state/running-cell";

// A stream delivering the given chunks, split wherever the test says (NDJSON lines may
// arrive cut at any byte, even inside a multi-byte character).
function streamOf(chunks: Uint8Array[]): ReadableStream<Uint8Array> {
  return new ReadableStream({
    start(controller) {
      for (const c of chunks) controller.enqueue(c);
      controller.close();
    },
  });
}

describe("readNdjson", () => {
  it("reassembles lines split across chunks and multi-byte characters", async () => {
    const text = '{"event":"accepted","cellId":"c1","position":0}\n{"event":"progress","statement":0,"stage":"résolution"}\n';
    const bytes = new TextEncoder().encode(text);
    const cut = text.indexOf("é") + 1; // inside the two bytes of é
    const events: CellEvent[] = [];
    await readNdjson(streamOf([bytes.slice(0, 10), bytes.slice(10, cut), bytes.slice(cut)]), (e) => events.push(e));
    expect(events.map((e) => e.event)).toEqual(["accepted", "progress"]);
    expect(events[1].event === "progress" && events[1].stage).toBe("résolution");
  });

  it("reads a last line without a newline and reports garbled lines", async () => {
    const bad: string[] = [];
    const events: CellEvent[] = [];
    const bytes = new TextEncoder().encode('not json\n{"no":"event"}\n{"event":"checked","statements":2}');
    await readNdjson(
      streamOf([bytes]),
      (e) => events.push(e),
      (l) => bad.push(l),
    );
    expect(events).toEqual([{ event: "checked", statements: 2 }]);
    expect(bad).toEqual(["not json", '{"no":"event"}']);
  });
});

describe("applyCellEvent", () => {
  it("follows a cell through progress, partial Betti columns, result and done", () => {
    const events: CellEvent[] = [
      { event: "accepted", cellId: "c1", position: 3 },
      { event: "checked", statements: 2 },
      {
        event: "result",
        statement: 0,
        span: { from: { line: 1, col: 1 }, to: { line: 1, col: 5 } },
        value: { type: "Ring", text: "Q[x]" },
      },
      { event: "progress", statement: 1, stage: "resolution", detail: "homological degree 1", fraction: 0.5 },
      { event: "partial", statement: 1, value: { type: "BettiTable", text: "", entries: [[0, 0, 1]], complete: false } },
      { event: "partial", statement: 1, value: { type: "BettiTable", text: "", entries: [[1, 2, 2]], complete: false } },
    ];
    const cell = events.reduce(applyCellEvent, startedCell("S := Q[x]\nresolve(S / <x>)"));
    expect(cell.cellId).toBe("c1");
    expect(cell.stage).toBe("resolution");
    expect(cell.partialBetti).toEqual([
      [0, 0, 1],
      [1, 2, 2],
    ]);
    // one of two statements done and half of the second: three quarters
    expect(overallFraction(cell)).toBe(0.75);
    const done = applyCellEvent(cell, { event: "done", status: "cancelled", timings: { totalMs: 12 }, objects: [] });
    expect(done.status).toBe("cancelled");
    expect(done.totalMs).toBe(12);
  });

  it("clamps a fraction outside 0…1 and forgets partial columns of an earlier statement", () => {
    let cell = applyCellEvent(startedCell("x"), {
      event: "partial",
      statement: 0,
      value: { type: "BettiTable", text: "", entries: [[0, 0, 1]], complete: false },
    });
    cell = applyCellEvent(cell, { event: "progress", statement: 1, stage: "s", fraction: 7 });
    expect(cell.fraction).toBe(1);
    expect(cell.partialBetti).toEqual([]);
    expect(overallFraction(cell)).toBeNull();
  });
});
