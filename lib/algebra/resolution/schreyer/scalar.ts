import type { Coeffs } from "../../field/coeffs";
import { checkpoint, type ComputeOptions } from "../../options";

/// The rank of a matrix over the field, given as sparse rows (column → nonzero entry),
/// by Gaussian elimination.
export function scalarRank<C>(K: Coeffs<C>, rows: Map<number, C>[], opts?: ComputeOptions): number {
  const pivots = new Map<number, Map<number, C>>();
  let rank = 0;
  for (const row0 of rows) {
    checkpoint(opts, { stage: "rank", detail: `${rows.length} rows` });
    const row = new Map(row0);
    for (;;) {
      let lead = -1;
      for (const [c, v] of row) if (!K.isZero(v) && (lead < 0 || c < lead)) lead = c;
      if (lead < 0) break;
      const p = pivots.get(lead);
      if (!p) {
        pivots.set(lead, row);
        rank++;
        break;
      }
      const s = K.mul(row.get(lead) as C, K.inv(p.get(lead) as C));
      for (const [c, v] of p) {
        const w = K.sub(row.get(c) ?? K.zero, K.mul(s, v));
        if (K.isZero(w)) row.delete(c);
        else row.set(c, w);
      }
    }
  }
  return rank;
}
