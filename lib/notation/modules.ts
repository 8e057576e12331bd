/// Module values of the notation (notation.md §5): free modules R^n and R^[d1, …], coker,
/// image and ker of a matrix, module(I), a quotient ring read as a module, R.residue. Every
/// module is held by a presentation over its ring with the degrees of its generators; over a
/// quotient R = S/J the computations work over S with the presentation [A | J·1] (the relations
/// of R added on every generator), which gives the same module.
import type { Span } from "../../grammar/ast";
import {
  columnDegrees,
  degree,
  isHomogeneous,
  isZero,
  kernelColumns,
  minimalPresentation,
  moduleKernel,
  one,
  variable,
  zero,
  type ComputeOptions,
  type Poly,
} from "../algebra/index";
import type { CallContext } from "./context";
import { reduceIn } from "./coerce";
import { limit, runtime } from "./errors";
import { LIMIT_TABLE } from "../limits";
import type { OpContext } from "./context";
import type { MatrixValue, ModuleValue, RingValue, Value } from "./values";

/// The largest rank of a free module R^n written directly.
const MAX_FREE_RANK = LIMIT_TABLE.freeRank.value;
const MAX_MODULE_DEGREE = LIMIT_TABLE.moduleDegree.value;

export function matrixOf(ring: RingValue, rows: readonly (readonly Poly[])[], cols: number): MatrixValue {
  return { type: "Matrix", ring, rows, cols };
}

export function moduleValue(ring: RingValue, rows: readonly (readonly Poly[])[], degrees: readonly number[]): ModuleValue {
  const cols = rows[0]?.length ?? 0;
  return { type: "Module", ring, presentation: matrixOf(ring, rows, cols), degrees };
}

export function freeModuleValue(ring: RingValue, degrees: readonly number[]): ModuleValue {
  return moduleValue(
    ring,
    degrees.map(() => []),
    degrees,
  );
}

/// The ring a quotient ring A / I is a module over (A), and the generators of I in it.
function cyclicOf(r: RingValue, c: { interp: CallContext["interp"] }): { base: RingValue; gens: Poly[] } {
  const base = r.over ?? c.interp.session.rings.ambient(r);
  return { base, gens: r.ideal.slice(base.ideal.length) };
}

/// A Module, or a quotient ring A / I read as the cyclic A-module A/I (notation.md §5).
export function moduleOf(v: Value, span: Span, c: { interp: CallContext["interp"] }): ModuleValue {
  if (v.type === "Module") return v;
  if (v.type !== "Ring") throw runtime(`expected a Module or a quotient ring, got ${v.type}`, span);
  const { base, gens } = cyclicOf(v, c);
  homogeneousOrFail(base, gens, span, "the ideal of this quotient");
  return moduleValue(base, [gens], [0]);
}

function homogeneousOrFail(ring: RingValue, fs: readonly Poly[], span: Span, what: string): void {
  for (const f of fs) {
    if (!isHomogeneous(ring.poly, f)) throw runtime(`${what} is not homogeneous; modules here are graded`, span);
  }
}

/// Degrees of the rows that make every entry of A homogeneous of degree (column degree −
/// row degree), each connected block of rows shifted so that its lowest row has degree 0.
export function rowGrading(A: MatrixValue, span: Span): number[] {
  const R = A.ring.poly;
  const r = A.rows.length;
  const rowDeg: (number | null)[] = new Array(r).fill(null);
  const colDeg: (number | null)[] = new Array(A.cols).fill(null);
  A.rows.forEach((row, a) =>
    row.forEach((f, q) => {
      if (!isHomogeneous(R, f)) throw runtime(`entry (${a + 1}, ${q + 1}) of the matrix is not homogeneous`, span);
    }),
  );
  for (let start = 0; start < r; start++) {
    if (rowDeg[start] !== null) continue;
    rowDeg[start] = 0;
    const block = [start];
    const stack: ["row" | "col", number][] = [["row", start]];
    while (stack.length > 0) {
      const [kind, k] = stack.pop()!;
      if (kind === "row") {
        A.rows[k].forEach((f, q) => {
          if (isZero(f)) return;
          const want = degree(R, f) + rowDeg[k]!;
          if (colDeg[q] === null) {
            colDeg[q] = want;
            stack.push(["col", q]);
          } else if (colDeg[q] !== want) throw inconsistent(span);
        });
      } else {
        A.rows.forEach((row, a) => {
          const f = row[k];
          if (isZero(f)) return;
          const want = colDeg[k]! - degree(R, f);
          if (rowDeg[a] === null) {
            rowDeg[a] = want;
            block.push(a);
            stack.push(["row", a]);
          } else if (rowDeg[a] !== want) throw inconsistent(span);
        });
      }
    }
    const low = Math.min(...block.map((a) => rowDeg[a]!));
    for (const a of block) rowDeg[a] = rowDeg[a]! - low;
  }
  return rowDeg.map((d) => d ?? 0);
}

