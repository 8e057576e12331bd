/// The value encoding of notation.md §9 (with the additions listed in
/// lib/notation/README.md): one zod schema per type, and the TypeScript types inferred
/// from them. This is the wire contract for values: the evaluator encodes and decodes
/// with these schemas (lib/notation/json.ts), the server stores and streams them, and the
/// client reads them as types. Imports only zod.
import { z } from "zod";

const intText = z.string().regex(/^-?\d+$/, "expected a decimal integer string");
const ratText = z.string().regex(/^-?\d+(\/[1-9]\d*)?$/, "expected a decimal rational string such as -3/4");
const count = z.number().int().nonnegative();
const text = z.string();

export const RingJson = z.object({
  type: z.literal("Ring"),
  text,
  field: z.string().regex(/^(Q|GF\(\d+\))$/, 'expected "Q" or "GF(p)"'),
  vars: z.array(z.string().min(1)).min(1),
  degrees: z.array(z.number().int().positive()),
  order: z.string(),
  ideal: z.array(z.string()),
  /// for A / I with A itself a quotient: how many leading generators of `ideal` define A
  over: count.optional(),
  /// a local ring (grammar/README.md, "Local rings"): the point it is localised at, one rational per variable
  local: z.object({ at: z.array(ratText) }).optional(),
});
export type RingJson = z.infer<typeof RingJson>;

const ringRef = { ring: RingJson };

export const IntJson = z.object({ type: z.literal("Int"), text, value: intText, note: z.string().optional() });
export const RatJson = z.object({ type: z.literal("Rat"), text, value: ratText });
export const BoolJson = z.object({ type: z.literal("Bool"), text, value: z.boolean() });
export const StrJson = z.object({ type: z.literal("Str"), text, value: z.string() });
export const FieldJson = z.object({ type: z.literal("Field"), text: z.string().regex(/^(Q|GF\(\d+\))$/) });
export const PolyJson = z.object({ type: z.literal("Poly"), text, ...ringRef });
export const IdealJson = z.object({ type: z.literal("Ideal"), text, gens: z.array(z.string()), ...ringRef });
export const MatrixJson = z.object({
  type: z.literal("Matrix"),
  text,
  rows: z.array(z.array(z.string())),
  /// an addition: keeps the shape of a matrix with no rows
  cols: count,
  ...ringRef,
});
export const ModuleJson = z.object({
  type: z.literal("Module"),
  text,
  /// §9 allows null; Ringside always writes a presentation (and cannot restore a module without one)
  presentation: MatrixJson.nullable(),
  /// an addition: the degrees of the generators, one per row of the presentation
  degrees: z.array(z.number().int()),
  ...ringRef,
});
const BettiEntries = z.array(z.tuple([count, z.number().int(), z.number().int().positive()]));
export const BettiTableJson = z.object({
  type: z.literal("BettiTable"),
  text,
  entries: BettiEntries,
  complete: z.boolean(),
  note: z.string().optional(),
});
export const ComplexJson = z.object({
  type: z.literal("Complex"),
  text,
  ranks: z.array(count),
  betti: BettiEntries,
  complete: z.boolean(),
  /// an addition: the differentials, when known
  maps: z.array(MatrixJson).nullable(),
  /// an addition: which ranks a bound cut, when incomplete
  note: z.string().optional(),
  ...ringRef,
});
export const HilbertSeriesJson = z.object({
  type: z.literal("HilbertSeries"),
  text,
  numerator: z.array(intText),
  denominator: z.string(),
  /// additions: the power of t of the numerator's first coefficient when it is negative (a
  /// module generated in negative degrees), and what the series is of when that could mislead
  lowest: z.number().int().max(-1).optional(),
  note: z.string().optional(),
});
export const SeriesJson = z.object({
  type: z.literal("Series"),
  text,
  coefficients: z.array(intText),
  rational: z.string().nullable(),
  /// additions: `guessed: true` whenever `rational` is set (it is a guess, not a proof), the
  /// guessed numerator and denominator (ascending in t), the number of computed terms it
  /// reproduces beyond those the fit used, and how many leading coefficients are exact
  guessed: z.literal(true).optional(),
  numerator: z.array(intText).optional(),
  denominator: z.array(intText).optional(),
  checked: count.optional(),
  exact: count.optional(),
});
export const NoneJson = z.object({ type: z.literal("None"), text });

export const SpanJson = z.object({
  from: z.object({ line: z.number().int().positive(), col: z.number().int().positive() }),
  to: z.object({ line: z.number().int().positive(), col: z.number().int().positive() }),
});
export type SpanJson = z.infer<typeof SpanJson>;
export const ErrorKind = z.enum(["parse", "type", "runtime", "limit", "cancelled"]);
export type ErrorKind = z.infer<typeof ErrorKind>;
export const ErrorJson = z.object({ type: z.literal("Error"), text, kind: ErrorKind, message: z.string(), span: SpanJson });
export type ErrorJson = z.infer<typeof ErrorJson>;

