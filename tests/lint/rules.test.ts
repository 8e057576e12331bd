// The lint rules of eslint.config.mjs fail on deliberate violations (an import cycle, an
// upward import across the layer table of DEVELOPERS.md), so they cannot silently stop
// working; and the same imports in the allowed direction pass.
import path from "node:path";
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(__dirname, "../..");
let eslint: ESLint;

beforeAll(() => {
  // ignore: false, so the fixtures folder (ignored by `npx eslint .`) is linted here.
  eslint = new ESLint({ cwd: root, ignore: false });
});

/// The rule ids and messages ESLint reports for `code` placed at `file` (relative to the root).
async function lint(file: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result.messages.map((m) => ({ rule: m.ruleId, message: m.message }));
}

const rulesOf = (messages: { rule: string | null }[]) => messages.map((m) => m.rule);

describe("lint rules on deliberate violations", { timeout: 120_000 }, () => {
  it("reports an import cycle", async () => {
    const [a] = await eslint.lintFiles([path.join(root, "tests/lint/fixtures/cycle-a.ts")]);
    expect(a.messages.map((m) => m.ruleId)).toContain("import-x/no-cycle");
  });

  it("keeps the engine free of imports from outside it", async () => {
    const upward = await lint("lib/algebra/lint-fixture.ts", 'import { db } from "@/db/client";\nexport const x = db;\n');
    expect(rulesOf(upward)).toContain("import-x/no-restricted-paths");
    expect(upward.find((m) => m.rule === "import-x/no-restricted-paths")!.message).toContain(
      "lib/algebra/ may import nothing outside itself",
    );
    const evaluator = await lint(
      "lib/algebra/lint-fixture.ts",
      'import { evaluate } from "../notation/evaluate";\nexport const x = evaluate;\n',
    );
    expect(rulesOf(evaluator)).toContain("import-x/no-restricted-paths");
    const inside = await lint("lib/algebra/lint-fixture.ts", 'import { parsePoly } from "./index";\nexport const x = parsePoly;\n');
    expect(rulesOf(inside)).not.toContain("import-x/no-restricted-paths");
  });

  it("lets the grammar import only types from the engine", async () => {
    const value = await lint("grammar/lint-fixture.ts", 'import { parsePoly } from "../lib/algebra/index";\nexport const x = parsePoly;\n');
    expect(rulesOf(value)).toContain("@typescript-eslint/no-restricted-imports");
    const types = await lint("grammar/lint-fixture.ts", 'import type { Poly } from "../lib/algebra/index";\nexport type X = Poly;\n');
    expect(types).toEqual([]);
  });

  it("keeps server code out of client components", async () => {
    for (const server of ["@/db/client", "@/lib/auth/current-user", "@/lib/sessions/store", "@/lib/compute/run-in-slot"]) {
      const found = await lint("app/_console/lint-fixture.tsx", `import * as s from "${server}";\nexport const x = s;\n`);
      expect(rulesOf(found), server).toContain("import-x/no-restricted-paths");
    }
    const drizzle = await lint("app/_console/lint-fixture.tsx", 'import { sql } from "drizzle-orm";\nexport const x = sql;\n');
    expect(rulesOf(drizzle)).toContain("import-x/no-restricted-paths");
    const wire = await lint("app/_console/lint-fixture.tsx", 'import type { Cell } from "@/lib/wire/reading";\nexport type X = Cell;\n');
    expect(wire).toEqual([]);
  });

  it("lets route handlers reach the database only through lib/", async () => {
    const direct = await lint("app/api/lint-fixture/route.ts", 'import { db } from "@/db/client";\nexport const x = db;\n');
    expect(rulesOf(direct)).toContain("import-x/no-restricted-paths");
    const throughLib = await lint(
      "app/api/lint-fixture/route.ts",
      'import { listSessions } from "@/lib/sessions/store";\nexport const x = listSessions;\n',
    );
    expect(throughLib).toEqual([]);
  });

  it("keeps the wire contract free of server code", async () => {
    const found = await lint("lib/wire/lint-fixture.ts", 'import { cellView } from "../sessions/views";\nexport const x = cellView;\n');
    expect(rulesOf(found)).toContain("import-x/no-restricted-paths");
  });
});
