/// Reading the named options of a built-in call (`length = 6`, `terms = 8`).
import type { CallContext } from "./context";
import { limit, runtime } from "./errors";
import { LIMIT_TABLE } from "../limits";

/// A bound given as a named option: a non-negative Int, at most the named limit of
/// lib/limits.ts; undefined when absent.
export function bound(c: CallContext, name: string, limitName: "homologicalIndex" | "internalDegree"): number | undefined {
  const max = LIMIT_TABLE[limitName].value;
  const v = c.named.get(name);
  if (v === undefined) return undefined;
  if (v.type !== "Int") throw runtime(`${name} must be an Int, got ${v.type}`, c.span);
  if (v.value < 0n) throw runtime(`${name} must be at least 0, got ${v.value}`, c.span);
  if (v.value > BigInt(max)) throw limit(`${name} = ${v.value} is beyond the limit ${max}`, c.span, limitName);
  return Number(v.value);
}
