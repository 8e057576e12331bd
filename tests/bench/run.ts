// npm run bench [-- NAME-FILTER] [--readme] (tests/bench/run.mjs bundles this file and calls main): runs every case in a child process of its own
// (tests/bench/child.mjs: the cases bundled like the CLI, a fresh heap, peak memory read from
// process.resourceUsage().maxRSS), then the same computation in SymPy for the cases that
// have one (one child process per case, killed after the timeout), and prints the tables of
// issue 17 with seconds, peak memory, goals and the SymPy ratio. With --readme the README's
// Performance section between its bench markers is rewritten from this run.
// Environment: RINGSIDE_SYMPY_PYTHON (default /usr/bin/python3), RINGSIDE_BENCH_SYMPY_TIMEOUT
// in seconds (default 300), RINGSIDE_BENCH_NO_SYMPY=1 to skip SymPy.
import { spawn } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { allCases } from "./child";
import type { BenchCase } from "./cases";

const python = process.env.RINGSIDE_SYMPY_PYTHON || "/usr/bin/python3";
const sympyTimeoutS = Number(process.env.RINGSIDE_BENCH_SYMPY_TIMEOUT || 300);
/// The repository root (run.mjs passes it: this module runs bundled from a cache folder).
let root = process.cwd();
const sympyScript = () => path.join(root, "tests", "algebra", "sympy", "groebner_batch.py");
const childScript = () => path.join(root, "tests", "bench", "child.mjs");

type Timing = { seconds: number; cpuSeconds: number; size: number; label: string; peakMb: number } | { failed: string; peakMb?: number };
type SympyTiming = { seconds: number; size: number } | { failed: string };

function runChild(c: BenchCase): Promise<Timing> {
  const heapMb = c.heapMb ?? 4096;
  const timeoutS = c.timeoutS ?? 600;
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [`--max-old-space-size=${heapMb}`, childScript(), c.name], {
      cwd: root,
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "",
      err = "";
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
      child.kill("SIGKILL");
    }, timeoutS * 1000);
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (err += d));
    child.on("close", (code) => {
      clearTimeout(timer);
      if (timedOut) return resolve({ failed: `> ${timeoutS} s (stopped)` });
      const line = out.trim().split("\n").pop() ?? "";
      if (code === 0 && line.startsWith("{")) return resolve(JSON.parse(line));
      const oom = /heap out of memory|Allocation failed/i.test(err);
      resolve({
        failed: oom ? `out of memory (${heapMb} MB heap)` : `failed (${code}): ${err.trim().split("\n").slice(-3).join(" ").slice(0, 200)}`,
      });
    });
  });
}

function runSympy(c: BenchCase): Promise<SympyTiming> {
  return new Promise((resolve) => {
    const child = spawn(python, [sympyScript()], { stdio: ["pipe", "pipe", "pipe"] });
    let out = "",
      err = "";
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      resolve({ failed: `SymPy > ${sympyTimeoutS} s` });
    }, sympyTimeoutS * 1000);
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (err += d));
    child.on("error", (e) => {
      clearTimeout(timer);
      resolve({ failed: `SymPy not runnable: ${e.message}` });
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      if (code !== 0) return resolve({ failed: `SymPy failed: ${err.trim().split("\n").pop() ?? code}` });
      const [r] = JSON.parse(out);
      resolve("error" in r ? { failed: `SymPy error: ${r.error}` } : { seconds: r.seconds, size: r.basis.length });
    });
    child.stdin.end(JSON.stringify([c.sympy]));
  });
}

const fmtS = (s: number) => (s < 10 ? s.toFixed(2) : s.toFixed(1));

function goalText(c: BenchCase): string {
  const g = c.goal;
  if (!g) return "–";
  const parts: string[] = [];
  if (g.seconds !== undefined) parts.push(`≤ ${g.seconds} s`);
  if (g.mb !== undefined) parts.push(`≤ ${g.mb >= 1024 ? `${g.mb / 1024} GB` : `${g.mb} MB`}`);
  if (g.ratio !== undefined) parts.push(`≥ ${g.ratio}× SymPy`);
  return parts.join(", ");
}

function met(c: BenchCase, o: Timing, ratio: number | null): string {
  const g = c.goal;
  if (!g) return "";
  if ("failed" in o) return "no";
  const ok =
    (g.seconds === undefined || o.seconds <= g.seconds) &&
    (g.mb === undefined || o.peakMb <= g.mb) &&
    (g.ratio === undefined || (ratio !== null && ratio >= g.ratio));
  return ok ? "yes" : "no";
}

