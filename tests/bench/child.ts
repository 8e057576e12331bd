// One bench case in a process of its own (started by run.ts): times the case's run and
// returns its result; the parent adds the process's peak memory.
import { cases as groebnerCases, type BenchCase } from "./cases";
import { notationCases } from "./notation-cases";
import { quotientCases } from "./quotient-cases";
import { resolutionCases } from "./resolution-cases";

export const allCases: BenchCase[] = [...groebnerCases, ...notationCases, ...resolutionCases, ...quotientCases];

export async function runCase(name: string): Promise<{ seconds: number; cpuSeconds: number; size: number; label: string }> {
  const c = allCases.find((x) => x.name === name);
  if (!c) throw new Error(`no bench case named ${JSON.stringify(name)}`);
  const cpu0 = process.cpuUsage();
  const t0 = process.hrtime.bigint();
  const r = await c.run();
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  const cpu = process.cpuUsage(cpu0);
  return { seconds, cpuSeconds: (cpu.user + cpu.system) / 1e6, ...r };
}
