// The WebAssembly kernel of the F4 matrix reduction (lib/algebra/groebner/f4-kernel.ts,
// source kernel/f4-kernel.as.ts) against the TypeScript reduction of f4-linalg.ts, which
// tests/algebra/f4-linalg.test.ts checks against exact BigInt elimination: both compute the
// same exact rows (step 1's remainder is unique, and step 2 processes the rows in the same
// order), so they must agree entry for entry, over primes on both sides of 2^24 (where the
// kernel switches from unreduced sums to the subtract-and-correct form) and near 2^31,
// with both of the kernel's arithmetic forms forced where valid and the budget of the first
// made tiny so its normalisation runs. Also: the committed module is what its source
// compiles to, and a matrix too large for WebAssembly's memory fails with a limit error.
import { describe, expect, it } from "vitest";
import { AlgebraError } from "@/lib/algebra/errors";
import { WasmPivotReducer, idleKernelBytes, kernelMode } from "@/lib/algebra/groebner/f4-kernel";
import {
  PivotReducer,
  reduceF4Matrix,
  reduceF4MatrixTS,
  reduceRowTS,
  reduceTails,
  reduceTailsTS,
  type F4Matrix,
  type SparseRow,
} from "@/lib/algebra/groebner/f4-linalg";
import { Ticker } from "@/lib/algebra/options";
// @ts-expect-error: a plain ES module without type declarations
import { committedBase64, compileKernel } from "@/lib/ops/build-f4-kernel.mjs";
import { mulberry32 } from "./sympy/random-systems";

const ticker = () => new Ticker(undefined, () => ({ stage: "test" }));

/// A random F4-shaped matrix: pivot rows with leading 1 at their pivot column and entries to
/// the right (in a shared column pool, with residue arrays shared by several rows, as
/// f4.ts builds them), rows to reduce of mixed density, some of them zero after step 1.
function randomMatrix(p: number, seed: number, nA: number, nB: number, nRows: number, density: number): F4Matrix {
  const rng = mulberry32(seed);
  const ncols = nA + nB;
  const residue = () => (rng() < 0.4 ? p - 1 - Math.floor(rng() * Math.min(3, p - 1)) : 1 + Math.floor(rng() * (p - 1)));
  const pool: number[] = [];
  const valArrays: Float64Array[] = [];
  const pivots: SparseRow[] = [];
  for (let c = 0; c < nA; c++) {
    const cols = [c];
    for (let j = c + 1; j < ncols; j++) if (rng() < density) cols.push(j);
    // Columns of a pivot row need not be increasing after the first: shuffle the tail.
    for (let i = cols.length - 1; i > 1; i--) {
      const j = 1 + Math.floor(rng() * i);
      [cols[i], cols[j]] = [cols[j], cols[i]];
    }
    let vals = valArrays.find((v) => v.length >= cols.length && rng() < 0.5);
    if (!vals) {
      vals = Float64Array.from({ length: cols.length + Math.floor(rng() * 3) }, (_, k) => (k === 0 ? 1 : residue()));
      valArrays.push(vals);
    }
    pivots.push({ cols: null as unknown as Int32Array, off: pool.length, len: cols.length, vals });
    pool.push(...cols);
  }
  const rows: SparseRow[] = [];
  for (let i = 0; i < nRows; i++) {
    const d = rng() < 0.5 ? density : 0.5;
    const cols: number[] = [];
    for (let j = 0; j < ncols; j++) if (rng() < d) cols.push(j);
    if (cols.length === 0) cols.push(Math.floor(rng() * ncols));
    rows.push({ cols: null as unknown as Int32Array, off: pool.length, len: cols.length, vals: Float64Array.from(cols, residue) });
    pool.push(...cols);
  }
  const shared = Int32Array.from(pool);
  for (const r of [...pivots, ...rows]) r.cols = shared;
  // A row equal to a pivot row reduces to zero in step 1; a repeated row, in step 2.
  if (nA > 0) rows.push({ ...pivots[0], vals: Float64Array.from(pivots[0].vals) });
  if (nRows > 0) rows.push({ ...rows[0] });
  return { pivots, rows, nA, ncols };
}

const plain = (r: SparseRow | null) =>
  r ? { cols: Array.from(r.cols.subarray(r.off, r.off + r.len)), vals: Array.from(r.vals.subarray(0, r.len)) } : null;

/// reduceF4Matrix with the kernel forced to `arithmetic`.
function kernelReduce(p: number, M: F4Matrix, arithmetic: { mode: number; budget: number }) {
  const k = new WasmPivotReducer(p, M.pivots, M.nA, M.ncols, arithmetic);
  try {
    return k.reduceAndEchelon(M.rows, ticker());
  } finally {
    k.release();
  }
}

const PRIMES = [2, 3, 251, 32003, 8388593, 16777213, 16777259, 1073741789, 2147483629, 2147483647];