/// The row degrees a user gave to coker (degrees = [d1, …]): one Int per row, such that every
/// column has one degree (entry degree + row degree) — so that coker(C.map(i), degrees = …)
/// keeps the twists of a resolution's free module instead of starting again at degree 0.
function givenRowDegrees(A: MatrixValue, v: Value, c: CallContext): number[] {
  const span = c.span;
  if (v.type !== "List" || v.items.some((x) => x.type !== "Int")) throw runtime("degrees must be a List of Int, one per row", span);
  if (v.items.length !== A.rows.length) {
    throw runtime(
      `degrees gives ${v.items.length} degree${v.items.length === 1 ? "" : "s"}, but the matrix has ${A.rows.length} row${A.rows.length === 1 ? "" : "s"}`,
      span,
    );
  }
  const degrees = v.items.map((x) => {
    const d = (x as { value: bigint }).value;
    if (d < -100_000n || d > 100_000n) throw runtime(`the degree ${d} is out of range (|d| ≤ 100000)`, span);
    return Number(d);
  });
  const R = A.ring.poly;
  for (let q = 0; q < A.cols; q++) {
    let col: number | null = null;
    A.rows.forEach((row, a) => {
      const f = row[q];
      if (isZero(f)) return;
      if (!isHomogeneous(R, f)) throw runtime(`entry (${a + 1}, ${q + 1}) of the matrix is not homogeneous`, c.argSpans[0] ?? span);
      const d = degree(R, f) + degrees[a];
      if (col === null) col = d;
      else if (col !== d) {
        throw runtime(
          `with these degrees column ${q + 1} is not homogeneous: its entries have degrees ${col} and ${d} once the row degrees are added`,
          span,
        );
      }
    });
  }
  return degrees;
}

const inconsistent = (span: Span) =>
  runtime("no degrees of the rows make this matrix homogeneous (every column must have one degree: entry degree + row degree)", span);

/// The relations of R = S/J on a free module with generators in `degrees`: the columns g·e_a.
function ringRelations(ring: RingValue, degrees: readonly number[], span: Span): { cols: Poly[][]; degs: number[] } {
  homogeneousOrFail(ring, ring.ideal, span, "the defining ideal of the ring");
  const cols: Poly[][] = [];
  const degs: number[] = [];
  degrees.forEach((d, a) => {
    for (const g of ring.ideal) {
      cols.push(degrees.map((_, b) => (b === a ? g : zero(ring.poly))));
      degs.push(degree(ring.poly, g) + d);
    }
  });
  return { cols, degs };
}

/// The presentation of M as a module over the polynomial ring S: rows by generator.
export function presentationOverS(M: ModuleValue, span: Span): { rows: Poly[][]; degrees: readonly number[] } {
  const { cols } = ringRelations(M.ring, M.degrees, span);
  const rows = M.presentation.rows.map((row, a) => [...row, ...cols.map((col) => col[a])]);
  return { rows, degrees: M.degrees };
}

/// Generators (as columns, reduced in R) of the kernel of A: R^[source] → R^[target] over R = S/J:
/// the source parts of ker_S [A | J·1].
export function kernelOver(
  ring: RingValue,
  rows: readonly (readonly Poly[])[],
  source: readonly number[],
  target: readonly number[],
  span: Span,
  opts: ComputeOptions,
): Poly[][] {
  const s = source.length;
  const rel = ringRelations(ring, target, span);
  const full = target.map((_, a) => [...rows[a], ...rel.cols.map((col) => col[a])]);
  const K = moduleKernel(ring.poly, full, [...source, ...rel.degs], target, opts)
    .map((v) => v.slice(0, s).map((f) => reduceIn(ring, f, opts)))
    .filter((v) => v.some((f) => !isZero(f)));
  // as a matrix: one row per source generator
  return Array.from({ length: s }, (_, b) => K.map((v) => v[b]));
}

/// A module over a polynomial ring with its presentation made minimal; over a quotient as given.
function tidy(M: ModuleValue, opts: ComputeOptions): ModuleValue {
  if (M.ring.ideal.length > 0 || M.degrees.length === 0) return M;
  const P = minimalPresentation(M.ring.poly, M.presentation.rows, M.degrees, opts);
  return moduleValue(M.ring, P.rows, P.rowDegrees);
}

/// image(A) ≅ R^[column degrees] / ker A.
function imageOf(A: MatrixValue, span: Span, opts: ComputeOptions): ModuleValue {
  const target = rowGrading(A, span);
  const source = columnDegrees(A.rows, target);
  if (A.rows.length === 0) return freeModuleValue(A.ring, []);
  const K = kernelOver(A.ring, A.rows, source, target, span, opts);
  return tidy(moduleValue(A.ring, K, source), opts);
}

/// ker(A) ⊆ R^[column degrees], generated by K and presented by ker K.
function kernelModule(A: MatrixValue, span: Span, opts: ComputeOptions): ModuleValue {
  const target = rowGrading(A, span);
  const source = A.rows.length === 0 ? new Array<number>(A.cols).fill(0) : columnDegrees(A.rows, target);
  const rows = A.rows.length === 0 ? [] : A.rows;
  const K = A.rows.length === 0 ? identity(A.ring, A.cols) : kernelOver(A.ring, rows, source, target, span, opts);
  const gens = K[0]?.length ?? 0;
  if (gens === 0) return freeModuleValue(A.ring, []);
  const degs = columnDegrees(K, source);
  return tidy(moduleValue(A.ring, kernelOver(A.ring, K, degs, source, span, opts), degs), opts);
}

