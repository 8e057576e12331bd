/// The katsura-n ideal in the notation (`katsuraIdealText`, tests/bench/families.ts), which the
/// cell and experiment suites send as their long computation, is katsura-n: the notation reads
/// it as the published system and its degree is 2^n.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/notation/evaluate";
import { katsuraIdealText } from "../bench/families";

async function values(source: string): Promise<string[]> {
  const out = await evaluate(source, [], { currentRing: null, onEvent: () => {} });
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value.text);
}

describe("katsura-n written in the notation", () => {
  it("katsura-3 reads as the system u0 + 2(u1 + u2 + u3) = 1, Σ u_|l| u_|m−l| = u_m", async () => {
    // katsura-3 written out (common practice, from memory):
    // u0 + 2u1 + 2u2 + 2u3 − 1, u0² + 2u1² + 2u2² + 2u3² − u0, 2u0u1 + 2u1u2 + 2u2u3 − u1, u1² + 2u0u2 + 2u1u3 − u2
    const [, G] = await values(`K := GF(32003)[u0..u3]\nG := ${katsuraIdealText(3)}`);
    expect(G).toBe("<u0+2*u1+2*u2+2*u3-1, u0^2+2*u1^2+2*u2^2+2*u3^2-u0, 2*u0*u1+2*u1*u2+2*u2*u3-u1, u1^2+2*u0*u2+2*u1*u3-u2>");
  });

  it("katsura-n is zero-dimensional of degree 2^n for n = 2..5 (the Bézout bound is attained: common practice)", async () => {
    for (const n of [2, 3, 4, 5]) {
      const [, , dim, degree] = await values(`K := GF(32003)[u0..u${n}]\nG := ${katsuraIdealText(n)}\nG.dim\nG.degree`);
      expect(dim, `katsura-${n}`).toBe("0");
      expect(degree, `katsura-${n}`).toBe(String(2 ** n));
    }
  });
});
