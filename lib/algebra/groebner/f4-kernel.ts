import { limitError } from "../errors";
import type { Ticker } from "../options";
import { F4_KERNEL_WASM } from "./f4-kernel-wasm";
import type { SparseRow } from "./f4-linalg-types";

/// The WebAssembly side of the F4 matrix reduction (source: kernel/f4-kernel.as.ts, built
/// by `npm run build:f4-kernel` into f4-kernel-wasm.ts). This file lays a matrix out in the
/// module's linear memory and drives it block by block, so the ticker (time limits,
/// cancellation) still runs between blocks of eight rows.
///
/// Memory: each reducer owns one instance (its own linear memory, which counts in the
/// process's resident memory). Instances are reused from matrix to matrix; one whose memory
/// grew past KEEP_BYTES is dropped when released (a WebAssembly memory never shrinks), so
/// the garbage collector returns it. When memory cannot grow, the reduction stops with the
/// engine's limit error.

/// Rows reduced together (the lanes of the kernel's accumulator).
const BLOCK = 8;
/// An idle instance is kept for the next matrix only while its memory is at most this.
const KEEP_BYTES = 32 << 20;
/// Where the caller's layout starts (above the module's own globals; checked on load).
const BASE = 1024;
const PAGE = 65536;
const GROW_STEP = 4 << 20;
/// WebAssembly's 32-bit address space.
const MAX_BYTES = 2 ** 32 - PAGE;

interface KernelExports {
  memory: WebAssembly.Memory;
  setup(
    p: number,
    mode: number,
    budget: number,
    nA: number,
    ncols: number,
    piv: number,
    acc: number,
    stage: number,
    stageLen: number,
    dense: number,
    etab: number,
    bump: number,
  ): void;
  heapBase(): number;
  lastPtr(): number;
  lastLen(): number;
  reduceBlock(rows: number, count: number): void;
  setEchelon(on: number): void;
  echelonRow(r: number): number;
}

let compiled: WebAssembly.Module | null = null;
let idle: KernelExports | null = null;

/// The memory of the instance kept for the next matrix (0: none), for tests.
export function idleKernelBytes(): number {
  return idle ? idle.memory.buffer.byteLength : 0;
}

function decodeBase64(s: string): Uint8Array<ArrayBuffer> {
  const bin = atob(s);
  const out = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) out[i] = bin.charCodeAt(i);
  return out;
}

function instantiate(): KernelExports {
  if (idle) {
    const k = idle;
    idle = null;
    return k;
  }
  compiled ??= new WebAssembly.Module(decodeBase64(F4_KERNEL_WASM));
  const k = new WebAssembly.Instance(compiled, {}).exports as unknown as KernelExports;
  if (k.heapBase() > BASE) throw new Error("f4-kernel: the module's data reaches past the caller's layout");
  return k;
}

function memoryError(bytes: number): Error {
  return limitError(
    "memory",
    `F4: the matrix of this step needs ${Math.ceil(bytes / 2 ** 20)} MB of WebAssembly memory, more than could be reserved`,
  );
}

/// Grows the instance's memory to at least `bytes`.
function ensure(k: KernelExports, bytes: number): void {
  const have = k.memory.buffer.byteLength;
  if (bytes <= have) return;
  if (bytes > MAX_BYTES) throw memoryError(bytes);
  // In steps of GROW_STEP, so a run of slowly growing matrices grows the memory a few times
  // rather than once a matrix (each grow costs), while it stays within 4 MB of the need
  // (the grown pages count in resident memory).
  const target = Math.ceil(bytes / GROW_STEP) * GROW_STEP;
  for (const want of target > bytes ? [target, bytes] : [bytes]) {
    try {
      k.memory.grow(Math.ceil((want - have) / PAGE));
      return;
    } catch {
      // refused: try the exact size, then give up
    }
  }
  throw memoryError(bytes);
}

