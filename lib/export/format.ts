/// Ringside's own JSON export of a session ("ringside.session", version 1; README.md in
/// this folder documents it) and its zod schema, used by POST /api/sessions/import.
import { z } from "zod";
import { INT4_MAX } from "@/lib/http/json-guard";
import { atMost, limitValue } from "@/lib/limits";
import { optionalTitle } from "@/lib/wire/experiments";

export const EXPORT_FORMAT = "ringside.session";
export const EXPORT_VERSION = 1;

/// Limits an import enforces besides the request size limit (`sessionImportBytes`): rows of
/// lib/limits.ts; a source is bounded as a cell's is (`cellSourceBytes`, counted in characters
/// as the cells route counts it).
export const IMPORT_LIMITS = {
  cells: limitValue("importCells"),
  objects: limitValue("importObjects"),
  sourceChars: limitValue("cellSourceBytes"),
} as const;

const holdsAtMost = (n: number, what: string, name: string) => `holds more than ${n} ${what} (limit ${name})`;

// Integers stored in PostgreSQL `integer` columns or compared with them stay within int4.
const int4 = () =>
  z
    .number()
    .int()
    .nonnegative()
    .max(INT4_MAX, { message: `is larger than ${INT4_MAX}` });
const point = z.object({ line: int4().positive(), col: int4().positive() });
const span = z.object({ from: point, to: point });

/// A §9 value: checked for its outer shape here ("type" and "text"); the evaluator decodes
/// it fully when a cell uses it.
export const ExportedValue = z
  .object({ type: z.string().regex(/^[A-Z][A-Za-z]*$/, "a §9 type name such as Ideal"), text: z.string() })
  .passthrough();

export const ExportedCell = z
  .object({
    position: int4(),
    source: z.string().max(IMPORT_LIMITS.sourceChars, holdsAtMost(IMPORT_LIMITS.sourceChars, "characters", "cellSourceBytes")),
    status: z.enum(["done", "error", "cancelled", "interrupted"]),
    results: z.array(z.object({ statement: int4(), span: span.nullable(), value: ExportedValue }).strict()),
    error: z
      .object({ type: z.literal("Error"), kind: z.string(), message: z.string(), span: span.optional() })
      .passthrough()
      .nullable(),
    currentRing: z.string().nullable(),
    durationMs: int4().nullable(),
    engineVersion: z.string().nullable(),
  })
  .strict();

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

export const ExportedObject = z
  .object({
    name: z
      .string()
      .regex(NAME, "a name starts with a letter and continues with letters, digits, _ or '")
      .max(...atMost("objectNameChars")),
    type: z.string().min(1).max(64),
    value: ExportedValue,
    source: z.string().max(IMPORT_LIMITS.sourceChars, holdsAtMost(IMPORT_LIMITS.sourceChars, "characters", "cellSourceBytes")),
    /// position of the cell that bound it, or null
    cell: int4().nullable(),
    origin: z.record(z.string(), z.unknown()).nullable(),
  })
  .strict();

export const SessionExport = z
  .object({
    format: z.literal(EXPORT_FORMAT),
    version: z.literal(EXPORT_VERSION),
    exportedAt: z.string().datetime({ offset: true }),
    session: z
      .object({
        title: z
          .string()
          .trim()
          .min(1)
          .max(...atMost("titleChars")),
        ownerName: z.string().max(200),
      })
      .strict(),
    cells: z.array(ExportedCell).max(IMPORT_LIMITS.cells, holdsAtMost(IMPORT_LIMITS.cells, "cells", "importCells")),
    objects: z.array(ExportedObject).max(IMPORT_LIMITS.objects, holdsAtMost(IMPORT_LIMITS.objects, "objects", "importObjects")),
  })
  .strict()
  .superRefine((doc, ctx) => {
    const positions = new Set<number>();
    doc.cells.forEach((c, i) => {
      if (positions.has(c.position))
        ctx.addIssue({ code: "custom", path: ["cells", i, "position"], message: "two cells share this position" });
      positions.add(c.position);
    });
    const names = new Set<string>();
    doc.objects.forEach((o, i) => {
      if (names.has(o.name)) ctx.addIssue({ code: "custom", path: ["objects", i, "name"], message: `two objects are named ${o.name}` });
      names.add(o.name);
      if (o.cell !== null && !positions.has(o.cell)) {
        ctx.addIssue({ code: "custom", path: ["objects", i, "cell"], message: "no cell has this position" });
      }
    });
  });
export type SessionExport = z.infer<typeof SessionExport>;

/// The body of POST /api/sessions/import: the export itself, or `{title?, export}` to give
/// the new session another title.
export const ImportBody = z.union([
  SessionExport,
  z
    .object({
      title: optionalTitle,
      export: SessionExport,
    })
    .strict(),
]);
export type ImportBody = z.infer<typeof ImportBody>;
