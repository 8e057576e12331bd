// resolve(…) end to end through the evaluator: Betti tables, ranks and maps of minimal
// resolutions over a polynomial ring (engine part 2), bounds, streamed columns, and the
// refusal to read a quotient of a quotient as a module over the polynomial ring.
import { describe, expect, it } from "vitest";
import { evaluate, type EvalEvent } from "@/lib/notation/evaluate";
import type { ValueJson } from "@/lib/notation/json";

async function run(source: string) {
  const events: EvalEvent[] = [];
  const out = await evaluate(source, [], { onEvent: (e) => events.push(e) });
  return { ...out, events };
}

async function values(source: string): Promise<ValueJson[]> {
  const out = await run(source);
  expect(out.error, out.error?.text).toBeNull();
  return out.results.map((r) => r.value);
}

const entries = (v: ValueJson) => (v as unknown as { entries: [number, number, number][] }).entries;

describe("resolve over a polynomial ring", () => {
  it("gives the twisted cubic's Betti table 1, 3, 2 (Hilbert–Burch; Eagon–Northcott 1962)", async () => {
    const [, , betti, ranks] = await values("S := Q[x, y, z, w]\nC := resolve(S / minors([x, y, z; y, z, w], 2))\nC.betti\nC.ranks");
    expect(entries(betti)).toEqual([
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 2],
    ]);
    expect((betti as unknown as { complete: boolean }).complete).toBe(true);
    expect((ranks as unknown as { items: { value: string }[] }).items.map((i) => i.value)).toEqual(["1", "3", "2"]);
  });

  it("has differentials whose composites vanish, with entries in the maximal ideal (common practice: a complex)", async () => {
    // (xz, xw, yz, yw) = (x, y)·(z, w): the tensor product of two Koszul complexes, ranks 1, 4, 4, 1
    const v = await values(
      "S := GF(32003)[x, y, z, w]\nC := resolve(S / <x*z, x*w, y*z, y*w>)\nC.betti.totals\nC.map(1) * C.map(2)\nC.map(2) * C.map(3)\nC.map(3).entries <= S.maximal",
    );
    expect((v[2] as unknown as { items: { value: string }[] }).items.map((i) => i.value)).toEqual(["1", "4", "4", "1"]);
    const zeroRows = (m: ValueJson) => (m as unknown as { rows: string[][] }).rows.flat().every((e) => e === "0");
    expect(zeroRows(v[3])).toBe(true);
    expect(zeroRows(v[4])).toBe(true);
    expect(v[5]).toMatchObject({ type: "Bool", value: true });
  });

  it("marks a resolution cut by a length bound as incomplete (Koszul: β_i = C(4, i), Koszul complex, common practice)", async () => {
    const [, , betti, complete] = await values("S := GF(101)[a..d]\nC := resolve(S / S.maximal, length = 2)\nC.betti\nC.complete");
    expect(entries(betti)).toEqual([
      [0, 0, 1],
      [1, 1, 4],
      [2, 2, 6],
    ]);
    expect(complete).toMatchObject({ type: "Bool", value: false });
  });

  it("streams each finished Betti column as a partial value", async () => {
    const out = await run("S := GF(101)[a..d]\nresolve(S / S.maximal).betti");
    const partial = out.events.filter((e) => e.event === "partial").map((e) => entries((e as { value: ValueJson }).value));
    // Koszul complex on 4 variables: columns 1, 4, 6, 4, 1 (Koszul complex, common practice)
    expect(partial.map((col) => col.map(([, , b]) => b).reduce((s, b) => s + b, 0))).toEqual([1, 4, 6, 4, 1]);
  });

  it("resolve(…).betti reads the Betti numbers only, with the same answer as a kept resolution, whose maps still work", async () => {
    // issue 17, item 3: resolve(…).betti keeps no differentials; the twisted cubic again
    // (Eagon–Northcott 1962: β = 1, 3, 2)
    const v = await values(
      "S := GF(32003)[x, y, z, w]\nI := minors([x, y, z; y, z, w], 2)\nresolve(S / I).betti\nresolve(S / I).ranks\nC := resolve(S / I)\nC.betti\nresolve(S / I).map(2).cols\nC.map(1) * C.map(2)",
    );
    expect(entries(v[2])).toEqual([
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 2],
    ]);
    expect((v[3] as unknown as { items: { value: string }[] }).items.map((i) => i.value)).toEqual(["1", "3", "2"]);
    expect(entries(v[5])).toEqual(entries(v[2]));
    expect(v[6]).toMatchObject({ type: "Int", value: "2" });
    expect((v[7] as unknown as { rows: string[][] }).rows.flat().every((e) => e === "0")).toBe(true);
  });

  it("reads (S/J)/I as a module over S/J, and asks for a length bound there", async () => {
    const out = await run("S := GF(7)[x, y]\nA := S / <x^2>\nB := A / <y^2>\nresolve(B)");
    expect(out.error?.kind).toBe("runtime");
    expect(out.error?.message).toMatch(/quotient ring.*give a bound/);
    expect(out.error?.span.from).toEqual({ line: 4, col: 1 });
  });

  it("restores a quotient of a quotient from its JSON with the ring it was formed from", async () => {
    const first = await run("S := GF(7)[x, y]\nA := S / <x^2>\nB := A / <y^2>");
    const B = first.objects.find((o) => o.name === "B")!;
    expect(B.value).toMatchObject({ ideal: ["x^2", "y^2"], over: 1 });
    // y^2 is a nonzerodivisor on A = S/(x^2): A/(y^2) has the resolution 0 → A(−2) → A (common practice)
    const second = await evaluate(
      "resolve(B, length = 3).ranks",
      first.objects.map((o) => ({ name: o.name, value: o.value })),
      { currentRing: "B" },
    );
    expect(second.error).toBeNull();
    expect(second.results[0].value).toMatchObject({ items: [{ value: "1" }, { value: "1" }, { value: "0" }, { value: "0" }] });
  });
});
