/// A free resolution as the trade writes it: each free module with its twists over the
/// named ring, F_i = ⊕_j S(−j)^{β_ij} (Eisenbud, The Geometry of Syzygies, GTM 229, §1B:
/// the graded Betti numbers β_ij count the generators of degree j of F_i), in our own
/// layout: S ← S(−2)³ ← S(−3)² ← 0, the differentials as matrices on request.
import type { ValueReading } from "@/lib/wire/reading";
import { texOfMatrix, texOfVariable } from "./tex";

/// The §9 fields of a Complex this module reads beyond the shared ValueReading type.
type ComplexJson = ValueReading & { readonly maps?: readonly (ValueReading | null)[] | null };

export interface ResolutionView {
  /// TeX of the ring's name (the binding that holds it, else R)
  readonly ring: string;
  /// TeX of each free module F_0, F_1, …
  readonly modules: readonly string[];
  /// the whole chain: 0 ← F_0 ← F_1 ← … ← 0 (… when truncated)
  readonly chain: string;
  /// TeX of the differential d_i : F_i → F_{i−1}, i = 1, 2, … (null when the value has none)
  readonly differentials: readonly string[] | null;
}

/// TeX of the free module ⊕_j R(−j)^{b_j} from its (internal degree, rank) pairs,
/// degrees ascending; R(0) is written R and an exponent 1 is left out.
export function texOfTwistedFree(ring: string, parts: readonly (readonly [number, number])[]): string {
  const nonzero = parts.filter(([, b]) => b !== 0);
  if (nonzero.length === 0) return "0";
  return [...nonzero]
    .sort(([d], [e]) => d - e)
    .map(([j, b]) => `${ring}${j === 0 ? "" : `(${-j})`}${b === 1 ? "" : `^{${b}}`}`)
    .join(" \\oplus ");
}

/// TeX of a binding name used as a ring's name.
export function texOfRingName(name: string): string {
  return texOfVariable(name);
}

export function resolutionView(v: ComplexJson, ringName: string | null): ResolutionView {
  const ring = ringName ? texOfRingName(ringName) : "R";
  const entries = (v.betti ?? []).filter((e) => Array.isArray(e) && e.length === 3);
  const ranks = v.ranks ?? [];
  const length = Math.max(ranks.length, ...entries.map(([i]) => i + 1));
  const modules = Array.from({ length }, (_, i) => {
    const parts = entries.filter(([h]) => h === i).map(([, j, b]) => [j, b] as const);
    // Without Betti numbers for this degree the rank alone is known: R^r, untwisted.
    if (parts.length === 0) return (ranks[i] ?? 0) === 0 ? "0" : ranks[i] === 1 ? ring : `${ring}^{${ranks[i]}}`;
    return texOfTwistedFree(ring, parts);
  });
  const complete = v.complete !== false;
  const chain = `0 \\leftarrow ${modules.join(" \\leftarrow ")}${modules.length ? (complete ? " \\leftarrow 0" : " \\leftarrow \\cdots") : ""}`;
  const maps = Array.isArray(v.maps) ? v.maps : null;
  const differentials = maps
    ? maps.map((m) => {
        const rows = m?.rows;
        return Array.isArray(rows) && rows.every((r) => Array.isArray(r) && r.every((c) => typeof c === "string"))
          ? texOfMatrix(rows as readonly (readonly string[])[])
          : "\\text{(not available)}";
      })
    : null;
  return { ring, modules, chain, differentials };
}

/// The name of the session's binding that holds `ring` (same field, variables and
/// defining ideal), or null; the first such name in `candidates` order.
export function ringNameOf(
  ring: ValueReading | undefined,
  candidates: readonly { readonly name: string; readonly value: ValueReading }[],
): string | null {
  if (!ring) return null;
  const same = (a: readonly string[] | undefined, b: readonly string[] | undefined) =>
    (a ?? []).length === (b ?? []).length && (a ?? []).every((x, i) => x === (b ?? [])[i]);
  const hit = candidates.find(
    (c) =>
      c.value.type === "Ring" &&
      c.value.field === ring.field &&
      same(c.value.vars, ring.vars) &&
      same(
        c.value.ideal?.filter((g) => g !== "0"),
        ring.ideal?.filter((g) => g !== "0"),
      ),
  );
  return hit?.name ?? null;
}
