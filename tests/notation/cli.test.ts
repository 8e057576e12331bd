// The real CLI (lib/cli/README.md), spawned as a user runs it: exit status 0/1/2, text
// output, and --json lines that parse and match the §9 encoding.
import { spawn } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ErrorJson, ValueJson } from "@/lib/notation/json";

const root = path.resolve(__dirname, "..", "..");
const launcher = path.join(root, "lib", "cli", "ringside.mjs");
const dir = mkdtempSync(path.join(os.tmpdir(), "ringside-cli-"));

/// Runs a command to completion without blocking the test worker.
function exec(
  command: string,
  args: string[],
  input: string,
): Promise<{ status: number | null; stdout: string; stderr: string; lines: string[] }> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: root });
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (d) => (stdout += d));
    child.stderr.on("data", (d) => (stderr += d));
    child.on("error", reject);
    child.on("close", (status) => resolve({ status, stdout, stderr, lines: stdout.split("\n").filter((l) => l !== "") }));
    child.stdin.end(input);
  });
}

const cli = (args: string[], input = "") => exec(process.execPath, [launcher, ...args], input);

function file(name: string, source: string): string {
  const p = path.join(dir, name);
  writeFileSync(p, source);
  return p;
}

const PROGRAM = "S := GF(32003)[x, y, z, w]\nI := <x*z, x*w, y*z, y*w>\nx*z + y*w in I\n(S / I).hilbert\n";

