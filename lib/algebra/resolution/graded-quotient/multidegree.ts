/// Keys of the coordinate groups of one degree of a graded free module: a multidegree (an
/// exponent vector in N^n) when everything is Z^n-graded, else the whole degree. Branded, so
/// a key is built and read only here and is never confused with another string.
export type BlockKey = string & { readonly __blockKey: true };

/// The one group of a module that is not multigraded.
export const WHOLE_DEGREE = "*" as BlockKey;

export function multidegreeKey(e: readonly number[]): BlockKey {
  return e.join(",") as BlockKey;
}

/// The multidegree of a key; undefined for WHOLE_DEGREE.
export function multidegreeOf(key: BlockKey): number[] | undefined {
  return key === WHOLE_DEGREE ? undefined : key.split(",").map(Number);
}

/// The multidegree one variable lower, or null when it leaves N^n.
export function lowerKey(key: BlockKey, v: number): BlockKey | null {
  const e = multidegreeOf(key);
  if (!e) return key;
  if (e[v] === 0) return null;
  e[v]--;
  return multidegreeKey(e);
}

/// Numbers kept per (internal degree, group), such as kernel dimensions.
export class PerDegreeBlock {
  private readonly byDegree = new Map<number, Map<BlockKey, number>>();

  get(j: number, key: BlockKey): number | undefined {
    return this.byDegree.get(j)?.get(key);
  }

  set(j: number, key: BlockKey, value: number): void {
    let m = this.byDegree.get(j);
    if (!m) this.byDegree.set(j, (m = new Map()));
    m.set(key, value);
  }
}
