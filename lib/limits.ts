/// Every limit Ringside enforces, in one table. Each has a name (reported with Errors of kind
/// "limit" and with refusals), a default, a unit, an optional environment variable that
/// overrides it, and a sentence saying what it bounds. README.md ("Limits") lists the same
/// table; `limitsTableMarkdown()` prints it so the two can be compared.
///
/// This module imports nothing, so every layer may read it (the grammar, the evaluator, the
/// compute slots, the server, even the browser's notation checker). The engine (lib/algebra)
/// keeps its own guards and receives values from its callers.

export type LimitUnit = "ms" | "MB" | "bytes" | "count" | "levels" | "bits";

export interface LimitSpec {
  readonly value: number;
  readonly unit: LimitUnit;
  /// environment variable that overrides the default (a positive number)
  readonly env?: string;
  readonly what: string;
}

/// The environment where there is one (the browser has none).
function environment(): Record<string, string | undefined> {
  return (globalThis as { process?: { env?: Record<string, string | undefined> } }).process?.env ?? {};
}

export const LIMIT_TABLE = {
  // computation: time and memory of one cell (or one experiment member)
  cellTimeMs: { value: 10 * 60 * 1000, unit: "ms", env: "RINGSIDE_CELL_TIME_LIMIT_MS", what: "wall-clock time of one computation" },
  cellHeapMb: {
    value: 2048,
    unit: "MB",
    env: "RINGSIDE_CELL_HEAP_MB",
    what: "JavaScript heap of one computation (V8 old generation in its engine slot)",
  },
  cellMemoryMb: {
    value: 3072,
    unit: "MB",
    env: "RINGSIDE_CELL_MEMORY_MB",
    what: "resident memory of an engine slot process (heap, typed arrays and all); a watchdog kills the slot above it",
  },
  // the engine: slots, queue and fair use
  engineSlots: {
    value: 2,
    unit: "count",
    env: "RINGSIDE_ENGINE_WORKERS",
    what: "engine slot processes computing at once per server (unset: cores − 1, at least this default)",
  },
  engineQueue: { value: 32, unit: "count", env: "RINGSIDE_ENGINE_QUEUE", what: "computations waiting for a slot, all users together" },
  userRunning: {
    value: 1,
    unit: "count",
    env: "RINGSIDE_USER_RUNNING",
    what: "slots one user may hold at once (unset: slots − 1, at least this default, so one slot stays free for others)",
  },
  userQueued: { value: 8, unit: "count", env: "RINGSIDE_USER_QUEUED", what: "computations one user may have waiting" },
  slotJobs: {
    value: 100,
    unit: "count",
    env: "RINGSIDE_SLOT_JOBS",
    what: "computations a slot process serves before it is replaced by a fresh one",
  },
  stopGraceMs: {
    value: 3000,
    unit: "ms",
    env: "RINGSIDE_STOP_GRACE_MS",
    what: "time a stopped computation gets to hand back its partial work before its slot is killed",
  },
  // results kept by the web server
  largeValueBytes: {
    value: 1024 * 1024,
    unit: "bytes",
    env: "RINGSIDE_LARGE_VALUE_BYTES",
    what: "encoded size above which a value is stored as a summary, its detail kept aside and fetched on request",
  },
  // cells on the server: liveness and saving
  heartbeatMs: {
    value: 2000,
    unit: "ms",
    env: "RINGSIDE_HEARTBEAT_MS",
    what: "interval at which a server records that its running cells are alive (with what they streamed so far)",
  },
  orphanAfterMs: {
    value: 15_000,
    unit: "ms",
    env: "RINGSIDE_ORPHAN_AFTER_MS",
    what: "a running cell whose heartbeat is older than this is marked interrupted",
  },
  saveAttempts: {
    value: 6,
    unit: "count",
    env: "RINGSIDE_SAVE_ATTEMPTS",
    what: "tries to store a finished cell before it is marked as not saved",
  },
  // input: what the notation accepts
  cellSourceBytes: { value: 100 * 1024, unit: "bytes", what: "source text of one cell" },
  bracketNesting: { value: 200, unit: "levels", what: "brackets nested inside one statement" },
  expressionNesting: { value: 1000, unit: "levels", what: "expressions nested inside one statement (checked before evaluation)" },
  ringVariables: { value: 1000, unit: "count", what: "variables of one polynomial ring" },
  literalExponent: { value: 1_000_000, unit: "count", what: "a literal exponent written in the source" },
  // evaluation: what one statement may ask of the engine
  polyExponent: { value: 10_000, unit: "count", what: "k in f^k for a polynomial f" },
  idealPower: { value: 200, unit: "count", what: "k in I^k for an ideal I" },
  integerBits: { value: 1_000_000, unit: "bits", what: "bit length of an integer result of ^" },
  listLength: { value: 1_000_000, unit: "count", what: "items a range or comprehension may build" },
  callDepth: { value: 200, unit: "levels", what: "nested function calls" },
  hilbertDegree: { value: 100_000, unit: "count", what: "d in H.at(d) and H.values(d)" },
  homologicalIndex: { value: 1000, unit: "count", what: "length = of a resolution, terms = of a series, the index of tor, ext and syzygy" },
  internalDegree: { value: 100_000, unit: "count", what: "degree = of a resolution (the highest internal degree computed)" },
  koszulEntries: { value: 2_000_000, unit: "count", what: "matrix entries of a Koszul complex's differentials together" },
  freeRank: { value: 10_000, unit: "count", what: "rank n of a free module R^n written directly" },
  keptMapEntries: {
    value: 200_000,
    unit: "count",
    what: "matrix entries of a resolution's differentials kept for C.map (beyond it the Betti table is kept and the maps are said not kept)",
  },
} as const satisfies Record<string, LimitSpec>;

