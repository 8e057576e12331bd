// The F4 trace of the modular method (lib/algebra/groebner/f4.ts, replayF4; C. Traverso,
// "Gröbner trace algorithms", ISSAC 1988): a computation traced over one prime and followed
// over another must give exactly the reduced basis computed from scratch there, and must
// refuse (null) when a step over the new prime loses a leading monomial.
import { describe, expect, it } from "vitest";
import * as A from "@/lib/algebra";
import { replayF4, tracingF4, type F4StepTrace } from "@/lib/algebra/groebner/f4";
import { buchberger, f4Strategy } from "@/lib/algebra/groebner/index";
import { ringCtx, type RingCtx } from "@/lib/algebra/poly/ring";
import { cyclic, katsura } from "../bench/families";

function traced(p: number, build: (F: A.Field) => { R: A.PolyRing; gens: A.Poly[] }): { basis: string[]; trace: F4StepTrace[] } {
  const { R, gens } = build(A.gf(p));
  const trace: F4StepTrace[] = [];
  const G = buchberger(ringCtx(R) as RingCtx<number>, gens, undefined, tracingF4(f4Strategy, trace));
  return { basis: G.map((g) => A.formatPoly(R, g)), trace };
}

describe("following an F4 trace over another prime", () => {
  const systems = { "cyclic-5": (F: A.Field) => cyclic(F, 5), "katsura-5": (F: A.Field) => katsura(F, 5) };
  for (const [name, build] of Object.entries(systems)) {
    it(`${name}: the trace over 2147483647 gives the reduced basis over 2147483629, 1000003 and 32003`, () => {
      const { trace } = traced(2147483647, build);
      expect(trace.length).toBeGreaterThan(2);
      for (const q of [2147483629, 1000003, 32003]) {
        const { R, gens } = build(A.gf(q));
        const replayed = replayF4(ringCtx(R) as RingCtx<number>, trace, gens, undefined);
        expect(replayed).not.toBeNull();
        expect(replayed!.map((g) => A.formatPoly(R, g))).toEqual(traced(q, build).basis);
      }
    });
  }

  it("refuses a prime where a leading coefficient vanishes: S(x^2 + y^2, xy + y^2) reduces to 2y^3", () => {
    const build = (F: A.Field) => {
      const R = A.polyRing(F, ["x", "y"]);
      return { R, gens: [A.parsePoly(R, "x^2 + y^2"), A.parsePoly(R, "x*y + y^2")] };
    };
    const { trace, basis } = traced(32003, build);
    expect(basis).toContain("y^3");
    const { R, gens } = build(A.gf(2));
    expect(replayF4(ringCtx(R) as RingCtx<number>, trace, gens, undefined)).toBeNull();
    // Over GF(2) the basis really is different: y^3 is not in the ideal there.
    expect(traced(2, build).basis).not.toContain("y^3");
  });
});