function identity(ring: RingValue, n: number): Poly[][] {
  return Array.from({ length: n }, (_, a) => Array.from({ length: n }, (_, b) => (a === b ? one(ring.poly) : zero(ring.poly))));
}

function matrixArg(v: Value, span: Span): MatrixValue {
  if (v.type !== "Matrix") throw runtime(`expected a Matrix, got ${v.type}`, span);
  return v;
}

function freeDegrees(v: Value, span: Span): number[] {
  if (v.type === "Int") {
    if (v.value < 0n) throw runtime(`the rank must be at least 0, got ${v.value}`, span);
    if (v.value > BigInt(MAX_FREE_RANK)) throw limit(`the rank ${v.value} is beyond the limit ${MAX_FREE_RANK}`, span, "freeRank");
    return new Array<number>(Number(v.value)).fill(0);
  }
  if (v.type !== "List") throw runtime(`expected an Int or a List of Int, got ${v.type}`, span);
  if (v.items.length > MAX_FREE_RANK) throw limit(`the rank ${v.items.length} is beyond the limit ${MAX_FREE_RANK}`, span, "freeRank");
  return v.items.map((x, k) => {
    if (x.type !== "Int") throw runtime(`degree ${k + 1} must be an Int, got ${x.type}`, span);
    if (x.value > BigInt(MAX_MODULE_DEGREE) || x.value < -BigInt(MAX_MODULE_DEGREE))
      throw limit(`degree ${x.value} is beyond the limit ±${MAX_MODULE_DEGREE}`, span, "moduleDegree");
    return Number(x.value);
  });
}

/// R^n and R^[d1, …].
export function freePower(l: Value, r: Value, c: OpContext): Value {
  if (l.type !== "Ring") throw runtime(`expected a Ring, got ${l.type}`, c.leftSpan);
  return freeModuleValue(l, freeDegrees(r, c.rightSpan));
}

export const MODULE_OPERATORS: Record<string, (l: Value, r: Value, c: OpContext) => Value> = {
  "Ring ^ Int": freePower,
  "Ring ^ List<Int>": freePower,
};

export const MODULE_FUNCTIONS: Record<string, (args: readonly Value[], c: CallContext) => Value> = {
  "coker(Matrix)": ([A], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    const given = c.named.get("degrees");
    // a local ring has no grading: every generator in degree 0 (issue 16)
    if (M.ring.local && given === undefined)
      return moduleValue(
        M.ring,
        M.rows,
        M.rows.map(() => 0),
      );
    if (given === undefined) return moduleValue(M.ring, M.rows, rowGrading(M, c.argSpans[0]));
    return moduleValue(M.ring, M.rows, givenRowDegrees(M, given, c));
  },
  "image(Matrix)": ([A], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    if (M.ring.local) return localImageOrKernel(M, "image", c);
    return imageOf(M, c.argSpans[0], c.interp.session.compute);
  },
  "ker(Matrix)": ([A], c) => {
    const M = matrixArg(A, c.argSpans[0]);
    if (M.ring.local) return localImageOrKernel(M, "ker", c);
    return kernelModule(M, c.argSpans[0], c.interp.session.compute);
  },
  "module(Ideal)": ([I], c) => {
    if (I.type !== "Ideal") throw runtime(`expected an Ideal, got ${I.type}`, c.argSpans[0]);
    const A = matrixOf(I.ring, [I.gens], I.gens.length);
    return imageOf(A, c.argSpans[0], c.interp.session.compute);
  },
};

export const RESIDUE_PROPERTY: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  "Ring.residue": (v, _a, c) => {
    const r = v as RingValue;
    const vars = r.poly.vars.map((_, i) => reduceIn(r, variable(r.poly, i), c.interp.session.compute));
    return moduleValue(r, [vars], [0]);
  },
};

/// image(A) and ker(A) over a local ring, ungraded: kernels over S/J computed globally (they
/// commute with localisation). image(A) = F/ker A on the columns of A; ker A is generated by
/// the kernel vectors K and presented by ker K.
function localImageOrKernel(M: MatrixValue, which: "image" | "ker", c: CallContext): ModuleValue {
  const S = M.ring.poly;
  const opts = c.interp.session.compute;
  const cols = Array.from({ length: M.cols }, (_, k) => M.rows.map((row) => row[k]));
  const K = kernelColumns(S, M.rows.length, cols, M.ring.ideal, opts);
  const asRows = (vs: Poly[][], n: number) => Array.from({ length: n }, (_, r) => vs.map((v) => v[r]));
  if (which === "image") return moduleValue(M.ring, asRows(K, M.cols), new Array<number>(M.cols).fill(0));
  const rel = kernelColumns(S, M.cols, K, M.ring.ideal, opts);
  return moduleValue(M.ring, asRows(rel, K.length), new Array<number>(K.length).fill(0));
}
