/// Runtime errors reach the user in their own words: the engine's internal function names
/// ("resolveQuotient: …", lib/algebra/errors.ts) are dropped at the evaluator's boundary,
/// and the message says what to change (issue 18, point 6).
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";
import { inUsersWords } from "@/lib/notation/errors";

const INTERNAL = /\b[a-z]+[A-Z][A-Za-z]*: /;

describe("errors in the user's words", () => {
  it("a resolution of a non-homogeneous ideal the checker cannot see says what to change, without the engine's name", async () => {
    // <x^2 + y> + <y*z> is not an ideal literal, so only the evaluator finds out
    const out = await evaluate("S := Q[x, y, z]\nI := <x^2 + y> + <y*z>\nresolve(S / I)", []);
    expect(out.error).not.toBeNull();
    expect(out.error!.message).not.toMatch(INTERNAL);
    expect(out.error!.message).not.toMatch(/resolveQuotient/);
    expect(out.error!.message).toMatch(/not homogeneous.*homogenize/);
  });

  it("drops one or several leading internal names and leaves sentences alone", () => {
    expect(inUsersWords("resolveQuotient: the ideal is not homogeneous")).toBe("the ideal is not homogeneous");
    expect(inUsersWords("torLengths: resolve: the length must be a non-negative integer")).toBe(
      "the length must be a non-negative integer",
    );
    expect(inUsersWords('column 2 of "x+": expected a term')).toBe('column 2 of "x+": expected a term');
    expect(inUsersWords("the ring has 3 variables")).toBe("the ring has 3 variables");
  });
});
