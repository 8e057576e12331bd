/// Families, sweeps and counterexample searches in the notation (notation.md §11):
/// `random_ideals`, `monomial_ideals`, `family`, F.length / F[i] / F.take / F.filter,
/// `sweep` (inline: one row per member, streamed as `partial`), `find`, and T.where.
/// Background experiments (lib/experiments) run the same probe on one member at a time
/// through `probeRow`, so a row is the same whether it was computed inline or by a worker.
import { lookupFunction } from "../../grammar/signatures";
import type { Span } from "../../grammar/ast";
import { monomial, monomialIdeals, randomIdealGenerators } from "../algebra/index";
import { typeToString } from "../../grammar/types";
import type { CallContext } from "./context";
import { EvalError, asEvalError, limit, runtime } from "./errors";
import { idealValue } from "./ideals";
import { ratOf } from "../algebra/index";
import { LIMIT_TABLE, sweepRunsInline, type LimitName } from "../limits";
import { familyDefinition, ringText, valueText } from "./text";
import {
  type FamilyMember,
  type FamilyValue,
  type FunctionValue,
  type RecordValue,
  type RingValue,
  type TableValue,
  type Value,
} from "./values";

/// Largest family `random_ideals` / `monomial_ideals` build: the limit `familyMembers`.
export const MAX_FAMILY_SIZE = LIMIT_TABLE.familyMembers.value;
/// The columns every sweep table starts with (notation.md §11), then the probe's fields.
export const FIXED_COLUMNS = ["index", "label", "status", "seconds"] as const;
/// Appended (addition) when some row is not ok: what went wrong.
export const MESSAGE_COLUMN = "message";
export type RowStatus = "ok" | "error" | "limit" | "cancelled";

const Int = (n: number | bigint): Value => ({ type: "Int", value: BigInt(n) });
const Str = (value: string): Value => ({ type: "Str", value });
const NONE: Value = { type: "None" };

/// The key builtins.ts files an overload under (as its overloadKey; not imported, so that
/// this module and builtins.ts do not import each other).
const key = (name: string): string => {
  const o = lookupFunction(name)!.overloads[0];
  return `${name}(${o.params.map((p) => typeToString(p.type)).join(", ")})`;
};

/// `limitName`: the row of lib/limits.ts that `max` comes from, named in the refusal.
function intOption(c: CallContext, name: string, fallback: bigint, min: bigint, max: bigint, limitName?: LimitName): bigint {
  const v = c.named.get(name);
  if (v === undefined) return fallback;
  if (v.type !== "Int") throw runtime(`${name} must be an Int, got ${v.type}`, c.span);
  if (v.value < min) throw runtime(`${name} must be at least ${min}, got ${v.value}`, c.span);
  if (v.value > max) throw limit(`${name} = ${v.value} is beyond the limit ${max}`, c.span, limitName);
  return v.value;
}

function boolOption(c: CallContext, name: string, fallback: boolean): boolean {
  const v = c.named.get(name);
  if (v === undefined) return fallback;
  if (v.type !== "Bool") throw runtime(`${name} must be true or false, got ${v.type}`, c.span);
  return v.value;
}

/// `degree = d` or `degree = [d1, …]` / `degree = 2..3`: a list of non-negative degrees.
function degreesOption(c: CallContext, fallback: number): number[] {
  const v = c.named.get("degree");
  if (v === undefined) return [fallback];
  const items = v.type === "List" ? v.items : [v];
  if (items.length === 0) throw runtime("degree must name at least one degree", c.span);
  return items.map((x) => {
    if (x.type !== "Int") throw runtime(`degree must be an Int or a List of Int, got ${x.type}`, c.span);
    if (x.value < 0n) throw runtime(`degrees must be at least 0, got ${x.value}`, c.span);
    if (x.value > 1000n) throw limit(`degree ${x.value} is beyond the limit 1000`, c.span);
    return Number(x.value);
  });
}

function polynomialRingArg(v: Value, c: CallContext, what: string): RingValue {
  if (v.type !== "Ring") throw runtime(`${what} expects a Ring, got ${v.type}`, c.argSpans[0] ?? c.span);
  if (v.ideal.length > 0)
    throw runtime(
      `${what} needs a polynomial ring; ${ringText(v)} is a quotient — use ${what}(…) on its ambient ring`,
      c.argSpans[0] ?? c.span,
    );
  return v;
}

