import { describe, expect, it } from "vitest";
import { AlgebraError, ideal, idealGroebnerBasis } from "@/lib/algebra";
import { type BettiColumn, resolveQuotient } from "@/lib/algebra/resolution/schreyer";
import { binom, GF, ringOf, vars } from "./resolution-helpers";

function koszulIdeal(n: number) {
  const R = ringOf(GF, n);
  return ideal(R, vars(R));
}

function kind(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    if (e instanceof AlgebraError) return e.kind;
    throw e;
  }
  return undefined;
}

describe("resolution options", () => {
  it("reports every homological and internal degree of the frame, however fast it runs", () => {
    const details: string[] = [];
    resolveQuotient(koszulIdeal(4), { progress: (p) => p.stage === "resolution" && p.detail && details.push(p.detail) });
    // the Koszul complex on 4 variables: F_i lives in internal degree i (Koszul complex, common practice)
    for (const i of [2, 3, 4]) expect(details).toContain(`homological degree ${i}, internal degree ${i}`);
  });

  it("an aborted signal cancels, also when aborted from the progress callback", () => {
    const ac = new AbortController();
    ac.abort();
    expect(kind(() => resolveQuotient(koszulIdeal(5), { signal: ac.signal }))).toBe("cancelled");
    const ac2 = new AbortController();
    const seen: string[] = [];
    const progress = (p: { stage: string; detail?: string }) => {
      seen.push(`${p.stage}: ${p.detail}`);
      ac2.abort();
    };
    expect(kind(() => resolveQuotient(koszulIdeal(6), { signal: ac2.signal, progress }))).toBe("cancelled");
    expect(seen.length).toBeGreaterThan(0);
  });

  it("progress names the homological and internal degree", () => {
    // The Gröbner basis is cached first, so the first (unthrottled) report is the resolution's.
    const I = koszulIdeal(4);
    idealGroebnerBasis(I);
    const seen: string[] = [];
    resolveQuotient(I, { progress: (p) => seen.push(`${p.stage}: ${p.detail}`) });
    expect(seen[0]).toBe("resolution: homological degree 2, internal degree 2");
  });

  it("partial delivers every Betti column once, in order, equal to the final table", () => {
    const cols: BettiColumn[] = [];
    const C = resolveQuotient(koszulIdeal(5), { partial: (c) => cols.push(c) });
    expect(cols.map((c) => c.i)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(cols.flatMap((c) => c.entries.map(([j, b]) => [c.i, j, b]))).toEqual(C.betti.entries);
  });

  it("limits end with a limit error", () => {
    expect(kind(() => resolveQuotient(koszulIdeal(6), { limits: { maxBasisSize: 5 } }))).toBe("limit");
    expect(kind(() => resolveQuotient(koszulIdeal(6), { limits: { maxDegree: 3 } }))).toBe("limit");
  });

  it("length and degree bounds truncate and report complete: false", () => {
    // Koszul Betti numbers C(5, i) in degree i (Koszul complex, common practice).
    const L = resolveQuotient(koszulIdeal(5), { length: 2 });
    expect(L.complete).toBe(false);
    expect(L.betti.complete).toBe(false);
    expect(L.betti.entries).toEqual([
      [0, 0, 1],
      [1, 1, 5],
      [2, 2, 10],
    ]);
    expect(L.ranks).toEqual([1, 5, 10]);
    const D = resolveQuotient(koszulIdeal(5), { degree: 3 });
    expect(D.complete).toBe(false);
    expect(D.betti.entries).toEqual([0, 1, 2, 3].map((i) => [i, i, binom(5, i)]));
    const full = resolveQuotient(koszulIdeal(5), { length: 5 });
    expect(full.complete).toBe(true);
    expect(full.length).toBe(5);
    const cut = resolveQuotient(koszulIdeal(5), { length: 4 });
    expect(cut.complete).toBe(false);
  });
});
