/// What a stopped computation keeps: finished statements, the running statement's partial
/// results (Betti columns merged into one incomplete table, or the items of a comprehension
/// so far) and where it stopped, in words.
import { describe, expect, it } from "vitest";
import { StreamedWork } from "../../lib/compute/streamed-work";
import type { CellEvent as TypedEvent, Span } from "../../lib/compute/cell-events";

// Events as plain data (values abbreviated: only what StreamedWork reads).
type CellEvent = TypedEvent | { event: "result" | "partial"; statement: number; span?: Span; value: unknown };

const span = (line: number): Span => ({ from: { line, col: 1 }, to: { line, col: 5 } });
const column = (i: number, entries: [number, number][]) => ({
  type: "BettiTable",
  entries: entries.map(([j, b]) => [i, j, b]),
  complete: false,
});

function fed(events: CellEvent[]): StreamedWork {
  const w = new StreamedWork();
  for (const e of events) w.observe(e as TypedEvent);
  return w;
}

describe("StreamedWork", () => {
  it("keeps the Betti columns so far as one incomplete table and says the last homological degree", () => {
    // Columns of the residue field over k[x,y,z]/m^3 (Golod: 1, 3, 13 — see robust-compute.test.ts).
    const w = fed([
      { event: "checked", statements: 3, spans: [span(1), span(2), span(3)] },
      { event: "result", statement: 0, span: span(1), value: { type: "Ring", text: "S" } },
      { event: "result", statement: 1, span: span(2), value: { type: "Ring", text: "R" } },
      { event: "partial", statement: 2, value: column(0, [[0, 1]]) },
      { event: "partial", statement: 2, value: column(1, [[1, 3]]) },
      {
        event: "partial",
        statement: 2,
        value: column(2, [
          [2, 3],
          [3, 10],
        ]),
      },
    ]);
    const kept = w.stored("memory limit of 220 MB reached (cellMemoryMb)");
    expect(kept.stopped).toBe("stopped after homological degree 2: memory limit of 220 MB reached (cellMemoryMb)");
    expect(kept.statements.map((s) => s.statement)).toEqual([0, 1, 2]);
    const table = kept.statements[2]!.value as { type: string; entries: number[][]; complete: boolean; note: string; text: string };
    expect(table).toMatchObject({ type: "BettiTable", complete: false });
    expect(table.entries).toEqual([
      [0, 0, 1],
      [1, 1, 3],
      [2, 2, 3],
      [2, 3, 10],
    ]);
    expect(table.text).toMatch(
      /^Betti numbers β\(0,0\)=1, β\(1,1\)=3, β\(2,2\)=3, β\(2,3\)=10 \(truncated: stopped after homological degree 2/,
    );
    expect(kept.statements[2]!.span).toEqual(span(3));
  });

  it("keeps the items of a comprehension so far", () => {
    const w = fed([
      { event: "checked", statements: 1, spans: [span(1)] },
      { event: "partial", statement: 0, value: { type: "Int", value: "1" } },
      { event: "partial", statement: 0, value: { type: "Int", value: "4" } },
    ]);
    const kept = w.stored("cancelled");
    expect(kept.stopped).toBe("stopped after 2 items: cancelled");
    expect(kept.statements[0]!.value).toMatchObject({ type: "List", items: [{ value: "1" }, { value: "4" }] });
  });

  it("says which statement was running when nothing partial had streamed", () => {
    const w = fed([
      { event: "checked", statements: 3, spans: [span(1), span(2), span(3)] },
      { event: "result", statement: 0, span: span(1), value: { type: "Int", value: "2" } },
    ]);
    expect(w.stored("cancelled")).toMatchObject({ stopped: "stopped in statement 2 of 3: cancelled", progress: null });
  });

  it("a finished statement drops its partial results; the heartbeat writes only after a change", () => {
    const w = fed([
      { event: "checked", statements: 2, spans: [span(1), span(2)] },
      { event: "partial", statement: 0, value: column(0, [[0, 1]]) },
    ]);
    expect(w.snapshot()).toMatchObject({ progress: "homological degree 0" });
    expect(w.snapshot()).toBeNull();
    w.observe({ event: "result", statement: 0, span: span(1), value: { type: "Complex", text: "C" } } as unknown as TypedEvent);
    expect(w.snapshot()).toEqual({ statements: [{ statement: 0, span: span(1), value: { type: "Complex", text: "C" } }], progress: null });
  });
});
