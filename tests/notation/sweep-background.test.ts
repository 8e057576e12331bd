/// Which sweeps run inline and which become background experiments (lib/limits.ts
/// `sweepRunsInline`, grammar/README.md "Families, sweeps and searches"), what the
/// evaluator does with each when the server offers experiments (Session.experiments), and the
/// checker's honest type for either (`Table or Experiment`).
import { describe, expect, it } from "vitest";
import { analyze, EMPTY_ENV, formatOverload, lookupFunction } from "@/grammar";
import { typeToString } from "@/grammar/types";
import { hoverDoc } from "@/lib/editor/notation-hover";
import { evaluate } from "@/lib/notation/evaluate";
import { LIMIT_TABLE, limitValue, sweepRunsInline } from "@/lib/limits";
import { encodeValue } from "@/lib/notation/json";
import { ExperimentJson, ValueJson } from "@/lib/wire/values";
import type { FamilyValue, FunctionValue, Value } from "@/lib/notation/values";

describe("the rule (pure)", () => {
  it("runs a family of at most inlineSweepMembers members inline, a longer one in the background", () => {
    expect(sweepRunsInline(0, undefined, 25)).toBe(true);
    expect(sweepRunsInline(25, undefined, 25)).toBe(true);
    expect(sweepRunsInline(26, undefined, 25)).toBe(false);
  });
  it("background = true / false decides whatever the size", () => {
    expect(sweepRunsInline(1, true, 25)).toBe(false);
    expect(sweepRunsInline(0, true, 25)).toBe(false);
    expect(sweepRunsInline(10_000, false, 25)).toBe(true);
  });
  it("reads inlineSweepMembers from the limits table, overridable by its environment variable", () => {
    expect(LIMIT_TABLE.inlineSweepMembers.value).toBe(25);
    expect(limitValue("inlineSweepMembers", {})).toBe(25);
    expect(limitValue("inlineSweepMembers", { RINGSIDE_INLINE_SWEEP_MEMBERS: "3" })).toBe(3);
    expect(sweepRunsInline(4, undefined, limitValue("inlineSweepMembers", { RINGSIDE_INLINE_SWEEP_MEMBERS: "3" }))).toBe(false);
  });
});

/// An evaluation offered experiments: `start` records what it was handed and returns a handle.
async function withExperiments(source: string, inlineMax = 3) {
  const started: { family: FamilyValue; probe: FunctionValue }[] = [];
  const out = await evaluate(source, [], {
    experiments: {
      inlineMax,
      start: (family, probe): Value => {
        started.push({ family, probe });
        return {
          type: "Experiment",
          id: "00000000-0000-4000-8000-000000000001",
          status: "queued",
          done: 0,
          total: family.members.length,
          failures: 0,
        };
      },
    },
  });
  expect(out.error, out.error?.text).toBeNull();
  return { out, started, last: out.results[out.results.length - 1].value };
}

// The members S / m^p for p = 1…n of S = Q[x, y], m = (x, y): S/m^p has Hilbert function
// 1, 2, …, p in degrees 0…p-1, so its length is p(p+1)/2 (common practice: count monomials).
const family = (n: number) => `S := Q[x, y]\nF := family([S / S.maximal^p for p in 1..${n}])\n`;

describe("sweep with experiments offered (as in a server's cell)", () => {
  it("a small sweep runs inline: a Table with one row per member", async () => {
    const { started, last } = await withExperiments(family(3) + "sweep(F, R -> {len: R.length})");
    expect(started).toHaveLength(0);
    expect(last.type).toBe("Table");
    if (last.type !== "Table") return;
    expect(last.rows.map((r) => r[r.length - 1].text)).toEqual(["1", "3", "6"]);
  });

  it("a sweep longer than inlineMax goes to start with its family and probe; the value is the Experiment", async () => {
    const { started, last } = await withExperiments(family(5) + "sweep(F, R -> {len: R.length})");
    expect(started).toHaveLength(1);
    expect(started[0].family.members).toHaveLength(5);
    expect(started[0].probe.source).toBe("R -> {len: R.length}");
    expect(last).toMatchObject({ type: "Experiment", total: 5, done: 0, failures: 0, status: "queued" });
    expect(last.text).toMatch(/runs in the background/);
    expect(last.text).toMatch(/0\/5 members done/);
    expect(ExperimentJson.safeParse(last).success).toBe(true);
    expect(ValueJson.safeParse(last).success).toBe(true);
  });

  it("background = false forces inline, background = true forces an experiment", async () => {
    const forcedInline = await withExperiments(family(5) + "sweep(F, R -> {len: R.length}, background = false)");
    expect(forcedInline.started).toHaveLength(0);
    expect(forcedInline.last.type).toBe("Table");
    const forcedBackground = await withExperiments(family(2) + "sweep(F, R -> {len: R.length}, background = true)");
    expect(forcedBackground.started).toHaveLength(1);
    expect(forcedBackground.last.type).toBe("Experiment");
  });

  it("an Experiment value survives its JSON and prints its counts", () => {
    const v: Value = { type: "Experiment", id: "00000000-0000-4000-8000-000000000002", status: "running", done: 7, total: 40, failures: 2 };
    const j = encodeValue(v);
    expect(j).toMatchObject({ type: "Experiment", id: v.id, status: "running", done: 7, total: 40, failures: 2 });
    expect(j.text).toMatch(/7\/40 members done, 2 failed/);
  });
});