describe("ringside eval", () => {
  it("prints each statement's result as text and exits 0", async () => {
    const r = await cli(["eval", file("ok.rs", PROGRAM)]);
    expect(r.status).toBe(0);
    // two planes P = (x, y), Q = (z, w) meeting at a point: HS(S/P∩Q) = HS(S/P) + HS(S/Q) − HS(S/(P+Q))
    // = 2/(1−t)^2 − 1 = (1 − 4t^2 + 4t^3 − t^4)/(1 − t)^4 (common practice)
    expect(r.lines).toEqual(["S := GF(32003)[x, y, z, w]", "I := <x*z, x*w, y*z, y*w>", "true", "(1-4*t^2+4*t^3-t^4)/(1-t)^4"]);
  });

  it("--json prints one §9 object per line", async () => {
    const r = await cli(["eval", "--json", file("ok2.rs", PROGRAM)]);
    expect(r.status).toBe(0);
    const objs = r.lines.map((l) => JSON.parse(l));
    for (const o of objs) expect(ValueJson.safeParse(o).success, JSON.stringify(o)).toBe(true);
    expect(objs[0]).toEqual({
      type: "Ring",
      text: "GF(32003)[x, y, z, w]",
      field: "GF(32003)",
      vars: ["x", "y", "z", "w"],
      degrees: [1, 1, 1, 1],
      order: "grevlex",
      ideal: [],
    });
    expect(objs[1]).toMatchObject({ type: "Ideal", text: "<x*z, x*w, y*z, y*w>", gens: ["x*z", "x*w", "y*z", "y*w"] });
    expect(objs[2]).toEqual({ type: "Bool", text: "true", value: true });
    expect(objs[3]).toEqual({
      type: "HilbertSeries",
      text: "(1-4*t^2+4*t^3-t^4)/(1-t)^4",
      numerator: ["1", "0", "-4", "4", "-1"],
      denominator: "(1-t)^4",
    });
  });

  it("resolves over a quotient ring and guesses the Poincaré series (engine part 3)", async () => {
    // J. Tate, Illinois J. Math. 1957: k over k[x,y]/(x^2, y^2) has β_i = i + 1 and P = 1/(1−t)^2
    const src =
      "S := GF(101)[x, y]\nR := S / <x^2, y^2>\nresolve(R / R.maximal, length = 3).ranks\nP := poincare(R / R.maximal, terms = 6)\n";
    const r = await cli(["eval", "--json", file("quot.rs", src)]);
    expect(r.status).toBe(0);
    const objs = r.lines.map((l) => JSON.parse(l));
    for (const o of objs) expect(ValueJson.safeParse(o).success, JSON.stringify(o)).toBe(true);
    expect(objs[2].text).toBe("[1, 2, 3, 4]");
    expect(objs[3]).toMatchObject({
      type: "Series",
      coefficients: ["1", "2", "3", "4", "5", "6"],
      rational: "1/(1-2*t+t^2)",
      guessed: true,
      checked: 2,
    });
  });

  it("reads standard input when FILE is omitted or -", async () => {
    expect((await cli(["eval"], "2^10\n")).lines).toEqual(["1024"]);
    expect((await cli(["eval", "-"], "3/6\n")).lines).toEqual(["1/2"]);
  });

  it("a failing statement: its Error is printed, nothing after it runs, exit 1", async () => {
    const src = "a := 0\nb := 1 / a\nc := 3\n";
    const r = await cli(["eval", "--json", file("fail.rs", src)]);
    expect(r.status).toBe(1);
    expect(r.lines).toHaveLength(2);
    const err = JSON.parse(r.lines[1]);
    expect(ErrorJson.parse(err)).toEqual({
      type: "Error",
      text: "runtime error at 2:10-2:11: division by zero",
      kind: "runtime",
      message: "division by zero",
      span: { from: { line: 2, col: 10 }, to: { line: 2, col: 11 } },
    });
    const t = await cli(["eval", file("fail2.rs", src)]);
    expect(t.status).toBe(1);
    expect(t.lines).toEqual(["a := 0", "runtime error at 2:10-2:11: division by zero"]);
  });

  it("a program that does not check runs nothing and exits 1 with its errors", async () => {
    const r = await cli(["eval", "--json"], "S := Q[x]\n2x\n");
    expect(r.status).toBe(1);
    const errs = r.lines.map((l) => ErrorJson.parse(JSON.parse(l)));
    expect(errs[0]).toMatchObject({ kind: "parse", span: { from: { line: 2, col: 1 } } });
    expect(errs[0].message).toMatch(/2\*x/);
  });

  it("bad usage exits 2 with a usage message", async () => {
    for (const args of [[], ["run"], ["eval", "--fast"], ["eval", "a.rs", "b.rs"], ["eval", path.join(dir, "missing.rs")]]) {
      const r = await cli(args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.stderr).toMatch(/usage: ringside eval \[--json\] \[FILE\]/);
      expect(r.stdout).toBe("");
    }
  });

  it("runs as `npx ringside` from the repository (package.json bin)", async () => {
    const r = await exec("npx", ["--no-install", "ringside", "eval"], "sum([1, 2, 3])\n");
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe("6");
  });
});

describe("ringside eval: sweeps run inline", () => {
  it("prints the Table and a progress line on stderr (done/total, failures, rate)", async () => {
    const r = await cli(
      ["eval"],
      "S := Q[a, b]\nT := sweep(monomial_ideals(S, degree = 2, max_gens = 3), I -> {pd: (S / I).pd})\nT.length\n",
    );
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^T := index \| label \| status \| seconds \| pd$/m);
    expect(r.lines[r.lines.length - 1]).toBe("7");
    // not a terminal: one line per 5 % of the members, the last one says 7/7
    expect(r.stderr).toMatch(/^sweep: 7\/7 members, 0 failed, [\d.]+ members\/s/m);
  });

  it("experiments without a database is a usage error, not a crash", async () => {
    const env = { ...process.env };
    delete env.DATABASE_URL;
    const r = await new Promise<{ status: number | null; stderr: string }>((resolve, reject) => {
      const child = spawn(process.execPath, [launcher, "experiments", "list"], { cwd: root, env });
      let stderr = "";
      child.stderr.on("data", (d) => (stderr += d));
      child.on("error", reject);
      child.on("close", (status) => resolve({ status, stderr }));
      child.stdin.end();
    });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/DATABASE_URL/);
  });
});
