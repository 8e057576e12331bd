/// The JSON encoding of notation.md §9, shared by the API, the CLI and saved objects:
/// a zod schema per type, `encodeValue` (value → JSON) and `decodeValue` (JSON → value,
/// validated). Additions to §9 (documented in lib/notation/README.md): Poly, Ideal,
/// Matrix, Module and Complex carry a "ring" (the Ring encoding) so they restore alone.
import { z } from "zod";
import { formatHilbertDenominator, formatPoly, hilbertSeriesFromNumerator, parsePoly, type Poly } from "../algebra/index";
import { parseDenominator } from "./series-text";
import { parseRat, ratToString } from "../algebra/index";
import { RingRegistry, parseField, parseOrder } from "./rings";
import { familyDefinition, fieldText, orderText, ringText, valueText } from "./text";
import type { BettiTableValue, FunctionValue, IdealValue, MatrixValue, ModuleValue, RingValue, Value } from "./values";

// The schemas and types of the encoding are the wire contract (lib/wire/values.ts);
// re-exported here so the evaluator's callers keep one import.
import { IdealJson, MatrixJson, ModuleJson, RingJson, ValueJson, type FunctionJson } from "../wire/values";
export * from "../wire/values";

// ─── encode ───────────────────────────────────────────────────────────────────

export function encodeRing(r: RingValue): RingJson {
  return {
    type: "Ring",
    text: ringText(r),
    field: fieldText(r.poly.field),
    vars: [...r.poly.vars],
    degrees: [...r.poly.degrees],
    order: orderText(r.poly.order),
    ideal: r.ideal.map((f) => formatPoly(r.poly, f)),
    ...(r.over && r.over.ideal.length > 0 ? { over: r.over.ideal.length } : {}),
    ...(r.local ? { local: { at: r.local.at.map(ratToString) } } : {}),
  };
}

function polyTexts(r: RingValue, fs: readonly Poly[]): string[] {
  return fs.map((f) => formatPoly(r.poly, f));
}

function encodeMatrix(m: MatrixValue): z.infer<typeof MatrixJson> {
  return { type: "Matrix", text: valueText(m), rows: m.rows.map((row) => polyTexts(m.ring, row)), cols: m.cols, ring: encodeRing(m.ring) };
}

function encodeIdeal(i: IdealValue): z.infer<typeof IdealJson> {
  return { type: "Ideal", text: valueText(i), gens: polyTexts(i.ring, i.gens), ring: encodeRing(i.ring) };
}

export function encodeValue(v: Value): ValueJson {
  const t = valueText(v);
  switch (v.type) {
    case "Int":
      return { type: "Int", text: t, value: v.value.toString(), ...(v.note !== undefined ? { note: v.note } : {}) };
    case "Rat":
      return { type: "Rat", text: t, value: ratToString(v.value) };
    case "Bool":
      return { type: "Bool", text: t, value: v.value };
    case "Str":
      return { type: "Str", text: t, value: v.value };
    case "Field":
      return { type: "Field", text: t };
    case "Ring":
      return encodeRing(v);
    case "Poly":
      return { type: "Poly", text: t, ring: encodeRing(v.ring) };
    case "Ideal":
      return encodeIdeal(v);
    case "Matrix":
      return encodeMatrix(v);
    case "Module":
      return { type: "Module", text: t, presentation: encodeMatrix(v.presentation), degrees: [...v.degrees], ring: encodeRing(v.ring) };
    case "Complex":
      return {
        type: "Complex",
        text: t,
        ranks: [...v.ranks],
        betti: v.betti.entries.map(([i, j, b]) => [i, j, b] as [number, number, number]),
        complete: v.complete,
        maps: v.maps && v.maps.map(encodeMatrix),
        ring: encodeRing(v.ring),
        ...(v.note !== undefined ? { note: v.note } : {}),
      };
    case "BettiTable":
      return {
        type: "BettiTable",
        text: t,
        entries: v.entries.map(([i, j, b]) => [i, j, b] as [number, number, number]),
        complete: v.complete,
        ...(v.note !== undefined ? { note: v.note } : {}),
      };
    case "HilbertSeries":
      return {
        type: "HilbertSeries",
        text: t,
        numerator: v.series.numerator.map(String),
        denominator: formatHilbertDenominator(v.series.weights),
        ...(v.shift ? { lowest: -v.shift } : {}),
        ...(v.note ? { note: v.note } : {}),
      };
    case "Series":
      return {
        type: "Series",
        text: t,
        coefficients: v.coefficients.map(String),
        rational: v.rational,
        ...(v.rational !== null ? { guessed: true as const } : {}),
        ...(v.guess
          ? { numerator: v.guess.numerator.map(String), denominator: v.guess.denominator.map(String), checked: v.guess.checked }
          : {}),
        ...(v.exact !== undefined ? { exact: v.exact } : {}),
      };
    case "List":
      return { type: "List", text: t, items: v.items.map(encodeValue) };
    case "Record":
      return {
        type: "Record",
        text: t,
        fields: Object.fromEntries([...v.fields].map(([k, x]) => [k, encodeValue(x)])),
        fieldOrder: [...v.fields.keys()],
      };
    case "Table":
      return { type: "Table", text: t, columns: [...v.columns], rows: v.rows.map((row) => row.map(encodeValue)) };
    case "Function":
      return {
        type: "Function",
        text: t,
        params: [...v.params],
        captures: Object.fromEntries([...v.captures].map(([k, x]) => [k, encodeValue(x)])),
        ring: v.ring && encodeRing(v.ring),
      };
    case "Family":
      return {
        type: "Family",
        text: t,
        length: v.members.length,
        definition: familyDefinition(v),
        generator: v.generator,
        options: Object.fromEntries([...v.options].map(([k, x]) => [k, x.toString()])),
        members: v.members.map(encodeValue),
        ring: v.ring && encodeRing(v.ring),
      };
    case "Experiment":
      return { type: "Experiment", text: t, id: v.id, status: v.status, done: v.done, total: v.total, failures: v.failures };
    case "None":
      return { type: "None", text: t };
  }
}

