// Every name of the signature table (grammar/signatures.ts) type-checks now; those whose engine part (2 or 3) has not
// landed end with a runtime Error naming the part. This test LISTS them, compared both
// ways with the signature table and the evaluator's tables of implementations: it fails
// when a name is implemented but still listed here, or is neither implemented nor listed.
import { describe, expect, it } from "vitest";
import { OPERATORS, type EnginePart } from "@/grammar/signatures";
import { signatureEntries } from "@/lib/notation/builtins";
import { IMPLEMENTED_OPERATORS, operatorKey } from "@/lib/notation/operators";
import { pendingError } from "@/lib/notation/pending";

/// Waiting for engine part 2 (modules, resolutions, Tor/Ext, depth, pd, regularity).
const PART_2: string[] = [];

/// Waiting for engine part 3 (quotient-ring and Artinian invariants, Burch, Poincaré, families).
const PART_3: string[] = [];

const table = [
  ...signatureEntries(),
  ...OPERATORS.map((o) => ({ key: operatorKey(o), part: o.part, implemented: IMPLEMENTED_OPERATORS.has(operatorKey(o)) })),
];

describe("names waiting for engine parts 2 and 3", () => {
  const listed = new Map<string, EnginePart>([...PART_2.map((k) => [k, 2] as const), ...PART_3.map((k) => [k, 3] as const)]);

  it("every listed name is in the signature table with that part", () => {
    for (const [key, part] of listed) {
      const row = table.find((t) => t.key === key);
      expect(row, `${key} is not in the signature table`).toBeDefined();
      expect(row!.part, key).toBe(part);
    }
  });

  it("no listed name is implemented (remove it from this list when it is)", () => {
    for (const key of listed.keys()) expect(table.find((t) => t.key === key)!.implemented, key).toBe(false);
  });

  it("every part-2/3 name is implemented or listed here", () => {
    const missing = table.filter((t) => t.part >= 2 && !t.implemented && !listed.has(t.key)).map((t) => t.key);
    expect(missing).toEqual([]);
  });

  it("every part-0/1 name is implemented", () => {
    expect(table.filter((t) => t.part <= 1 && !t.implemented).map((t) => t.key)).toEqual([]);
  });

  it("the pending Error names the engine part that will provide the name", () => {
    const span = { from: { line: 1, col: 1, offset: 0 }, to: { line: 1, col: 8, offset: 7 } };
    const e = pendingError("resolve", 2, span);
    expect(e.kind).toBe("runtime");
    expect(e.message).toBe(
      "resolve is provided by engine part 2 (modules, resolutions over polynomial rings, Tor/Ext, depth, pd and regularity), which is not available yet",
    );
  });
});
