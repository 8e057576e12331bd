/// Every limit Ringside enforces, in one table. Each has a name (reported with Errors of kind
/// "limit" and with refusals), a default, a unit, an optional environment variable that
/// overrides it, and a sentence saying what it bounds. README.md ("Limits") lists the same
/// table; `limitsTableMarkdown()` prints it so the two can be compared.
///
/// This module imports nothing, so every layer may read it (the grammar, the evaluator, the
/// compute slots, the server, even the browser's notation checker). The engine (lib/algebra)
/// keeps its own guards and receives values from its callers.

export type LimitUnit = "ms" | "h" | "MB" | "bytes" | "count" | "levels" | "bits";

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
  // sweeps in a cell (grammar/README.md, "Families, sweeps and searches")
  inlineSweepMembers: {
    value: 25,
    unit: "count",
    env: "RINGSIDE_INLINE_SWEEP_MEMBERS",
    what: "members a sweep in a cell may have to run inline, streaming its rows; a longer one becomes a background experiment",
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
  // requests: fields people type (checked by the routes' schemas)
  titleChars: { value: 200, unit: "count", what: "characters of a session's or an experiment's title" },
  objectNameChars: { value: 64, unit: "count", what: "characters of a named object's name (also an uploaded family's)" },
  displayNameChars: { value: 100, unit: "count", what: "characters of a person's name given at sign-up" },
  teamNameChars: { value: 120, unit: "count", what: "characters of a team's name" },
  descriptionChars: { value: 2000, unit: "count", what: "characters of a team's description" },
  ringTextChars: { value: 2000, unit: "count", what: "characters of the ring an uploaded family is read in" },
  pageRows: { value: 1000, unit: "count", what: "rows one request for an experiment's table may ask for" },
  // requests: bodies every route reads (lib/http/body.ts)
  requestBodyBytes: {
    value: 64 * 1024,
    unit: "bytes",
    env: "RINGSIDE_REQUEST_BODY_BYTES",
    what: "a JSON request body where no row below names a bound of its own",
  },
  shortBodyBytes: {
    value: 8 * 1024,
    unit: "bytes",
    what: "the body of a rename, a share, an invitation, a team or role change, or an object import",
  },
  authBodyBytes: { value: 8 * 1024, unit: "bytes", what: "the body of a sign-in or sign-up request" },
  experimentBodyBytes: { value: 256 * 1024, unit: "bytes", what: "the body creating an experiment (its program)" },
  uploadBodyBytes: {
    value: 3 * 1024 * 1024,
    unit: "bytes",
    env: "RINGSIDE_UPLOAD_BODY_BYTES",
    what: "the body of a family upload or its preview (the file and its fields)",
  },
  sessionImportBytes: {
    value: 8 * 1024 * 1024,
    unit: "bytes",
    env: "RINGSIDE_SESSION_IMPORT_BYTES",
    what: "the body of an imported session",
  },
  bodyDrainBytes: {
    value: 1024 * 1024,
    unit: "bytes",
    what: "a refused body up to this size is read to its end before the 413 is sent, so the client can read it; a larger one is cut off",
  },
  jsonNesting: { value: 64, unit: "levels", what: "arrays and objects nested inside a JSON request body" },
  // sign-in and sign-up (lib/auth)
  hashConcurrency: {
    value: 2,
    unit: "count",
    env: "RINGSIDE_HASH_CONCURRENCY",
    what: "password hashes (bcrypt) computed at once per server",
  },
  hashQueue: {
    value: 32,
    unit: "count",
    env: "RINGSIDE_HASH_QUEUE",
    what: "sign-ins and sign-ups waiting for a password hash; beyond it they answer 503 with Retry-After",
  },
  signInWindowMs: {
    value: 15 * 60 * 1000,
    unit: "ms",
    env: "RINGSIDE_SIGN_IN_WINDOW_MS",
    what: "the window in which failed sign-ins are counted (and the Retry-After of a refusal)",
  },
  signInAccountFailures: {
    value: 5,
    unit: "count",
    env: "RINGSIDE_SIGN_IN_ACCOUNT_FAILURES",
    what: "failed sign-ins for one address since its last success, within the window, before it is refused with 429",
  },
  signInAddressFailures: {
    value: 20,
    unit: "count",
    env: "RINGSIDE_SIGN_IN_CLIENT_FAILURES",
    what: "failed sign-ins from one client address within the window before it is refused with 429",
  },
  signInSessionMs: { value: 7 * 24 * 3600 * 1000, unit: "ms", what: "lifetime of a sign-in (its session token)" },
  emailVerificationMs: {
    value: 48 * 3600 * 1000,
    unit: "ms",
    env: "RINGSIDE_EMAIL_VERIFICATION_MS",
    what: "lifetime of the link that confirms a new account's e-mail address",
  },
  invitationHours: {
    value: 7 * 24,
    unit: "h",
    env: "RINGSIDE_INVITATION_TTL_HOURS",
    what: "lifetime of a team invitation's link",
  },
  // session imports (lib/export)
  importCells: { value: 2000, unit: "count", what: "cells of one imported session" },
  importObjects: { value: 2000, unit: "count", what: "named objects of one imported session" },
  // experiments: uploads and planning (lib/experiments)
  uploadLines: { value: 20_000, unit: "count", what: "lines (or JSON items) of an uploaded family" },
  uploadChars: { value: 2 * 1024 * 1024, unit: "count", what: "characters of an uploaded family's file" },
  experimentProgramChars: { value: 200_000, unit: "count", what: "characters of the program an experiment is created from" },
  probeChars: { value: 20_000, unit: "count", what: "characters of the probe run over an uploaded family" },
  uploadReadMs: {
    value: 60 * 1000,
    unit: "ms",
    env: "RINGSIDE_UPLOAD_READ_MS",
    what: "time the engine may take to read an uploaded family (or its preview)",
  },
  memberTimeMs: {
    value: 10 * 60 * 1000,
    unit: "ms",
    env: "RINGSIDE_MEMBER_TIME_LIMIT_MS",
    what: "wall-clock time of one experiment member (unset: the cellTimeMs in force)",
  },
  planTimeMs: {
    value: 60 * 1000,
    unit: "ms",
    env: "RINGSIDE_PLAN_TIME_MS",
    what: "time the engine may take to evaluate an experiment's program up to its sweep",
  },
  // input: what the notation accepts
  cellSourceBytes: { value: 100 * 1024, unit: "bytes", what: "source text of one cell" },
  bracketNesting: { value: 200, unit: "levels", what: "brackets nested inside one statement" },
  expressionNesting: { value: 1000, unit: "levels", what: "expressions nested inside one statement (checked before evaluation)" },
  ringVariables: { value: 1000, unit: "count", what: "variables of one polynomial ring" },
  ringWeight: { value: 1_000_000, unit: "count", what: "a variable's degree or weight written in a ring" },
  literalExponent: { value: 1_000_000, unit: "count", what: "a literal exponent written in the source" },
  familyMembers: { value: 100_000, unit: "count", what: "members a family built in the notation (random or monomial ideals) may have" },
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
  moduleDegree: { value: 1_000_000, unit: "count", what: "|d| for a generator degree d of a free module written directly" },
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

/// What a refusal because of a limit carries as its `details` (the JSON error's
/// `{"kind": "limit", "limit": name, "value": …}`), so a client can tell which bound it met.
export function limitDetails(name: LimitName, value = limitValue(name)): { kind: "limit"; limit: LimitName; value: number } {
  return { kind: "limit", limit: name, value };
}

/// For a schema's `.max(...atMost("titleChars"))`: the row's value and a message naming it.
export function atMost(name: LimitName): [number, string] {
  const value = LIMIT_TABLE[name].value;
  return [value, `is longer than ${value} characters (limit ${name})`];
}

/// "350 MB", "8 s", "48 h", "1 MiB"… for messages.
export function formatLimit(name: LimitName, value = limitValue(name)): string {
  const unit = LIMIT_TABLE[name].unit;
  switch (unit) {
    case "ms":
      if (value >= 3600_000 && value % 3600_000 === 0) return `${value / 3600_000} h`;
      if (value >= 60_000 && value % 60_000 === 0) return `${value / 60_000} min`;
      return value % 1000 === 0 ? `${value / 1000} s` : `${value} ms`;
    case "h":
      return `${value} h`;
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

/// Whether `sweep(F, probe)` runs inside the cell (true) or becomes a background experiment:
/// `background = true` / `false` decides when given; otherwise a family of at most
/// `inlineMax` members (the limit `inlineSweepMembers`) runs inline. Where no experiments can
/// be created (the CLI, a worker), every sweep runs inline and this is not asked.
export function sweepRunsInline(members: number, background: boolean | undefined, inlineMax = limitValue("inlineSweepMembers")): boolean {
  if (background !== undefined) return !background;
  return members <= inlineMax;
}