describe("the WebAssembly kernel computes the TypeScript reduction's rows exactly", () => {
  for (const p of PRIMES) {
    it(`over GF(${p})`, () => {
      for (const [seed, nA, nB, nRows, density] of [
        [1, 60, 25, 23, 0.3],
        [2, 200, 40, 9, 0.05],
        [3, 0, 30, 14, 0.4],
        [4, 120, 0, 6, 0.2],
        [5, 90, 70, 41, 0.6],
      ]) {
        const M = randomMatrix(p, seed * 7919 + (p % 1000), nA, nB, nRows, density);
        const want = reduceF4MatrixTS(p, M, ticker());
        const got = reduceF4Matrix(p, M, ticker());
        expect(got.from).toEqual(want.from);
        expect(got.rows.map(plain)).toEqual(want.rows.map(plain));
        if (nB > 0 && nRows > 5) expect(want.rows.length).toBeGreaterThan(0);
        // Both arithmetic forms where valid, the first with budgets small enough to run out.
        const forms = [{ mode: 1, budget: 1 }];
        if (kernelMode(p).mode === 0) forms.push({ mode: 0, budget: 1 }, { mode: 0, budget: 3 });
        for (const form of forms) {
          const other = kernelReduce(p, M, form);
          expect(other.from).toEqual(want.from);
          expect(other.rows.map(plain)).toEqual(want.rows.map(plain));
        }
        // Tails (all entries but the first) and single rows, sparse and dense.
        expect(reduceTails(p, M, ticker()).map(plain)).toEqual(reduceTailsTS(p, M, ticker()).map(plain));
        const reducer = new PivotReducer(p, M);
        try {
          for (const row of M.rows.slice(0, 5)) {
            const ref = plain(reduceRowTS(p, M, row));
            expect(plain(reducer.reduceRow(row))).toEqual(ref);
            const dense = new Float64Array(M.ncols);
            for (let k = 0; k < row.len; k++) dense[row.cols[row.off + k]] = row.vals[k];
            expect(plain(reducer.reduceRow(dense))).toEqual(ref);
          }
          expect(reducer.reduceRows(M.rows).map(plain)).toEqual(M.rows.map((r) => plain(reduceRowTS(p, M, r))));
        } finally {
          reducer.release();
        }
      }
    });
  }

  it("chooses unreduced sums exactly while no sum of products can reach 2^64", () => {
    for (const p of [2, 32003, 16777213]) {
      const { mode, budget } = kernelMode(p);
      expect(mode).toBe(0);
      // budget products below (p−1)² on top of a residue stay below 2^64.
      expect(BigInt(budget) * BigInt(p - 1) ** 2n + BigInt(p - 1)).toBeLessThan(2n ** 64n);
    }
    expect(kernelMode(16777259).mode).toBe(1);
    expect(kernelMode(2147483647).mode).toBe(1);
  });

  it("fails with a limit error when a matrix needs more memory than WebAssembly can address", () => {
    const M: F4Matrix = { pivots: [], rows: [], nA: 0, ncols: 2 ** 27 };
    expect(() => reduceF4Matrix(32003, M, ticker())).toThrow(AlgebraError);
    try {
      reduceF4Matrix(32003, M, ticker());
    } catch (e) {
      expect((e as AlgebraError).kind).toBe("limit");
    }
    // The kernel still works afterwards.
    const small = randomMatrix(32003, 9, 20, 10, 8, 0.3);
    expect(reduceF4Matrix(32003, small, ticker()).rows.map(plain)).toEqual(reduceF4MatrixTS(32003, small, ticker()).rows.map(plain));
  });
});

describe("the kernel's memory", () => {
  it("is reused from matrix to matrix, and dropped once it grew past 32 MB", () => {
    const small = randomMatrix(32003, 11, 30, 10, 9, 0.3);
    reduceF4Matrix(32003, small, ticker());
    const kept = idleKernelBytes();
    expect(kept).toBeGreaterThan(0);
    expect(kept).toBeLessThanOrEqual(32 << 20);
    // 400 000 columns: the accumulator of eight 64-bit lanes alone takes 25.6 MB.
    const wide: F4Matrix = { pivots: [], rows: [small.rows[0]], nA: 0, ncols: 400_000 };
    reduceF4Matrix(32003, wide, ticker());
    expect(idleKernelBytes()).toBe(0);
    reduceF4Matrix(32003, small, ticker());
    expect(idleKernelBytes()).toBeGreaterThan(0);
    expect(idleKernelBytes()).toBeLessThanOrEqual(kept);
  });
});

describe("the committed WebAssembly module", () => {
  it("is what `npm run build:f4-kernel` compiles from kernel/f4-kernel.as.ts", async () => {
    const bytes: Buffer = await compileKernel();
    expect(bytes.subarray(0, 4)).toEqual(Buffer.from([0, 0x61, 0x73, 0x6d]));
    expect(bytes.toString("base64")).toBe(committedBase64());
  });
});