/// The kernel's arithmetic for p: mode 0 adds products unreduced for `budget` row
/// operations (p < 2^24: a sum of that many products below p² plus a residue stays below
/// 2^64); mode 1 subtracts each product and adds p² back when negative (any p < 2^31).
export function kernelMode(p: number): { mode: number; budget: number } {
  if (p >= 2 ** 24) return { mode: 1, budget: 1 };
  const q = BigInt(p - 1) * BigInt(p - 1);
  const budget = (2n ** 64n - 1n - BigInt(p)) / q;
  return { mode: 0, budget: Number(budget > 2n ** 30n ? 2n ** 30n : budget) };
}

/// Byte addresses reach 2^32: arithmetic, not 32-bit bit operations.
const align = (x: number) => Math.ceil(x / 16) * 16;

/// The reducer rows of one matrix loaded into a kernel instance: reduces rows by them (the
/// B-part of a row: step 1 of f4-linalg.ts), and optionally brings the reduced rows to
/// echelon form as they come. Call `release()` when done.
export class WasmPivotReducer {
  private k: KernelExports | null;
  private readonly nB: number;
  private readonly rowTab: number;
  private readonly rowData: number;
  private readonly stage: number;
  private readonly stageLen: number;

  constructor(
    readonly p: number,
    pivots: readonly SparseRow[],
    readonly nA: number,
    readonly ncols: number,
    /// Tests only: another valid arithmetic (mode 1 for any p, mode 0 with a smaller budget).
    arithmetic: { mode: number; budget: number } = kernelMode(p),
  ) {
    const nB = ncols - nA;
    this.nB = nB;
    // Layout: pivot descriptions, the pivots' column arrays and residue arrays (each array
    // once: f4.ts builds all rows in one column pool, and the rows that are multiples of one
    // polynomial share its residues), the block's row descriptions and data, the
    // accumulator, the staged B-parts, the dense row and table of the echelon step, then the
    // echelon rows (grown by the kernel).
    const valsAt = new Map<Float64Array, number>();
    const colsEnd = new Map<Int32Array, number>();
    let valWords = 0;
    for (const r of pivots) {
      const end = r.off + r.len;
      if ((colsEnd.get(r.cols) ?? 0) < end) colsEnd.set(r.cols, end);
      if (!valsAt.has(r.vals)) {
        valsAt.set(r.vals, valWords);
        valWords += r.vals.length;
      }
    }
    const colsAt = new Map<Int32Array, number>();
    let colWords = 0;
    for (const [a, end] of colsEnd) {
      colsAt.set(a, colWords);
      colWords += end;
    }
    const piv = BASE;
    const cols = align(piv + 12 * nA);
    const vals = align(cols + 4 * colWords);
    this.rowTab = align(vals + 4 * valWords);
    this.rowData = align(this.rowTab + 12 * BLOCK);
    const acc = Math.ceil((this.rowData + BLOCK * 8 * ncols) / 64) * 64;
    this.stage = align(acc + 8 * BLOCK * ncols);
    this.stageLen = align(this.stage + BLOCK * 8 * nB);
    const dense = align(this.stageLen + 4 * BLOCK);
    const etab = align(dense + 8 * nB);
    const bump = align(etab + 8 * nB);
    const k = instantiate();
    this.k = k;
    try {
      ensure(k, bump + PAGE);
      const buf = k.memory.buffer;
      // A reused instance holds the last matrix: the accumulator, dense row and echelon table
      // must start at zero.
      new Uint8Array(buf, acc, this.stage - acc).fill(0);
      new Uint8Array(buf, dense, bump - dense).fill(0);
      const u32 = new Uint32Array(buf);
      for (const [v, at] of valsAt) u32.set(v, vals / 4 + at);
      for (const [a, at] of colsAt) u32.set(colsEnd.get(a)! === a.length ? a : a.subarray(0, colsEnd.get(a)), cols / 4 + at);
      for (let i = 0; i < nA; i++) {
        const r = pivots[i];
        const d = piv / 4 + 3 * i;
        u32[d] = cols + 4 * (colsAt.get(r.cols)! + r.off);
        u32[d + 1] = r.len;
        u32[d + 2] = vals + 4 * valsAt.get(r.vals)!;
      }
      const { mode, budget } = arithmetic;
      k.setup(p, mode, budget, nA, ncols, piv, acc, this.stage, this.stageLen, dense, etab, bump);
    } catch (e) {
      this.k = null;
      throw e;
    }
  }