function randomIdeals([S]: readonly Value[], c: CallContext): Value {
  const ring = polynomialRingArg(S, c, "random_ideals");
  const count = intOption(c, "count", 200n, 0n, BigInt(MAX_FAMILY_SIZE), "familyMembers");
  const gens = intOption(c, "gens", 3n, 1n, 100n);
  const seed = intOption(c, "seed", 1n, -(2n ** 63n), 2n ** 64n - 1n);
  const homogeneous = boolOption(c, "homogeneous", true);
  const given = degreesOption(c, 2);
  const listed = c.named.get("degree")?.type === "List";
  if (listed && given.length !== Number(gens)) {
    throw runtime(`degree lists ${given.length} degree(s) but gens = ${gens}: give one degree per generator`, c.span);
  }
  const degrees = listed ? given : new Array<number>(Number(gens)).fill(given[0]);
  const spec = { degrees, homogeneous, seed };
  const members: FamilyMember[] = [];
  for (let k = 0; k < Number(count); k++) {
    members.push(idealValue(ring, randomIdealGenerators(ring.poly, k, spec, c.interp.session.compute)));
  }
  const degreeText = listed ? `[${degrees.join(", ")}]` : String(degrees[0]);
  const definition =
    `random_ideals(${ringText(ring)}, count = ${count}, gens = ${gens}, degree = ${degreeText}, seed = ${seed}` +
    `${homogeneous ? "" : ", homogeneous = false"})`;
  const options = new Map<string, bigint>([
    ["count", count],
    ["gens", gens],
    ["seed", seed],
    ["homogeneous", homogeneous ? 1n : 0n],
  ]);
  if (!listed) options.set("degree", BigInt(degrees[0]));
  return { type: "Family", ring, generator: "random_ideals", options, members, definition };
}

function monomialIdealsFamily([S]: readonly Value[], c: CallContext): Value {
  const ring = polynomialRingArg(S, c, "monomial_ideals");
  const degrees = [...new Set(degreesOption(c, 3))].sort((a, b) => a - b);
  const maxGens = intOption(c, "max_gens", 4n, 1n, 1000n);
  const upToSymmetry = boolOption(c, "up_to_symmetry", false);
  let found: number[][][];
  try {
    found = monomialIdeals(ring.poly, { degrees, maxGens: Number(maxGens), upToSymmetry, max: MAX_FAMILY_SIZE }, c.interp.session.compute);
  } catch (e) {
    const err = asEvalError(e, c.span);
    throw /more than/.test(err.message) ? new EvalError("limit", err.message, c.span) : err;
  }
  const members: FamilyMember[] = found.map((gens) =>
    idealValue(
      ring,
      gens.map((e) => monomial(ring.poly, e)),
    ),
  );
  const degreeText = degrees.length === 1 ? String(degrees[0]) : `[${degrees.join(", ")}]`;
  const definition = `monomial_ideals(${ringText(ring)}, degree = ${degreeText}, max_gens = ${maxGens}${upToSymmetry ? ", up_to_symmetry = true" : ""})`;
  const options = new Map<string, bigint>([
    ["max_gens", maxGens],
    ["up_to_symmetry", upToSymmetry ? 1n : 0n],
  ]);
  if (degrees.length === 1) options.set("degree", BigInt(degrees[0]));
  return { type: "Family", ring, generator: "monomial_ideals", options, members, definition };
}

function isMember(v: Value): v is FamilyMember {
  return v.type === "Ring" || v.type === "Ideal" || v.type === "Module";
}

/// The Family of a List's items (or a Family given where a List is expected).
export function asFamily(v: Value, span: Span): FamilyValue {
  if (v.type === "Family") return v;
  if (v.type !== "List") throw runtime(`expected a Family or a List of rings, ideals or modules, got ${v.type}`, span);
  v.items.forEach((x, i) => {
    if (!isMember(x))
      throw runtime(`a family's members are rings, ideals or modules; item ${i} is ${x.type === "Int" ? "an" : "a"} ${x.type}`, span);
  });
  const members = v.items as FamilyMember[];
  const first = members[0];
  const ring = first === undefined ? null : first.type === "Ring" ? first : first.ring;
  return {
    type: "Family",
    ring,
    generator: "family",
    options: new Map([["length", BigInt(members.length)]]),
    members,
    definition: `family([${members.map(valueText).join(", ")}])`,
  };
}

/// A member's label: its text, shortened (the index identifies it exactly).
export function memberLabel(m: Value): string {
  const t = valueText(m);
  return t.length > 120 ? `${t.slice(0, 119)}…` : t;
}

function derived(
  F: FamilyValue,
  members: readonly FamilyMember[],
  suffix: string,
  generator: string,
  extra: [string, bigint][],
): FamilyValue {
  return {
    type: "Family",
    ring: F.ring,
    generator,
    options: new Map([...F.options, ...extra]),
    members,
    definition: `${familyDefinition(F)}${suffix}`,
  };
}

