// The linear algebra of an F4 step (lib/algebra/groebner/f4-linalg.ts: reduction of the rows
// to reduce by the pivot rows, then echelon form of the remainder; the WebAssembly kernel
// with 64-bit integer lanes, and the TypeScript reference with products of residues summed in
// doubles and reduced only when the 2^52 budget is used up) against plain Gaussian
// elimination in BigInt arithmetic. The row space of the remainder D' = D − C·A⁻¹·B has a
// unique reduced row echelon form (common practice), which both sides are brought to.
import { describe, expect, it } from "vitest";
import { reduceF4Matrix, reduceF4MatrixTS, type SparseRow } from "@/lib/algebra/groebner/f4-linalg";
import { Ticker } from "@/lib/algebra/options";
import { mulberry32 } from "./sympy/random-systems";

type Dense = bigint[];

function modInv(a: bigint, p: bigint): bigint {
  let [r0, r1, s0, s1] = [p, ((a % p) + p) % p, 0n, 1n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  return ((s0 % p) + p) % p;
}

/// Reduced row echelon form of the rows over GF(p), zero rows dropped.
function rref(rows: Dense[], p: bigint): string[] {
  const M = rows.map((r) => r.map((x) => ((x % p) + p) % p));
  const out: Dense[] = [];
  const ncols = M[0]?.length ?? 0;
  let r = 0;
  for (let c = 0; c < ncols && r < M.length; c++) {
    const k = M.findIndex((row, i) => i >= r && row[c] !== 0n);
    if (k < 0) continue;
    [M[r], M[k]] = [M[k], M[r]];
    const inv = modInv(M[r][c], p);
    M[r] = M[r].map((x) => (x * inv) % p);
    for (let i = 0; i < M.length; i++) {
      if (i !== r && M[i][c] !== 0n) {
        const f = M[i][c];
        M[i] = M[i].map((x, j) => (((x - f * M[r][j]) % p) + p) % p);
      }
    }
    out.push(M[r]);
    r++;
  }
  return out.map((row) => row.join(","));
}

function sparse(dense: number[]): SparseRow {
  const cols: number[] = [],
    vals: number[] = [];
  dense.forEach((v, c) => {
    if (v !== 0) {
      cols.push(c);
      vals.push(v);
    }
  });
  return { cols: Int32Array.from(cols), off: 0, len: cols.length, vals: Float64Array.from(vals) };
}

describe("F4 matrix reduction with delayed modular reduction", () => {
  for (const [p, reduce] of [32003, 8388593, 16777213, 16777259, 2147483629, 2147483647].flatMap((q) => [
    [q, reduceF4Matrix] as const,
    [q, reduceF4MatrixTS] as const,
  ])) {
    it(`agrees with exact Gaussian elimination over GF(${p}) on dense pivot blocks (${reduce.name})`, () => {
      const rng = mulberry32(p % 100000);
      // Residues near p − 1 as often as small ones: the largest products are the risky ones.
      const residue = () => (rng() < 0.5 ? p - 1 - Math.floor(rng() * 3) : 1 + Math.floor(rng() * (p - 1)));
      for (let trial = 0; trial < 2; trial++) {
        const nA = 400,
          nB = 10,
          ncols = nA + nB;
        // Pivot row c: 1 at column c, then random entries right of it (dense, so reducing a
        // row meets long chains of pivots and adds hundreds of products to one column).
        const A: number[][] = [];
        for (let c = 0; c < nA; c++) {
          const row = new Array<number>(ncols).fill(0);
          row[c] = 1;
          for (let j = c + 1; j < ncols; j++) if (rng() < 0.6) row[j] = residue();
          A.push(row);
        }
        const C: number[][] = [];
        for (let i = 0; i < 12; i++) {
          const row = new Array<number>(ncols).fill(0);
          for (let j = 0; j < ncols; j++) if (rng() < 0.5) row[j] = residue();
          C.push(row);
        }
        const ticker = new Ticker(undefined, () => ({ stage: "test" }));
        const got = reduce(p, { pivots: A.map(sparse), rows: C.map(sparse), nA, ncols }, ticker).rows;
        // Ours: back to dense rows over the B columns.
        const ours = got.map((r) => {
          const d = new Array<bigint>(nB).fill(0n);
          for (let k = 0; k < r.len; k++) d[r.cols[k]] = BigInt(r.vals[k]);
          return d;
        });
        for (const r of ours) expect(r.find((x) => x !== 0n)).toBe(1n);
        // Reference: eliminate the A columns of C exactly, keep the B part.
        const P = BigInt(p);
        const ref = C.map((row) => {
          const d = row.map(BigInt);
          for (let c = 0; c < nA; c++) {
            if (d[c] % P === 0n) continue;
            const f = d[c] % P;
            for (let j = c; j < ncols; j++) d[j] = (((d[j] - f * BigInt(A[c][j])) % P) + P) % P;
          }
          return d.slice(nA);
        });
        expect(rref(ours, P)).toEqual(rref(ref, P));
        expect(got.length).toBe(rref(ref, P).length);
      }
    });
  }
});
