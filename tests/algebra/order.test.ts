import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as A from "@/lib/algebra";
import { monoFromExps, monoMul } from "@/lib/algebra/monomial/monomial";
import { ringCtx } from "@/lib/algebra/poly/ring";

const vars = ["x", "y", "z"];
const f = "4*x*y^2*z+4*z^2-5*x^3+7*x^2*z^2";

describe("monomial orders", () => {
  // D. Cox, J. Little, D. O'Shea, "Ideals, Varieties, and Algorithms", Ch. 2 §2: the same
  // polynomial written in lex, graded lex and graded reverse lex order (from memory).
  it("sorts the textbook example in lex, glex and grevlex", () => {
    const show = (order: A.OrderSpec) => {
      const R = A.polyRing(A.QQ, vars, { order });
      return A.formatPoly(R, A.parsePoly(R, f));
    };
    expect(show({ kind: "lex" })).toBe("-5*x^3+7*x^2*z^2+4*x*y^2*z+4*z^2");
    expect(show({ kind: "glex" })).toBe("7*x^2*z^2+4*x*y^2*z-5*x^3+4*z^2");
    expect(show({ kind: "grevlex" })).toBe("4*x*y^2*z+7*x^2*z^2-5*x^3+4*z^2");
  });

  it("compares by the weights first and breaks ties by grevlex", () => {
    const R = A.polyRing(A.QQ, vars, { order: { kind: "weights", weights: [0, 0, 1] } });
    expect(A.formatPoly(R, A.parsePoly(R, "x^5+y^3+z+x*y"))).toBe("z+x^5+y^3+x*y");
  });

  it("orders by the weighted degree in a weighted grading", () => {
    const R = A.polyRing(A.QQ, ["x", "y"], { degrees: [1, 3] });
    expect(A.formatPoly(R, A.parsePoly(R, "x^2+y+x^4"))).toBe("x^4+y+x^2");
    expect(A.degree(R, A.parsePoly(R, "x^2+y^2"))).toBe(6);
    expect(A.isHomogeneous(R, A.parsePoly(R, "x^3-y"))).toBe(true);
  });

  it("rejects bad orders and gradings", () => {
    expect(() => A.polyRing(A.QQ, vars, { order: { kind: "weights", weights: [1, 2] } })).toThrow(/3 weights/);
    expect(() => A.polyRing(A.QQ, vars, { order: { kind: "weights", weights: [1, -2, 0] } })).toThrow(/weight 2/);
    expect(() => A.polyRing(A.QQ, vars, { degrees: [1, 0, 1] })).toThrow(/degree of y/);
    expect(() => A.polyRing(A.QQ, ["x", "x"])).toThrow(/appears twice/);
    expect(() => A.polyRing(A.QQ, ["2x"])).toThrow(/not a variable name/);
  });

  // A monomial order is total, multiplicative and has 1 as its least element (the
  // definition, e.g. Cox–Little–O'Shea Ch. 2 §2, Definition 1).
  const orders: A.OrderSpec[] = [{ kind: "grevlex" }, { kind: "lex" }, { kind: "glex" }, { kind: "weights", weights: [2, 0, 1, 3] }];
  for (const order of orders) {
    it(`${A.orderName(order)} is a monomial order`, () => {
      const R = ringCtx(A.polyRing(A.QQ, ["a", "b", "c", "d"], { order, degrees: [1, 2, 1, 1] }));
      const exps = fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 4, maxLength: 4 });
      fc.assert(
        fc.property(exps, exps, exps, (a, b, c) => {
          const [ma, mb, mc] = [a, b, c].map((e) => monoFromExps(R.layout, e));
          const d = Math.sign(R.cmp(ma, mb));
          // antisymmetry; `d === 0 ? 0 : -d` because toBe tells 0 from -0
          expect(Math.sign(R.cmp(mb, ma))).toBe(d === 0 ? 0 : -d);
          if (d === 0) expect(a).toEqual(b);
          expect(Math.sign(R.cmp(monoMul(ma, mc), monoMul(mb, mc)))).toBe(d);
          expect(R.cmp(ma, monoFromExps(R.layout, [0, 0, 0, 0]))).toBeGreaterThanOrEqual(0);
        }),
      );
    });
  }
});
