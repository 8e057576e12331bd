/// `ringside eval [--json] [FILE]` (notation.md §10): evaluates a program from FILE or
/// standard input with the console's checker and engine and prints each statement's
/// result — as text, or with --json one §9 JSON object per line. Exit status 0 when
/// every statement succeeded, 1 when one failed (its Error is printed, nothing after
/// it runs), 2 for bad usage.
import { readFile } from "node:fs/promises";
import { evaluate, type EvalEvent } from "../notation/evaluate";
import type { ErrorJson } from "../notation/json";

export const USAGE = `usage: ringside eval [--json] [FILE]
       ringside experiments list | status|pause|resume|cancel|rerun ID  (see lib/experiments/cli.ts)
  Evaluates a Ringside notation program from FILE (or standard input when FILE is
  omitted or "-") and prints each statement's result.
  --json   print one JSON object per line (notation.md §9) instead of text`;

export interface Io {
  readonly stdin: NodeJS.ReadableStream;
  readonly stdout: { write(s: string): unknown };
  /// isTTY: a terminal, where the progress line is redrawn in place
  readonly stderr: { write(s: string): unknown; readonly isTTY?: boolean };
}

interface Args {
  readonly json: boolean;
  readonly file: string | null;
}

function parseArgs(argv: readonly string[]): Args | string {
  if (argv.length === 0) return "missing command";
  const [command, ...rest] = argv;
  if (command !== "eval") return `unknown command ${JSON.stringify(command)}`;
  let json = false;
  let file: string | null = null;
  for (const a of rest) {
    if (a === "--json") json = true;
    else if (a.startsWith("-") && a !== "-") return `unknown option ${a}`;
    else if (file !== null) return "more than one FILE given";
    else file = a;
  }
  return { json, file: file === "-" ? null : file };
}

async function readAll(stream: NodeJS.ReadableStream): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks).toString("utf8");
}

export async function main(argv: readonly string[], io: Io): Promise<number> {
  if (argv.length === 1 && (argv[0] === "--help" || argv[0] === "-h")) {
    io.stdout.write(`${USAGE}\n`);
    return 0;
  }
  const args = parseArgs(argv);
  if (typeof args === "string") {
    io.stderr.write(`ringside: ${args}\n${USAGE}\n`);
    return 2;
  }
  let source: string;
  try {
    source = args.file === null ? await readAll(io.stdin) : await readFile(args.file, "utf8");
  } catch (e) {
    io.stderr.write(`ringside: cannot read ${args.file ?? "standard input"}: ${(e as Error).message}\n${USAGE}\n`);
    return 2;
  }

  const line = (s: string) => io.stdout.write(`${s}\n`);
  const printError = (error: ErrorJson) => line(args.json ? JSON.stringify(error) : error.text);
  // Sweeps and searches run inline; their progress is one line on stderr, redrawn in place
  // on a terminal and written once per 5 % otherwise (so logs stay short).
  let progressShown = false;
  let lastFraction = -1;
  const endProgress = () => {
    if (progressShown && io.stderr.isTTY) io.stderr.write("\n");
    progressShown = false;
    lastFraction = -1;
  };
  const onEvent = (e: EvalEvent) => {
    if (e.event === "progress" && (e.stage === "sweep" || e.stage === "find")) {
      const fraction = e.fraction ?? 0;
      if (io.stderr.isTTY) io.stderr.write(`\r\x1b[K${e.stage}: ${e.detail ?? ""}`);
      else if (fraction - lastFraction >= 0.05 || fraction === 1) io.stderr.write(`${e.stage}: ${e.detail ?? ""}\n`);
      else return;
      lastFraction = fraction;
      progressShown = true;
      return;
    }
    if (e.event === "result" || e.event === "error") endProgress();
    if (e.event === "result") {
      if (args.json) line(JSON.stringify(e.value));
      else line(e.name === null ? e.value.text : `${e.name} := ${e.value.text}`);
    } else if (e.event === "checked") {
      e.errors.forEach(printError);
    } else if (e.event === "error" && !(e.index === null && (e.error.kind === "parse" || e.error.kind === "type"))) {
      // check errors were printed with the checked event
      printError(e.error);
    }
  };

  // Ctrl-C keeps Node's default (end the process): the engine computes synchronously,
  // so a signal handler could not run before the computation finished anyway.
  const outcome = await evaluate(source, [], { onEvent });
  return outcome.status === "ok" ? 0 : 1;
}
