/// The one table of limits (lib/limits.ts): values from the environment where allowed, and
/// README.md documents exactly the table in force.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { formatLimit, LIMIT_TABLE, limitsTableMarkdown, limitValue } from "../../lib/limits";
import { DEFAULT_LIMITS } from "../../lib/notation/limits";
import { MAX_VARIABLES } from "../../grammar/ring-literal";

describe("lib/limits", () => {
  it("takes a positive number from the environment and ignores anything else", () => {
    expect(limitValue("cellMemoryMb", { RINGSIDE_CELL_MEMORY_MB: "350" })).toBe(350);
    expect(limitValue("cellMemoryMb", { RINGSIDE_CELL_MEMORY_MB: "-5" })).toBe(LIMIT_TABLE.cellMemoryMb.value);
    expect(limitValue("cellMemoryMb", { RINGSIDE_CELL_MEMORY_MB: "lots" })).toBe(LIMIT_TABLE.cellMemoryMb.value);
    expect(limitValue("cellMemoryMb", {})).toBe(3072);
    // A limit without a variable is not changed by the environment.
    expect(limitValue("ringVariables", { RINGSIDE_RING_VARIABLES: "5" })).toBe(1000);
  });

  it("is what the evaluator and the grammar enforce", () => {
    expect(DEFAULT_LIMITS.maxIdealPower).toBe(LIMIT_TABLE.idealPower.value);
    expect(DEFAULT_LIMITS.maxListLength).toBe(LIMIT_TABLE.listLength.value);
    expect(MAX_VARIABLES).toBe(LIMIT_TABLE.ringVariables.value);
  });

  it("formats values for messages", () => {
    expect(formatLimit("cellTimeMs", 8000)).toBe("8 s");
    expect(formatLimit("largeValueBytes", 1024 * 1024)).toBe("1 MiB");
    expect(formatLimit("cellMemoryMb", 220)).toBe("220 MB");
  });

  it("is documented in README.md exactly", () => {
    const readme = readFileSync(path.resolve(__dirname, "../../README.md"), "utf8");
    const between = /<!-- limits:begin -->\n([\s\S]*?)\n<!-- limits:end -->/.exec(readme);
    expect(between, "README.md has a Limits table between <!-- limits:begin --> and <!-- limits:end -->").not.toBeNull();
    expect(between![1]).toBe(limitsTableMarkdown());
  });
});