export type LimitName = keyof typeof LIMIT_TABLE;

/// The value in force: the environment variable when it holds a positive number, else the default.
export function limitValue(name: LimitName, env: Record<string, string | undefined> = environment()): number {
  const spec: LimitSpec = LIMIT_TABLE[name];
  const raw = spec.env === undefined ? undefined : env[spec.env];
  const value = raw === undefined || raw.trim() === "" ? NaN : Number(raw);
  return Number.isFinite(value) && value > 0 ? value : spec.value;
}

/// Every limit's value in force, by name (handed to engine slots, which must not read a
/// different environment).
export function limitValues(env: Record<string, string | undefined> = environment()): Record<LimitName, number> {
  const out = {} as Record<LimitName, number>;
  for (const name of Object.keys(LIMIT_TABLE) as LimitName[]) out[name] = limitValue(name, env);
  return out;
}

/// "350 MB", "8 s", "1 MiB"… for messages.
export function formatLimit(name: LimitName, value = limitValue(name)): string {
  const unit = LIMIT_TABLE[name].unit;
  switch (unit) {
    case "ms":
      return value % 1000 === 0 ? `${value / 1000} s` : `${value} ms`;
    case "MB":
      return `${value} MB`;
    case "bytes":
      return value % (1024 * 1024) === 0 ? `${value / (1024 * 1024)} MiB` : value % 1024 === 0 ? `${value / 1024} KiB` : `${value} bytes`;
    case "bits":
      return `${value} bits`;
    default:
      return String(value);
  }
}

/// The table as Markdown, for README.md.
export function limitsTableMarkdown(): string {
  const rows = (Object.keys(LIMIT_TABLE) as LimitName[]).map((name) => {
    const spec: LimitSpec = LIMIT_TABLE[name];
    const value = formatLimit(name, spec.value);
    return `| \`${name}\` | ${value} | ${spec.env ? `\`${spec.env}\`` : "—"} | ${spec.what} |`;
  });
  return ["| limit | default | environment | bounds |", "|---|---|---|---|", ...rows].join("\n");
}
