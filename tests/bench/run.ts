// npm run bench [-- NAME-FILTER]: times every case with our engine, then the same
// computation in SymPy (one child process per case, killed after the timeout), and prints the
// ratio SymPy time / our time. Environment: RINGSIDE_SYMPY_PYTHON (default /usr/bin/python3),
// RINGSIDE_BENCH_SYMPY_TIMEOUT in seconds (default 300), RINGSIDE_BENCH_NO_SYMPY=1 to skip it.
import { spawn } from "node:child_process";
import path from "node:path";
import { cases as groebnerCases, type BenchCase } from "./cases";
import { quotientCases } from "./quotient-cases";
import { resolutionCases } from "./resolution-cases";
import { sweepThroughput } from "./sweep-throughput";

// Gröbner bases (with SymPy as the reference), resolutions over S (issue 5) and over S/J (issue 6).
const cases: BenchCase[] = [...groebnerCases, ...resolutionCases, ...quotientCases];

const python = process.env.RINGSIDE_SYMPY_PYTHON || "/usr/bin/python3";
const timeoutS = Number(process.env.RINGSIDE_BENCH_SYMPY_TIMEOUT || 300);
const script = path.join(__dirname, "..", "algebra", "sympy", "groebner_batch.py");

type SympyTiming = { seconds: number; size: number } | { failed: string };

function runSympy(c: BenchCase): Promise<SympyTiming> {
  return new Promise((resolve) => {
    const child = spawn(python, [script], { stdio: ["pipe", "pipe", "pipe"] });
    let out = "", err = "";
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      resolve({ failed: `SymPy > ${timeoutS} s` });
    }, timeoutS * 1000);
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

function timeOurs(c: BenchCase): { seconds: number; size: number; label: string } {
  const t0 = process.hrtime.bigint();
  const r = c.run();
  return { seconds: Number(process.hrtime.bigint() - t0) / 1e9, ...r };
}

async function main(): Promise<void> {
  const filter = process.argv[2];
  // `npm run bench -- sweep`: only the experiments' throughput (needs DATABASE_URL)
  if (filter === "sweep") {
    console.log((await sweepThroughput()).join("\n"));
    return;
  }
  const selected = cases.filter((c) => !filter || c.name.includes(filter));
  const ours = selected.map((c) => {
    const r = timeOurs(c);
    console.log(`ours   ${c.name}: ${r.seconds.toFixed(2)} s, ${r.label} ${r.size}`);
    return r;
  });
  const skipSympy = process.env.RINGSIDE_BENCH_NO_SYMPY === "1";
  const theirs: (SympyTiming | null)[] = [];
  for (const c of selected) {
    const t = c.sympy && !skipSympy ? await runSympy(c) : null;
    if (t) console.log(`sympy  ${c.name}: ${"failed" in t ? t.failed : `${t.seconds.toFixed(2)} s, basis size ${t.size}`}`);
    theirs.push(t);
  }
  console.log("\n| case | Ringside (s) | size | SymPy (s) | SymPy / Ringside |");
  console.log("|---|---|---|---|---|");
  selected.forEach((c, i) => {
    const o = ours[i], t = theirs[i];
    const sym = !t ? "not run" : "failed" in t ? t.failed : t.seconds.toFixed(2);
    const ratio = t && !("failed" in t) ? `${(t.seconds / o.seconds).toFixed(1)}×` : "–";
    const agree = t && !("failed" in t) && t.size !== o.size ? " (sizes differ!)" : "";
    console.log(`| ${c.name} | ${o.seconds.toFixed(2)} | ${o.size} | ${sym} | ${ratio}${agree} |`);
  });
  if (!filter) console.log(`\nSweep throughput (experiments, ${"npm run worker"} processes):\n${(await sweepThroughput()).join("\n")}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