describe("the cell job in an engine slot (lib/compute/cell-job.ts)", () => {
  async function job(source: string, inlineSweepMembers?: number) {
    const { handleJob } = await import("@/lib/compute/cell-job");
    const events: { event: string; [k: string]: unknown }[] = [];
    const payload = { source, bindings: [], currentRing: null, ...(inlineSweepMembers === undefined ? {} : { inlineSweepMembers }) };
    await handleJob(payload, { signal: new AbortController().signal, emit: (e) => events.push(e as (typeof events)[number]) });
    return events;
  }

  it("hands the server an experiment request whose id the statement's Experiment value carries", async () => {
    const events = await job(family(4) + "T := sweep(F, R -> {len: R.length})", 3);
    const requests = events.filter((e) => e.event === "experiment");
    expect(requests).toHaveLength(1);
    const request = requests[0] as unknown as {
      id: string;
      family: { type: string; length: number };
      probe: { type: string; text: string };
      labels: string[];
    };
    expect(request.family).toMatchObject({ type: "Family", length: 4 });
    expect(request.probe).toMatchObject({ type: "Function", text: "R -> {len: R.length}" });
    expect(request.labels).toHaveLength(4);
    const results = events.filter((e) => e.event === "result");
    expect(results[results.length - 1].value).toMatchObject({ type: "Experiment", id: request.id, total: 4, status: "queued" });
    const bound = events.filter((e) => e.event === "bound" && e.name === "T");
    expect(bound[bound.length - 1].type).toBe("Experiment");
  });

  it("runs every sweep inline when the server offers no experiments", async () => {
    const events = await job(family(4) + "sweep(F, R -> {len: R.length}, background = true)");
    expect(events.filter((e) => e.event === "experiment")).toHaveLength(0);
    const results = events.filter((e) => e.event === "result");
    expect((results[results.length - 1].value as { type: string }).type).toBe("Table");
  });
});

describe("the checker's type of a sweep: Table or Experiment, as it may run either way", () => {
  const typeOf = (source: string) => {
    const a = analyze(source);
    const s = a.program.statements[a.program.statements.length - 1];
    const e = s.kind === "Define" ? s.value : s.kind === "ExprStatement" ? s.expr : undefined;
    return { errors: a.errors.map((x) => x.message), type: e && typeToString(a.types.get(e)!) };
  };

  it("says either unless background = false keeps it inline", () => {
    expect(typeOf(family(30) + "sweep(F, R -> {len: R.length})")).toEqual({ errors: [], type: "Table or Experiment" });
    expect(typeOf(family(2) + "sweep(F, R -> {len: R.length}, background = true)").type).toBe("Table or Experiment");
    expect(typeOf(family(30) + "sweep(F, R -> {len: R.length}, background = false)")).toEqual({ errors: [], type: "Table" });
  });

  it("still lets the result be used as the Table it is when inline (the evaluator says when it is not)", () => {
    const T = family(3) + "T := sweep(F, R -> {len: R.length})\n";
    expect(typeOf(T + "T.rows")).toEqual({ errors: [], type: "List<Record>" });
    expect(typeOf(T + "T.where(r -> r.len > 1)")).toEqual({ errors: [], type: "Table" });
    // the predicate is still checked against the sweep's columns
    expect(typeOf(T + "T.where(r -> r.lenght > 1)").errors[0]).toMatch(/no field lenght/);
    // a name stored from a background sweep is an Experiment, which has no Table properties
    const stored = analyze("T.rows", { bindings: { T: { kind: "Experiment" } }, currentRing: null });
    expect(stored.errors.map((x) => x.message)).toEqual([expect.stringMatching(/Experiment has no property rows/)]);
  });

  it("the signature table, the hover and /reference say the same", () => {
    const sweep = lookupFunction("sweep")!;
    expect(formatOverload(sweep, sweep.overloads[0])).toMatch(/\) -> Table or Experiment$/);
    expect(sweep.description).toMatch(/an Experiment that runs in the background/);
    const doc = hoverDoc({ analyze, env: () => EMPTY_ENV }, "sweep(F, p)", 2)!;
    expect(doc.signatures).toEqual([formatOverload(sweep, sweep.overloads[0])]);
  });

  it("a background sweep's Experiment used as a Table says why at run time, and how to get the Table", async () => {
    const source = family(5) + "T := sweep(F, R -> {len: R.length})\nT.rows";
    const out = await evaluate(source, [], {
      experiments: {
        inlineMax: 3,
        start: (f): Value => ({
          type: "Experiment",
          id: "00000000-0000-4000-8000-000000000004",
          status: "queued",
          done: 0,
          total: f.members.length,
          failures: 0,
        }),
      },
    });
    expect(out.results.map((r) => r.value.type)).toEqual(["Ring", "Family", "Experiment"]);
    expect(out.error?.kind).toBe("runtime");
    expect(out.error?.text).toMatch(/this sweep runs in the background, so its value is an Experiment, which has no property rows/);
    expect(out.error?.text).toMatch(/background = false/);
    // the same program with the sweep kept inline gives the rows
    const inline = await evaluate(source.replace("R.length})", "R.length}, background = false)"), [], {
      experiments: { inlineMax: 3, start: () => ({ type: "None" }) as Value },
    });
    expect(inline.error).toBeNull();
    expect(inline.results.at(-1)!.value.type).toBe("List");
  });
});
