// The wire contract (lib/wire): the schemas accept what the server sends and refuse what
// it must not, and the stream events a job emits convert to the client's events.
import { describe, expect, it } from "vitest";
import { Cell, CellEvent, JobEvent } from "@/lib/wire/cells";
import { NamedObject, SessionDetail } from "@/lib/wire/sessions";
import { ValueJson } from "@/lib/wire/values";
import { ValueJson as NotationValueJson } from "@/lib/notation/json";

const span = { from: { line: 1, col: 1 }, to: { line: 1, col: 9 } };
const ring = { type: "Ring", text: "Q[x, y]", field: "Q", vars: ["x", "y"], degrees: [1, 1], order: "grevlex", ideal: [] };

describe("lib/wire", () => {
  it("is the evaluator's encoding: lib/notation/json re-exports the same schema", () => {
    expect(NotationValueJson).toBe(ValueJson);
  });

  it("accepts a stored cell and a named object as lib/sessions/views.ts writes them", () => {
    const cell = {
      id: "c1",
      position: 0,
      source: "R := Q[x, y]",
      status: "done",
      results: [{ statement: 0, span, value: ring }],
      error: null,
      timings: { totalMs: 4 },
      engineVersion: "0.1.0",
      createdAt: "2026-01-01T00:00:00.000Z",
    };
    expect(Cell.parse(cell)).toEqual(cell);
    const object = {
      id: "o1",
      name: "R",
      type: "Ring",
      value: ring,
      summary: "Q[x, y]",
      source: "R := Q[x, y]",
      sourceCellId: "c1",
      origin: null,
      updatedAt: "2026-01-01T00:00:00.000Z",
    };
    expect(NamedObject.parse(object)).toEqual(object);
  });

  it("refuses a stream line with an unknown event and a value without its ring", () => {
    expect(CellEvent.safeParse({ event: "finished" }).success).toBe(false);
    expect(CellEvent.safeParse({ event: "result", statement: 0, span, value: { type: "Poly", text: "x" } }).success).toBe(false);
    expect(CellEvent.safeParse({ event: "result", statement: 0, span, value: { type: "Poly", text: "x", ring } }).success).toBe(true);
  });

  it("keeps `bound` and the statement spans on the server side of the contract", () => {
    expect(JobEvent.safeParse({ event: "bound", statement: 0, name: "R", type: "Ring", value: ring }).success).toBe(true);
    expect(CellEvent.safeParse({ event: "bound", statement: 0, name: "R", type: "Ring", value: ring }).success).toBe(false);
    expect(JobEvent.safeParse({ event: "checked", statements: 1 }).success).toBe(false);
  });

  it("types a session's visibility and the caller's access as closed sets", () => {
    const base = { id: "s", title: "t", ownerName: "o", visibility: "team", access: "viewer", canEdit: false };
    expect(SessionDetail.safeParse(base).success).toBe(true);
    expect(SessionDetail.safeParse({ ...base, access: "admin" }).success).toBe(false);
  });
});