  private kernel(): KernelExports {
    if (!this.k) throw new Error("f4-kernel: reducer used after release");
    return this.k;
  }

  /// Reduces rows[from, from + count) (count ≤ 8, each without its first `skip` entries) and
  /// stages their B-parts in the kernel.
  private reduceBlock(rows: readonly SparseRow[], from: number, count: number, skip: number, echelon: boolean): void {
    const k = this.kernel();
    k.setEchelon(echelon ? 1 : 0);
    const u32 = new Uint32Array(k.memory.buffer);
    for (let r = 0; r < count; r++) {
      const row = rows[from + r];
      const len = Math.max(0, row.len - skip);
      const c = this.rowData / 4 + r * 2 * this.ncols,
        v = c + this.ncols;
      u32.set(row.cols.subarray(row.off + skip, row.off + skip + len), c);
      u32.set(row.vals.subarray(skip, skip + len), v);
      const d = this.rowTab / 4 + 3 * r;
      u32[d] = c * 4;
      u32[d + 1] = len;
      u32[d + 2] = v * 4;
    }
    k.reduceBlock(this.rowTab, count);
  }

  /// The staged B-part of block row r.
  private staged(r: number): SparseRow | null {
    const k = this.kernel();
    const len = new Uint32Array(k.memory.buffer, this.stageLen + 4 * r, 1)[0];
    if (len === 0) return null;
    const at = this.stage + r * 8 * this.nB;
    const cols = new Int32Array(len),
      vals = new Float64Array(len);
    cols.set(new Int32Array(k.memory.buffer, at, len));
    vals.set(new Uint32Array(k.memory.buffer, at + 4 * this.nB, len));
    return { cols, off: 0, len, vals };
  }

  /// The B-part (remainder in the B columns, renumbered from 0, increasing) of each row
  /// without its first `skip` entries, reduced by the pivot rows; null when zero.
  reduceRows(rows: readonly SparseRow[], skip = 0, ticker?: Ticker): (SparseRow | null)[] {
    const out: (SparseRow | null)[] = [];
    for (let i = 0; i < rows.length; i += BLOCK) {
      const count = Math.min(BLOCK, rows.length - i);
      // One tick a row, as the row-by-row reduction did: a block takes milliseconds.
      if (ticker) for (let r = 0; r < count; r++) ticker.tick();
      this.reduceBlock(rows, i, count, skip, false);
      for (let r = 0; r < count; r++) out.push(this.staged(r));
    }
    return out;
  }

  /// Step 1 and step 2 together: each row is reduced by the pivot rows, then by the echelon
  /// rows found before it; what is left is made monic and becomes an echelon row. Returns the
  /// echelon rows (B numbering, increasing columns) with the index of the row each came from.
  reduceAndEchelon(rows: readonly SparseRow[], ticker: Ticker): { rows: SparseRow[]; from: number[] } {
    const k = this.kernel();
    const out: SparseRow[] = [],
      from: number[] = [];
    for (let i = 0; i < rows.length; i += BLOCK) {
      const count = Math.min(BLOCK, rows.length - i);
      for (let r = 0; r < count; r++) ticker.tick();
      this.reduceBlock(rows, i, count, 0, true);
      for (let r = 0; r < count; r++) {
        const lead = k.echelonRow(r);
        if (lead === -1) continue;
        if (lead === -2) throw memoryError(k.memory.buffer.byteLength + 8 * this.nB);
        const len = k.lastLen(),
          at = k.lastPtr();
        const cols = new Int32Array(len),
          vals = new Float64Array(len);
        cols.set(new Int32Array(k.memory.buffer, at, len));
        vals.set(new Uint32Array(k.memory.buffer, at + 4 * len, len));
        out.push({ cols, off: 0, len, vals });
        from.push(i + r);
      }
    }
    return { rows: out, from };
  }

  /// Returns the instance for the next matrix (or drops it when its memory grew large).
  release(): void {
    const k = this.k;
    this.k = null;
    if (k && k.memory.buffer.byteLength <= KEEP_BYTES) idle = k;
  }
}
