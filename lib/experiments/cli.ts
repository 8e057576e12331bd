/// `npx ringside experiments list|status|pause|resume|cancel|rerun [ID]`: an operator's tool
/// over the database the server uses (DATABASE_URL); it acts directly, without a web sign-in,
/// so it is for whoever can reach the database anyway.
import { desc } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { experiments } from "@/db/schema";
import { ExperimentError } from "./errors";
import { closeExperimentPool } from "./compute-adapter";
import { stopBoss } from "./queue";
import { act, runAgain } from "./service";
import { getExperiment, progressOf } from "./store";

export const EXPERIMENTS_USAGE = `usage: ringside experiments list
       ringside experiments status|pause|resume|cancel|rerun ID
  Needs DATABASE_URL (the database the Ringside server uses).`;

interface Out {
  write(s: string): unknown;
}

export async function experimentsMain(args: readonly string[], stdout: Out, stderr: Out): Promise<number> {
  const [command, id] = args;
  if (!process.env.DATABASE_URL) {
    stderr.write(`ringside: DATABASE_URL is not set\n${EXPERIMENTS_USAGE}\n`);
    return 2;
  }
  const line = (s: string) => stdout.write(`${s}\n`);
  try {
    if (command === "list" && id === undefined) {
      const rows = await db().select().from(experiments).orderBy(desc(experiments.createdAt)).limit(50);
      for (const e of rows) {
        const p = await progressOf(e);
        line(`${e.id}  ${e.status.padEnd(9)}  ${p.done}/${p.total}  ${e.title}`);
      }
      return 0;
    }
    if (!["status", "pause", "resume", "cancel", "rerun"].includes(command ?? "") || !id || args.length !== 2) {
      stderr.write(
        `ringside: ${command ? `bad experiments command: ${args.join(" ")}` : "missing experiments command"}\n${EXPERIMENTS_USAGE}\n`,
      );
      return 2;
    }
    let e = await getExperiment(id);
    if (!e) {
      stderr.write(`ringside: no experiment ${id}\n`);
      return 1;
    }
    if (command === "pause" || command === "resume" || command === "cancel") e = await act(e.id, command);
    if (command === "rerun") {
      e = await runAgain(e, null);
      line(`started ${e.id} (run again of ${id})`);
    }
    const p = await progressOf(e);
    const rate = p.rate === null ? "" : `, ${p.rate.toFixed(1)} members/s`;
    const eta = p.etaSeconds === null ? "" : `, about ${p.etaSeconds} s left`;
    line(`${e.id} ${e.status}: ${p.done}/${p.total} members, ${p.failures} failed${rate}${eta}`);
    line(`  family: ${e.familyDefinition}`);
    line(`  probe:  ${e.probeText}`);
    line(`  engine: ${e.engineVersion}`);
    return 0;
  } catch (error) {
    stderr.write(`ringside: ${error instanceof ExperimentError || error instanceof Error ? error.message : String(error)}\n`);
    return 1;
  } finally {
    await stopBoss();
    await closeExperimentPool();
    await closeDb();
  }
}
