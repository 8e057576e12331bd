import { describe, expect, it } from "vitest";
import { analyze } from "@/grammar";
import { GUIDED_TOUR } from "@/lib/examples/tour";

describe("the guided first steps", () => {
  it("has six to eight examples, each explained", () => {
    expect(GUIDED_TOUR.length).toBeGreaterThanOrEqual(6);
    expect(GUIDED_TOUR.length).toBeLessThanOrEqual(8);
    for (const e of GUIDED_TOUR) {
      expect(e.computes.length, e.id).toBeGreaterThan(20);
      expect(e.why.length, e.id).toBeGreaterThan(20);
      expect(e.lookAt.length, e.id).toBeGreaterThan(20);
    }
    expect(new Set(GUIDED_TOUR.map((e) => e.id)).size).toBe(GUIDED_TOUR.length);
  });

  it.each(GUIDED_TOUR.map((e) => [e.id, e.source] as const))("example %s passes the notation's checker in a new session", (_id, source) => {
    // The grammar's own parser and type checker (grammar/README.md §8: every program is
    // checked before anything runs) must accept each example with no bindings at all.
    expect(analyze(source).errors).toEqual([]);
  });
});