// ─── decode ───────────────────────────────────────────────────────────────────

export class DecodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "DecodeError";
  }
}

export interface DecodeContext {
  /// shares one RingValue between every value decoded in the same ring
  readonly rings: RingRegistry;
  /// rebuilds a closure from its JSON (the evaluator parses and checks its source)
  readonly makeFunction?: (json: FunctionJson, captures: Map<string, Value>, ring: RingValue | null) => FunctionValue;
}

function fail(where: string, message: string): never {
  throw new DecodeError(`${where}: ${message}`);
}

export function decodeRing(j: RingJson, ctx: DecodeContext): RingValue {
  const field = parseField(j.field) ?? fail("Ring", `unknown field ${j.field}`);
  const order = parseOrder(j.order) ?? fail("Ring", `unknown monomial order ${j.order}`);
  const global = ctx.rings.polynomialRing(field, j.vars, { order, degrees: j.degrees });
  if (j.local && j.local.at.length !== j.vars.length)
    fail("Ring", `the point of a local ring needs ${j.vars.length} coordinates, got ${j.local.at.length}`);
  const base = j.local
    ? ctx.rings.localize(
        global,
        j.local.at.map((a) => parseRat(a) ?? fail("Ring", `bad coordinate ${a}`)),
      )
    : global;
  if (j.ideal.length === 0) return base;
  const gens = j.ideal.map((g) => readPoly(base, g, "Ring ideal"));
  const over = j.over ?? 0;
  if (over > gens.length) fail("Ring", `over counts ${over} generators but the ideal has ${gens.length}`);
  const formedFrom = over > 0 ? ctx.rings.quotient(base, gens.slice(0, over)) : base;
  return ctx.rings.quotient(formedFrom, gens.slice(over));
}

function readPoly(r: RingValue, textOf: string, where: string): Poly {
  try {
    return parsePoly(r.poly, textOf);
  } catch (e) {
    return fail(where, `cannot read polynomial "${textOf}" in ${ringText(r)}: ${(e as Error).message}`);
  }
}

function decodeMatrix(j: z.infer<typeof MatrixJson>, ctx: DecodeContext): MatrixValue {
  const ring = decodeRing(j.ring, ctx);
  if (j.rows.some((row) => row.length !== j.cols)) fail("Matrix", `every row must have ${j.cols} entries`);
  return { type: "Matrix", ring, rows: j.rows.map((row) => row.map((f) => readPoly(ring, f, "Matrix"))), cols: j.cols };
}

function decodeBetti(entries: readonly (readonly [number, number, number])[], complete: boolean, note?: string): BettiTableValue {
  return { type: "BettiTable", entries: entries.map(([i, j, b]) => [i, j, b] as const), complete, ...(note !== undefined ? { note } : {}) };
}

function decodeModule(j: z.infer<typeof ModuleJson>, ctx: DecodeContext): ModuleValue {
  if (!j.presentation) fail("Module", "a module needs its presentation to be restored");
  const ring = decodeRing(j.ring, ctx);
  const presentation = decodeMatrix(j.presentation, ctx);
  if (presentation.ring !== ring) fail("Module", "the presentation lives in a different ring than the module");
  if (presentation.rows.length !== j.degrees.length) {
    fail("Module", `degrees lists ${j.degrees.length} generators but the presentation has ${presentation.rows.length} rows`);
  }
  return { type: "Module", ring, presentation, degrees: j.degrees };
}

function decodeIdeal(j: z.infer<typeof IdealJson>, ctx: DecodeContext): IdealValue {
  const ring = decodeRing(j.ring, ctx);
  return { type: "Ideal", ring, gens: j.gens.map((g) => readPoly(ring, g, "Ideal")) };
}