function table(rows: { c: BenchCase; o: Timing; t: SympyTiming | null }[], withSympy: boolean): string[] {
  const head = withSympy
    ? [
        "| case | seconds (wall) | CPU seconds | peak memory | result | SymPy (s) | SymPy / Ringside | goal | goal met | before |",
        "|---|---|---|---|---|---|---|---|---|---|",
      ]
    : ["| case | seconds (wall) | CPU seconds | peak memory | result | goal | goal met | before |", "|---|---|---|---|---|---|---|---|"];
  const body = rows.map(({ c, o, t }) => {
    const ok = !("failed" in o);
    const ratio = ok && t && !("failed" in t) ? t.seconds / o.seconds : null;
    const cells = [
      c.name,
      ok ? fmtS(o.seconds) : o.failed,
      ok ? fmtS(o.cpuSeconds) : "–",
      ok ? `${Math.round(o.peakMb)} MB` : "–",
      ok ? `${o.size >= 0 ? `${o.label} ${o.size}` : o.label}${t && !("failed" in t) && t.size !== o.size ? " (sizes differ!)" : ""}` : "–",
    ];
    if (withSympy) cells.push(!t ? "not run" : "failed" in t ? t.failed : fmtS(t.seconds), ratio !== null ? `${ratio.toFixed(0)}×` : "–");
    cells.push(goalText(c), met(c, o, ratio), c.before ?? "–");
    return `| ${cells.join(" | ")} |`;
  });
  return [...head, ...body];
}

export async function main(repositoryRoot: string, args: readonly string[]): Promise<void> {
  root = repositoryRoot;
  const writeReadme = args.includes("--readme");
  const filter = args.find((a) => !a.startsWith("--"));
  const selected = allCases.filter((c) => !filter || c.name.includes(filter));
  const loadBefore = os.loadavg();
  const started = new Date();
  const results: { c: BenchCase; o: Timing; t: SympyTiming | null }[] = [];
  for (const c of selected) {
    const o = await runChild(c);
    console.log(
      `ours   ${c.name}: ${"failed" in o ? o.failed : `${fmtS(o.seconds)} s wall, ${fmtS(o.cpuSeconds)} s CPU, ${Math.round(o.peakMb)} MB peak, ${o.label}${o.size >= 0 ? ` ${o.size}` : ""}`}`,
    );
    results.push({ c, o, t: null });
  }
  if (process.env.RINGSIDE_BENCH_NO_SYMPY !== "1") {
    for (const r of results) {
      if (!r.c.sympy) continue;
      r.t = await runSympy(r.c);
      console.log(`sympy  ${r.c.name}: ${"failed" in r.t ? r.t.failed : `${fmtS(r.t.seconds)} s, basis size ${r.t.size}`}`);
    }
  }
  const loadAfter = os.loadavg();
  const cpus = os.cpus();
  const machine = `${cpus[0]?.model ?? "unknown CPU"}, ${cpus.length} cores, Node.js ${process.version}`;
  const load = `load average ${loadBefore[0].toFixed(1)} at the start and ${loadAfter[0].toFixed(1)} at the end on ${cpus.length} cores`;
  // The load at the end counts the bench's own child processes (about one busy core), so
  // only the load before the first case says whether others shared the machine.
  const idle =
    loadBefore[0] < 0.5
      ? "machine otherwise idle: the load at the end counts the bench's own processes"
      : "machine shared and busy: wall seconds include waiting for a core, CPU seconds do not";
  const groebner = results.filter((r) => r.c.table === "groebner");
  const resolution = results.filter((r) => r.c.table === "resolution");
  const other = results.filter((r) => !r.c.table || r.c.table === "other");
  const lines = [
    `Measured ${started.toISOString().slice(0, 16).replace("T", " ")} UTC by \`npm run bench\` on ${machine}; ${load} (${idle}).`,
    "Each case runs in a child process of its own (the cases bundled like the CLI; 4 GB heap unless the row says otherwise);",
    "peak memory is that process's maximum resident set, Node.js itself included (about 50 MB).",
    "",
    "**Gröbner bases** (reduced, grevlex, GF(32003), F4; SymPy's `groebner(…, modulus=32003)` in the same run):",
    "",
    ...table(
      groebner,
      groebner.some((r) => r.c.sympy),
    ),
    "",
    "**Resolutions** (notation programs through the evaluator, as in the CLI and a cell):",
    "",
    ...table(resolution, false),
    "",
    "**Other cases**:",
    "",
    ...table(
      other,
      other.some((r) => r.c.sympy),
    ),
  ];
  console.log(`\n${lines.join("\n")}`);
  if (writeReadme) {
    const file = path.join(root, "README.md");
    const text = readFileSync(file, "utf8");
    const begin = "<!-- bench:begin (generated by npm run bench -- --readme) -->",
      end = "<!-- bench:end -->";
    const a = text.indexOf(begin),
      b = text.indexOf(end);
    if (a < 0 || b < a) throw new Error(`README.md has no ${begin} … ${end} block`);
    writeFileSync(file, `${text.slice(0, a + begin.length)}\n${lines.join("\n")}\n${text.slice(b)}`);
    console.log("\nREADME.md updated.");
  }
}
