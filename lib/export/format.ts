/// Ringside's own JSON export of a session ("ringside.session", version 1; README.md in
/// this folder documents it) and its zod schema, used by POST /api/sessions/import.
import { z } from "zod";

export const EXPORT_FORMAT = "ringside.session";
export const EXPORT_VERSION = 1;

/// Limits an import enforces besides the request size limit.
export const IMPORT_LIMITS = { cells: 2000, objects: 2000, sourceChars: 100_000 } as const;

const point = z.object({ line: z.number().int().positive(), col: z.number().int().positive() });
const span = z.object({ from: point, to: point });

/// A §9 value: checked for its outer shape here ("type" and "text"); the evaluator decodes
/// it fully when a cell uses it.
export const ExportedValue = z
  .object({ type: z.string().regex(/^[A-Z][A-Za-z]*$/, "a §9 type name such as Ideal"), text: z.string() })
  .passthrough();

export const ExportedCell = z
  .object({
    position: z.number().int().nonnegative(),
    source: z.string().max(IMPORT_LIMITS.sourceChars),
    status: z.enum(["done", "error", "cancelled", "interrupted"]),
    results: z.array(z.object({ statement: z.number().int().nonnegative(), span: span.nullable(), value: ExportedValue }).strict()),
    error: z
      .object({ type: z.literal("Error"), kind: z.string(), message: z.string(), span: span.optional() })
      .passthrough()
      .nullable(),
    currentRing: z.string().nullable(),
    durationMs: z.number().int().nonnegative().nullable(),
    engineVersion: z.string().nullable(),
  })
  .strict();

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

export const ExportedObject = z
  .object({
    name: z.string().regex(NAME, "a name starts with a letter and continues with letters, digits, _ or '").max(64),
    type: z.string().min(1).max(64),
    value: ExportedValue,
    source: z.string().max(IMPORT_LIMITS.sourceChars),
    /// position of the cell that bound it, or null
    cell: z.number().int().nonnegative().nullable(),
    origin: z.record(z.string(), z.unknown()).nullable(),
  })
  .strict();

export const SessionExport = z
  .object({
    format: z.literal(EXPORT_FORMAT),
    version: z.literal(EXPORT_VERSION),
    exportedAt: z.string().datetime({ offset: true }),
    session: z.object({ title: z.string().trim().min(1).max(200), ownerName: z.string().max(200) }).strict(),
    cells: z.array(ExportedCell).max(IMPORT_LIMITS.cells),
    objects: z.array(ExportedObject).max(IMPORT_LIMITS.objects),
  })
  .strict()
  .superRefine((doc, ctx) => {
    const positions = new Set<number>();
    doc.cells.forEach((c, i) => {
      if (positions.has(c.position)) ctx.addIssue({ code: "custom", path: ["cells", i, "position"], message: "two cells share this position" });
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
  z.object({ title: z.string().trim().min(1).max(200).optional(), export: SessionExport }).strict(),
]);
export type ImportBody = z.infer<typeof ImportBody>;
