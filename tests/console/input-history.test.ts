import { describe, expect, it } from "vitest";
import { FRESH_CURSOR, recallNewer, recallOlder } from "@/lib/editor/input-history";

describe("input history recall", () => {
  const entries = ["S := Q[x, y]", "I := <x*y>", "resolve(S / I).betti"];

  it("walks back from the newest entry and stops at the oldest", () => {
    const a = recallOlder(entries, FRESH_CURSOR, "draft")!;
    expect(a.text).toBe("resolve(S / I).betti");
    const b = recallOlder(entries, a.cursor, a.text)!;
    const c = recallOlder(entries, b.cursor, b.text)!;
    expect(c.text).toBe("S := Q[x, y]");
    expect(recallOlder(entries, c.cursor, c.text)).toBeNull();
  });

  it("walks forward and gives the draft back past the newest entry", () => {
    const a = recallOlder(entries, FRESH_CURSOR, "half typed")!;
    const b = recallOlder(entries, a.cursor, a.text)!;
    const c = recallNewer(entries, b.cursor)!;
    expect(c.text).toBe("resolve(S / I).betti");
    const d = recallNewer(entries, c.cursor)!;
    expect(d.text).toBe("half typed");
    expect(d.cursor.index).toBeNull();
    expect(recallNewer(entries, d.cursor)).toBeNull();
  });

  it("has nothing to recall in an empty session", () => {
    expect(recallOlder([], FRESH_CURSOR, "")).toBeNull();
  });
});