/// The result of one member's probe: a row's status, seconds and the probe's Record.
export interface ProbeOutcome {
  readonly status: RowStatus;
  readonly seconds: number;
  /// the probe's fields when status is ok
  readonly record: RecordValue | null;
  readonly message: string | null;
}

/// Applies the probe to one member; an error or a limit becomes the row's status (the sweep
/// goes on), a cancel is thrown (the whole evaluation stops).
export function probeRow(probe: FunctionValue, member: Value, depth: number, span: Span): ProbeOutcome {
  const t0 = performance.now();
  const seconds = () => (performance.now() - t0) / 1000;
  try {
    const r = probe.call([member], depth);
    if (r.type !== "Record") {
      return {
        status: "error",
        seconds: seconds(),
        record: null,
        message: `the probe must return a Record, got ${r.type} ${valueText(r)}`,
      };
    }
    return { status: "ok", seconds: seconds(), record: r, message: null };
  } catch (e) {
    const err = asEvalError(e, span);
    if (err.kind === "cancelled") throw err;
    return { status: err.kind === "limit" ? "limit" : "error", seconds: seconds(), record: null, message: err.message };
  }
}

/// Seconds as an exact Rat of whole milliseconds (the notation has no floating point).
export const secondsValue = (s: number): Value => ({ type: "Rat", value: ratOf(BigInt(Math.round(s * 1000)), 1000n) });

/// Builds a sweep Table from rows as they come; the probe's columns are those of the first
/// ok row (in the order written), later rows are read by name.
export class TableBuilder {
  private fields: string[] | null = null;
  private readonly rows: { index: number; label: string; outcome: ProbeOutcome }[] = [];

  add(index: number, label: string, outcome: ProbeOutcome): void {
    if (this.fields === null && outcome.record) this.fields = [...outcome.record.fields.keys()];
    this.rows.push({ index, label, outcome });
  }

  /// One row as a Record in column order (for the streamed `partial` events).
  record(index: number, label: string, o: ProbeOutcome): RecordValue {
    const fields = new Map<string, Value>([
      ["index", Int(index)],
      ["label", Str(label)],
      ["status", Str(o.status)],
      ["seconds", secondsValue(o.seconds)],
    ]);
    for (const [k, v] of o.record?.fields ?? []) fields.set(k, v);
    if (o.message !== null) fields.set(MESSAGE_COLUMN, Str(o.message));
    return { type: "Record", fields };
  }

  table(): TableValue {
    const fields = this.fields ?? [];
    const failed = this.rows.some((r) => r.outcome.status !== "ok");
    const columns = [...FIXED_COLUMNS, ...fields, ...(failed && !fields.includes(MESSAGE_COLUMN) ? [MESSAGE_COLUMN] : [])];
    const rows = this.rows.map(({ index, label, outcome: o }) => [
      Int(index),
      Str(label),
      Str(o.status),
      secondsValue(o.seconds),
      ...fields.map((f) => o.record?.fields.get(f) ?? NONE),
      ...(failed && !fields.includes(MESSAGE_COLUMN) ? [o.message === null ? NONE : Str(o.message)] : []),
    ]);
    return { type: "Table", columns, rows };
  }
}

function probeArg(v: Value, span: Span): FunctionValue {
  if (v.type !== "Function") throw runtime(`the probe must be a function, such as I -> {dim: I.dim}; got ${v.type}`, span);
  if (v.params.length !== 1) throw runtime(`the probe takes one argument (a member), this one takes ${v.params.length}`, span);
  return v;
}

function progress(c: CallContext, what: string, done: number, total: number, failures: number, started: number): void {
  const elapsed = (performance.now() - started) / 1000;
  const rate = elapsed > 0 ? done / elapsed : 0;
  const eta = rate > 0 ? Math.round((total - done) / rate) : null;
  c.interp.session.compute.progress?.({
    stage: what,
    detail: `${done}/${total} members, ${failures} failed, ${rate.toFixed(1)} members/s${eta === null ? "" : `, about ${eta} s left`}`,
    fraction: total === 0 ? 1 : done / total,
  });
}

function sweep([family, probeV]: readonly Value[], c: CallContext): Value {
  const background = c.named.get("background");
  if (background !== undefined && background.type !== "Bool")
    throw runtime(`background must be true or false, got ${background.type}`, c.span);
  const F = asFamily(family, c.argSpans[0]);
  const probe = probeArg(probeV, c.argSpans[1]);
  // Only the server offers experiments; elsewhere (the CLI, a worker) every sweep runs inline.
  const plan = c.interp.session.experiments;
  if (plan && !sweepRunsInline(F.members.length, background?.value, plan.inlineMax)) {
    return plan.start(F, probe, c.span);
  }
  const builder = new TableBuilder();
  const started = performance.now();
  let failures = 0;
  F.members.forEach((m, k) => {
    const label = memberLabel(m);
    const o = probeRow(probe, m, c.frame.depth, c.span);
    if (o.status !== "ok") failures++;
    builder.add(k, label, o);
    c.interp.session.partial?.(builder.record(k, label, o));
    progress(c, "sweep", k + 1, F.members.length, failures, started);
  });
  return builder.table();
}