/// notation.md §11: a sweep running as a background experiment — "id", "status", "done",
/// "total", "failures" (the counts when the value was made; the experiment's own routes give
/// them live).
export const ExperimentJson = z.object({
  type: z.literal("Experiment"),
  text,
  id: z.string().uuid(),
  status: z.enum(["queued", "running", "paused", "done", "cancelled"]),
  done: count,
  total: count,
  failures: count,
});

type Leaf =
  | z.infer<typeof IntJson>
  | z.infer<typeof RatJson>
  | z.infer<typeof BoolJson>
  | z.infer<typeof StrJson>
  | z.infer<typeof FieldJson>
  | RingJson
  | z.infer<typeof PolyJson>
  | z.infer<typeof IdealJson>
  | z.infer<typeof MatrixJson>
  | z.infer<typeof ModuleJson>
  | z.infer<typeof ComplexJson>
  | z.infer<typeof BettiTableJson>
  | z.infer<typeof HilbertSeriesJson>
  | z.infer<typeof SeriesJson>
  | z.infer<typeof ExperimentJson>
  | z.infer<typeof NoneJson>;

export interface ListJson {
  type: "List";
  text: string;
  items: ValueJson[];
}
/// `fieldOrder` lists the field names as the user wrote them: a JSON object's key order
/// does not survive storage (PostgreSQL's jsonb sorts keys), so it is kept beside the fields.
export interface RecordJson {
  type: "Record";
  text: string;
  fields: Record<string, ValueJson>;
  fieldOrder?: string[];
}
export interface TableJson {
  type: "Table";
  text: string;
  columns: string[];
  rows: ValueJson[][];
}
/// Functions carry their source, parameters, the values of the names they captured and
/// the ring their literals are read in, so a later cell can rebuild the closure.
export interface FunctionJson {
  type: "Function";
  text: string;
  params: string[];
  captures: Record<string, ValueJson>;
  ring: RingJson | null;
}
/// notation.md §11: "length", "members", "definition"; plus the recipe (generator,
/// options) and the ring. Every member is encoded (rings, ideals or modules).
export interface FamilyJson {
  type: "Family";
  text: string;
  length?: number;
  definition?: string;
  generator: string;
  options: Record<string, string>;
  members: ValueJson[];
  ring: RingJson | null;
}
export type ValueJson = Leaf | ListJson | RecordJson | TableJson | FunctionJson | FamilyJson;

const lazyValue = z.lazy((): z.ZodType<ValueJson> => ValueJson);
export const ListJson: z.ZodType<ListJson> = z.object({ type: z.literal("List"), text, items: z.array(lazyValue) });
export const RecordJson: z.ZodType<RecordJson> = z.object({
  type: z.literal("Record"),
  text,
  fields: z.record(z.string(), lazyValue),
  fieldOrder: z.array(z.string()).optional(),
});
export const TableJson: z.ZodType<TableJson> = z.object({
  type: z.literal("Table"),
  text,
  columns: z.array(z.string()),
  rows: z.array(z.array(lazyValue)),
});
export const FunctionJson: z.ZodType<FunctionJson> = z.object({
  type: z.literal("Function"),
  text,
  params: z.array(z.string()),
  captures: z.record(z.string(), lazyValue),
  ring: RingJson.nullable(),
});
export const FamilyJson: z.ZodType<FamilyJson> = z.object({
  type: z.literal("Family"),
  text,
  length: z.number().int().nonnegative().optional(),
  definition: z.string().optional(),
  generator: z.string(),
  options: z.record(z.string(), intText),
  members: z.array(lazyValue),
  ring: RingJson.nullable(),
});

const byType = {
  Int: IntJson,
  Rat: RatJson,
  Bool: BoolJson,
  Str: StrJson,
  Field: FieldJson,
  Ring: RingJson,
  Poly: PolyJson,
  Ideal: IdealJson,
  Matrix: MatrixJson,
  Module: ModuleJson,
  Complex: ComplexJson,
  BettiTable: BettiTableJson,
  HilbertSeries: HilbertSeriesJson,
  Series: SeriesJson,
  List: ListJson,
  Record: RecordJson,
  Table: TableJson,
  Function: FunctionJson,
  Family: FamilyJson,
  Experiment: ExperimentJson,
  None: NoneJson,
} as const;
/// The schema of each value type's encoding, by type name.
export const ValueJsonSchemas: { readonly [K in ValueJson["type"]]: z.ZodType<Extract<ValueJson, { type: K }>> } = byType;

const typeNames = Object.keys(byType).join(", ");
function hasKnownType(v: unknown): v is { type: ValueJson["type"] } {
  if (typeof v !== "object" || v === null) return false;
  const t = (v as { type?: unknown }).type;
  return typeof t === "string" && Object.hasOwn(byType, t);
}

/// Any value's encoding: dispatches on "type" to that type's schema.
export const ValueJson: z.ZodType<ValueJson> = z
  .custom<ValueJson>(hasKnownType, { message: `expected an object whose "type" is one of ${typeNames}` })
  .superRefine((v, ctx) => {
    const r = byType[v.type].safeParse(v);
    if (!r.success) for (const issue of r.error.issues) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
  });
