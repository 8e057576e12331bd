/// The shapes of an F4 matrix (declared apart from f4-linalg.ts so that its WebAssembly
/// driver, f4-kernel.ts, and the pure TypeScript reduction share them without an import
/// cycle; f4-linalg.ts re-exports them as its API).

/// A sparse row: entries k < len at columns cols[off + k] with residues vals[k]; the first
/// entry is the leading one (coefficient 1 in a reducer row). Many rows share one `cols`
/// pool and the coefficient array of the polynomial they are a multiple of, so building a
/// row allocates nothing but this small object. Only the rows of D' and its echelon form
/// have column indices in increasing order.
export interface SparseRow {
  cols: Int32Array;
  off: number;
  len: number;
  vals: Float64Array;
}

export interface F4Matrix {
  /// Reducer rows by pivot column, in the combined numbering (A columns [0, nA), then B).
  pivots: SparseRow[];
  /// Rows to reduce, combined numbering.
  rows: SparseRow[];
  nA: number;
  ncols: number;
}
