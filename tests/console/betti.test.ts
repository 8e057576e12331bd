import { describe, expect, it } from "vitest";
import { bettiGrid, mergeBettiEntries } from "@/app/_console/render/betti";

describe("bettiGrid", () => {
  it("lays out the twisted cubic: rows 0 and 1, totals 1, 3, 2", () => {
    // The twisted cubic's ideal of 2×2 minors of a 2×3 matrix is resolved by the
    // Eagon–Northcott complex 0 ← S ← S(−2)^3 ← S(−3)^2 ← 0 (Eagon and Northcott 1962;
    // Hilbert–Burch; Eagon–Northcott 1962).
    const g = bettiGrid(
      [
        [0, 0, 1],
        [1, 2, 3],
        [2, 3, 2],
      ],
      true,
    );
    expect(g.columns).toEqual([0, 1, 2]);
    expect(g.rows.map((r) => r.shift)).toEqual([0, 1]);
    expect(g.rows[0].cells).toEqual([1, null, null]);
    expect(g.rows[1].cells).toEqual([null, 3, 2]);
    expect(g.totals).toEqual([1, 3, 2]);
    expect(g.truncated).toBe(false);
  });

  it("puts a complete intersection of two quadrics in rows 0, 1, 2", () => {
    // Koszul complex of a regular sequence of two quadrics: S ← S(−2)^2 ← S(−4)
    // (Eisenbud, Commutative Algebra, 1995, §17.2): β_{2,4} sits in row 4 − 2 = 2.
    const g = bettiGrid(
      [
        [0, 0, 1],
        [1, 2, 2],
        [2, 4, 1],
      ],
      true,
    );
    expect(g.rows.map((r) => r.shift)).toEqual([0, 1, 2]);
    expect(g.rows[1].cells).toEqual([null, 2, null]);
    expect(g.rows[2].cells).toEqual([null, null, 1]);
    expect(g.totals).toEqual([1, 2, 1]);
  });

  it("keeps an empty row between occupied ones and marks truncation", () => {
    const g = bettiGrid(
      [
        [0, 0, 1],
        [1, 3, 1],
      ],
      false,
    );
    expect(g.rows.map((r) => r.shift)).toEqual([0, 1, 2]);
    expect(g.rows[1].cells).toEqual([null, null]);
    expect(g.truncated).toBe(true);
  });

  it("returns an empty grid for no entries", () => {
    expect(bettiGrid([], true)).toEqual({ columns: [], rows: [], totals: [], truncated: false });
  });
});

describe("mergeBettiEntries", () => {
  it("merges streamed columns in order and lets a later value win", () => {
    expect(
      mergeBettiEntries([
        [[0, 0, 1]],
        [[1, 2, 3]],
        [
          [1, 2, 3],
          [2, 3, 2],
        ],
      ]),
    ).toEqual([
      [0, 0, 1],
      [1, 2, 3],
      [2, 3, 2],
    ]);
  });
});