function find([family, probeV]: readonly Value[], c: CallContext): Value {
  const F = asFamily(family, c.argSpans[0]);
  const probe = probeArg(probeV, c.argSpans[1]);
  const where = c.named.get("where");
  if (where?.type !== "Function") throw runtime("find needs where = a predicate on the probe's row, such as r -> r.depth == 0", c.span);
  const builder = new TableBuilder();
  const started = performance.now();
  let failures = 0;
  for (let k = 0; k < F.members.length; k++) {
    const m = F.members[k];
    const label = memberLabel(m);
    const o = probeRow(probe, m, c.frame.depth, c.span);
    if (o.status !== "ok") failures++;
    progress(c, "find", k + 1, F.members.length, failures, started);
    if (o.status !== "ok") continue;
    const row = builder.record(k, label, o);
    const hit = where.call([row], c.frame.depth);
    if (hit.type !== "Bool") throw runtime(`find's predicate must give a Bool, got ${hit.type}`, c.span);
    if (hit.value) {
      return {
        type: "Record",
        fields: new Map<string, Value>([
          ["index", Int(k)],
          ["member", m],
          ["row", row],
          ["tried", Int(k + 1)],
        ]),
      };
    }
  }
  return NONE;
}

function familyOf(v: Value): FamilyValue {
  return v as FamilyValue;
}

export const FAMILY_FUNCTIONS: Record<string, (args: readonly Value[], c: CallContext) => Value> = {
  [key("random_ideals")]: randomIdeals,
  [key("monomial_ideals")]: monomialIdealsFamily,
  [key("family")]: ([xs], c) => asFamily(xs, c.argSpans[0]),
  [key("sweep")]: sweep,
  [key("find")]: find,
};

export const FAMILY_PROPERTIES: Record<string, (obj: Value, args: readonly Value[], c: CallContext) => Value> = {
  "Family.length": (v) => Int(familyOf(v).members.length),
  "Family.definition": (v) => Str(familyDefinition(familyOf(v))),
  "Family.take": (v, [n], c) => {
    const F = familyOf(v);
    if (n.type !== "Int" || n.value < 0n) throw runtime(`take(n) needs an Int n ≥ 0, got ${valueText(n)}`, c.argSpans[0]);
    const k = Number(n.value > BigInt(F.members.length) ? BigInt(F.members.length) : n.value);
    return derived(F, F.members.slice(0, k), `.take(${n.value})`, "take", [["take", n.value]]);
  },
  "Family.filter": (v, [pred], c) => {
    const F = familyOf(v);
    if (pred.type !== "Function") throw runtime(`filter needs a predicate, such as I -> I.dim == 1; got ${pred.type}`, c.argSpans[0]);
    const kept = F.members.filter((m) => {
      const b = pred.call([m], c.frame.depth);
      if (b.type !== "Bool") throw runtime(`filter's predicate must give a Bool, got ${b.type} ${valueText(b)}`, c.argSpans[0]);
      return b.value;
    });
    return derived(F, kept, `.filter(${pred.source})`, "filter", []);
  },
  "Table.where": (v, [pred], c) => {
    const t = v as TableValue;
    if (pred.type !== "Function")
      throw runtime(`where needs a predicate on a row, such as r -> r.status == "ok"; got ${pred.type}`, c.argSpans[0]);
    const rows = t.rows.filter((row) => {
      const r: Value = { type: "Record", fields: new Map(t.columns.map((k, i) => [k, row[i]])) };
      const b = pred.call([r], c.frame.depth);
      if (b.type !== "Bool") throw runtime(`where's predicate must give a Bool, got ${b.type} ${valueText(b)}`, c.argSpans[0]);
      return b.value;
    });
    return { type: "Table", columns: t.columns, rows };
  },
};

/// F[i] (0-based), as for a List.
export function familyIndex(F: FamilyValue, i: bigint, span: Span): Value {
  if (i < 0n || i >= BigInt(F.members.length)) {
    throw runtime(`index ${i} is out of range: the family has ${F.members.length} member(s), indices 0…${F.members.length - 1}`, span);
  }
  return F.members[Number(i)];
}