function decodeValidated(j: ValueJson, ctx: DecodeContext): Value {
  switch (j.type) {
    case "Int":
      return { type: "Int", value: BigInt(j.value), ...(j.note !== undefined ? { note: j.note } : {}) };
    case "Rat":
      return { type: "Rat", value: parseRat(j.value) ?? fail("Rat", `bad value ${j.value}`) };
    case "Bool":
      return { type: "Bool", value: j.value };
    case "Str":
      return { type: "Str", value: j.value };
    case "Field":
      return { type: "Field", field: parseField(j.text) ?? fail("Field", `unknown field ${j.text}`) };
    case "Ring":
      return decodeRing(j, ctx);
    case "Poly": {
      const ring = decodeRing(j.ring, ctx);
      return { type: "Poly", ring, poly: readPoly(ring, j.text, "Poly") };
    }
    case "Ideal":
      return decodeIdeal(j, ctx);
    case "Matrix":
      return decodeMatrix(j, ctx);
    case "Module":
      return decodeModule(j, ctx);
    case "Complex":
      return {
        type: "Complex",
        ring: decodeRing(j.ring, ctx),
        ranks: j.ranks,
        betti: decodeBetti(j.betti, j.complete, j.note),
        complete: j.complete,
        maps: j.maps && j.maps.map((m) => decodeMatrix(m, ctx)),
        ...(j.note !== undefined ? { note: j.note } : {}),
      };
    case "BettiTable":
      return decodeBetti(j.entries, j.complete, j.note);
    case "HilbertSeries": {
      const denominator = parseDenominator(j.denominator) ?? fail("HilbertSeries", `bad denominator ${j.denominator}`);
      return {
        type: "HilbertSeries",
        series: hilbertSeriesFromNumerator(
          j.numerator.map((c) => BigInt(c)),
          denominator,
        ),
        ...(j.lowest !== undefined ? { shift: -j.lowest } : {}),
        ...(j.note !== undefined ? { note: j.note } : {}),
      };
    }
    case "Series":
      return {
        type: "Series",
        coefficients: j.coefficients.map((c) => BigInt(c)),
        rational: j.rational,
        ...(j.numerator && j.denominator && j.checked !== undefined
          ? {
              guess: { numerator: j.numerator.map((c) => BigInt(c)), denominator: j.denominator.map((c) => BigInt(c)), checked: j.checked },
            }
          : {}),
        ...(j.exact !== undefined ? { exact: j.exact } : {}),
      };
    case "List":
      return { type: "List", items: j.items.map((x) => decodeValidated(x, ctx)) };
    case "Record":
      return { type: "Record", fields: new Map(recordKeys(j).map((k) => [k, decodeValidated(j.fields[k]!, ctx)])) };
    case "Table":
      if (j.rows.some((row) => row.length !== j.columns.length)) fail("Table", `every row must have ${j.columns.length} cells`);
      return { type: "Table", columns: j.columns, rows: j.rows.map((row) => row.map((x) => decodeValidated(x, ctx))) };
    case "Function": {
      if (!ctx.makeFunction) fail("Function", "functions can only be restored by the evaluator");
      const captures = new Map(Object.entries(j.captures).map(([k, x]) => [k, decodeValidated(x, ctx)]));
      return ctx.makeFunction(j, captures, j.ring && decodeRing(j.ring, ctx));
    }
    case "Family": {
      if (j.length !== undefined && j.length !== j.members.length) fail("Family", `length ${j.length} but ${j.members.length} members`);
      const members = j.members.map((m) => {
        const v = decodeValidated(m, ctx);
        if (v.type !== "Ideal" && v.type !== "Ring" && v.type !== "Module")
          fail("Family", `a member must be a Ring, Ideal or Module, got ${v.type}`);
        return v;
      });
      return {
        type: "Family",
        ring: j.ring && decodeRing(j.ring, ctx),
        generator: j.generator,
        options: new Map(Object.entries(j.options).map(([k, x]) => [k, BigInt(x)])),
        members,
        ...(j.definition !== undefined ? { definition: j.definition } : {}),
      };
    }
    case "Experiment":
      return { type: "Experiment", id: j.id, status: j.status, done: j.done, total: j.total, failures: j.failures };
    case "None":
      return { type: "None" };
  }
}

/// Validates `json` against §9 and rebuilds the value; DecodeError says what is wrong.
export function decodeValue(json: unknown, ctx: DecodeContext): Value {
  const r = ValueJson.safeParse(json);
  if (!r.success) {
    const issue = r.error.issues[0];
    throw new DecodeError(`invalid value JSON at ${issue.path.join(".") || "top level"}: ${issue.message}`);
  }
  try {
    return decodeValidated(r.data, ctx);
  } catch (e) {
    if (e instanceof DecodeError) throw e;
    throw new DecodeError(`invalid value JSON: ${e instanceof Error ? e.message : String(e)}`);
  }
}

/// A record's field names in the order the user wrote them (`fieldOrder` when it names
/// exactly the fields; older encodings without it keep the stored key order).
export function recordKeys(j: { fields: Record<string, unknown>; fieldOrder?: readonly string[] }): string[] {
  const keys = Object.keys(j.fields);
  const order = j.fieldOrder;
  if (order && order.length === keys.length && order.every((k) => Object.hasOwn(j.fields, k))) return [...order];
  return keys;
}
